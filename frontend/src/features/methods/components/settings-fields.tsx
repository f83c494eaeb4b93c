import { Checkbox, SimpleGrid } from '@chakra-ui/react';
import { FormField } from '@/components/form/form-field';
import { SelectField } from '@/components/form/select-field';

const BETA_CHOICES = [
  { value: '0.8', label: '80 %' },
  { value: '0.95', label: '95 %' },
];

/** The settings of a method version that decide how its studies and routine batches are handled. */
export function SettingsFields() {
  return (
    <SimpleGrid columns={{ base: 1, md: 3 }} gap="4" alignItems="start">
      <FormField
        name="settings.checkTolerancePct"
        label="Check standard tolerance (± %)"
        type="number"
        helperText="Routine batches accept a check standard recovering within 100 ± this %."
      />
      <FormField
        name="settings.onePointMaxInterceptPct"
        label="One-point calibration allowed up to an intercept of (% of top response)"
        type="number"
        helperText="A single standard is allowed only when the intercept is this small."
      />
      <FormField name="settings.requiresQualityRelease" label="Release">
        {(field, helpers) => (
          <Checkbox.Root
            checked={Boolean(field.value)}
            onCheckedChange={(e) => void helpers.setValue(e.checked === true)}
            alignItems="flex-start"
          >
            <Checkbox.HiddenInput />
            <Checkbox.Control mt="0.5" />
            <Checkbox.Label fontWeight="400">A quality manager releases each study after the reviewer approves it</Checkbox.Label>
          </Checkbox.Root>
        )}
      </FormField>
      <SelectField
        name="settings.accuracyBeta"
        label="Accuracy profile: β"
        helperText="Expected proportion of results inside the tolerance limits; a study may choose its own."
        options={BETA_CHOICES}
      />
      <FormField
        name="settings.accuracyLambdaPct"
        label="Accuracy profile: acceptance limits (± %)"
        type="number"
        helperText="The largest total error a result may show inside the validity domain."
      />
      <FormField
        name="settings.coverageFactor"
        label="Coverage factor k of the expanded uncertainty"
        type="number"
        helperText="U = k · uc; 2 gives about 95 % coverage."
      />
    </SimpleGrid>
  );
}
