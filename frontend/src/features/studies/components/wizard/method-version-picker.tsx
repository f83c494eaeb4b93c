import { Badge, Box, HStack, Link, RadioGroup, Stack, Text } from '@chakra-ui/react';
import type { MethodVersionStatus, MethodDto } from '@meritline/shared';
import { Link as RouterLink } from 'react-router';
import { paths } from '@/lib/config/paths';
import { SelectControl } from '@/components/select-control';

const VERSION_WORDS: Record<MethodVersionStatus, { label: string; note: string; palette: string }> = {
  active: { label: 'Active', note: 'In force for routine work.', palette: 'brand' },
  draft: { label: 'Draft', note: 'Not yet active: its criteria may still change before it is.', palette: 'accent' },
  retired: { label: 'Retired', note: 'Kept for the record; new studies cannot use it.', palette: 'gray' },
};

export const selectableVersion = (status: MethodVersionStatus) => status === 'draft' || status === 'active';

/** The version a new study should start on: the active one, else the newest draft. */
export function defaultVersion(method: MethodDto | undefined): string {
  const versions = [...(method?.versions ?? [])].sort((a, b) => b.number - a.number);
  return (versions.find((v) => v.status === 'active') ?? versions.find((v) => v.status === 'draft'))?.id ?? '';
}

export function MethodSelect({
  methods,
  value,
  onChange,
  invalid,
}: {
  methods: readonly MethodDto[];
  value: string;
  onChange: (methodId: string) => void;
  invalid?: boolean;
}) {
  return (
    <SelectControl
      aria-label="Method"
      invalid={invalid}
      value={value}
      onChange={onChange}
      placeholder="Choose a method…"
      options={methods.map((m) => ({ value: m.id, label: m.name }))}
    />
  );
}

export function VersionPicker({
  method,
  value,
  onChange,
}: {
  method: MethodDto | undefined;
  value: string;
  onChange: (versionId: string) => void;
}) {
  if (!method) return <Text color="fg.muted">Choose a method first.</Text>;
  const versions = [...method.versions].sort((a, b) => b.number - a.number);
  return (
    <Stack gap="3">
      <RadioGroup.Root value={value} onValueChange={(e) => onChange(e.value ?? '')} aria-label="Version of the method">
        <Stack gap="2">
          {versions.map((v) => {
            const words = VERSION_WORDS[v.status];
            const disabled = !selectableVersion(v.status);
            return (
              <RadioGroup.Item
                key={v.id}
                value={v.id}
                disabled={disabled}
                alignItems="flex-start"
                borderWidth="1px"
                borderColor={value === v.id ? 'brand.solid' : 'border'}
                borderRadius="l2"
                p="3"
                opacity={disabled ? 0.7 : 1}
              >
                <RadioGroup.ItemHiddenInput />
                <RadioGroup.ItemIndicator mt="0.5" />
                <RadioGroup.ItemText flex="1">
                  <HStack gap="2">
                    <Text as="span" fontWeight="600">
                      Version {v.number}
                    </Text>
                    <Badge colorPalette={words.palette} variant={v.status === 'active' ? 'solid' : 'subtle'}>
                      {words.label}
                    </Badge>
                    <Text as="span" fontSize="sm" color="fg.muted">
                      {v.criteria.length} acceptance criteri{v.criteria.length === 1 ? 'on' : 'a'}
                    </Text>
                  </HStack>
                  <Box as="span" display="block" fontSize="sm" color={disabled ? 'fg.muted' : 'fg'} mt="1">
                    {disabled ? `Not selectable: ${words.note.toLowerCase()}` : words.note}{' '}
                    {v.changeSummary && (
                      <Text as="span" color="fg.muted">
                        {v.changeSummary}
                      </Text>
                    )}
                  </Box>
                </RadioGroup.ItemText>
              </RadioGroup.Item>
            );
          })}
        </Stack>
      </RadioGroup.Root>
      <Text fontSize="sm" color="fg.muted">
        Criteria and versions are kept on the{' '}
        <Link asChild color="brand.fg">
          <RouterLink to={paths.methodDetail.getHref(method.id)}>page of the method</RouterLink>
        </Link>
        .
      </Text>
    </Stack>
  );
}
