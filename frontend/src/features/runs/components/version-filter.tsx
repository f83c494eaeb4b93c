import type { RunMethodChoiceDto } from '@meritline/shared';
import { Field, NativeSelect } from '@chakra-ui/react';

export interface VersionSelectProps {
  methods: readonly RunMethodChoiceDto[];
  /** A method id, a version id, or '' for everything. */
  value: string;
  onChange: (value: string) => void;
  /** Whether whole methods (all their versions) can be chosen, as in a filter. */
  allowMethods?: boolean;
  /** Whether versions that cannot take new runs are shown, as in a filter of past runs. */
  includeUnusable?: boolean;
  emptyLabel?: string;
}

/** Methods and their versions in one list, for filtering runs or choosing where a new run goes. */
export function VersionSelect({
  methods,
  value,
  onChange,
  allowMethods = false,
  includeUnusable = true,
  emptyLabel = 'All methods',
}: VersionSelectProps) {
  return (
    <NativeSelect.Root>
      <NativeSelect.Field value={value} onChange={(event) => onChange(event.currentTarget.value)}>
        <option value="">{emptyLabel}</option>
        {methods.map((method) => (
          <optgroup key={method.id} label={method.name}>
            {allowMethods && <option value={`method:${method.id}`}>{method.name}: every version</option>}
            {method.versions
              .filter((v) => includeUnusable || v.usable)
              .map((v) => (
                <option key={v.id} value={v.id}>
                  {method.name}, version {v.number} ({v.status}
                  {v.status === 'active' && !v.usable ? ', not validated' : ''})
                </option>
              ))}
          </optgroup>
        ))}
      </NativeSelect.Field>
      <NativeSelect.Indicator />
    </NativeSelect.Root>
  );
}

export function VersionFilter({ label, ...props }: VersionSelectProps & { label: string }) {
  return (
    <Field.Root maxW="md">
      <Field.Label>{label}</Field.Label>
      <VersionSelect {...props} />
    </Field.Root>
  );
}
