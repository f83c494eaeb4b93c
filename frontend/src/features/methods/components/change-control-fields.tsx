import { Checkbox, Fieldset, SimpleGrid, Stack } from '@chakra-ui/react';
import {
  METHOD_CHANGE_KIND_LABELS,
  METHOD_CHANGE_KINDS,
  REVALIDATION_FAMILIES,
  REVALIDATION_FAMILY_LABELS,
  type RevalidationFamily,
} from '@meritline/shared';
import { useField } from 'formik';
import { useId } from 'react';
import { FormField } from '@/components/form/form-field';
import { SelectField } from '@/components/form/select-field';

/** Kind of change and the families of figures a study must show again before the version is activated. */
export function ChangeControlFields({ recordsChange }: { recordsChange: boolean }) {
  const [scope, , scopeHelpers] = useField<RevalidationFamily[]>('revalidationScope');
  const baseId = useId();
  const selected = scope.value ?? [];
  const toggle = (family: RevalidationFamily, checked: boolean) =>
    void scopeHelpers.setValue(REVALIDATION_FAMILIES.filter((f) => (f === family ? checked : selected.includes(f))));

  return (
    <Stack gap="4">
      {recordsChange && (
        <>
          <SelectField
            name="changeKind"
            label="Kind of change"
            required
            options={METHOD_CHANGE_KINDS.map((kind) => ({ value: kind, label: METHOD_CHANGE_KIND_LABELS[kind] }))}
          />
          <Fieldset.Root>
            <Fieldset.Legend>Figures to show again before activation</Fieldset.Legend>
            <Fieldset.HelperText>
              An approved study of this version must hold these sections; otherwise only a quality manager can activate it, with a signed
              justification.
            </Fieldset.HelperText>
            <SimpleGrid columns={{ base: 2, md: 4 }} gap="2" mt="2">
              {REVALIDATION_FAMILIES.map((family) => (
                <Checkbox.Root
                  key={family}
                  ids={{ root: `${baseId}-${family}`, hiddenInput: `${baseId}-${family}-input`, label: `${baseId}-${family}-label` }}
                  checked={selected.includes(family)}
                  onCheckedChange={(e) => toggle(family, e.checked === true)}
                >
                  <Checkbox.HiddenInput />
                  <Checkbox.Control />
                  <Checkbox.Label fontWeight="400">{REVALIDATION_FAMILY_LABELS[family]}</Checkbox.Label>
                </Checkbox.Root>
              ))}
            </SimpleGrid>
          </Fieldset.Root>
        </>
      )}
      <FormField
        name="recoveryEquivalenceMarginPct"
        label="Recovery equivalence margin (percentage points)"
        type="number"
        helperText="Two versions' mean recoveries within this margin count as equivalent when versions are compared."
      />
    </Stack>
  );
}
