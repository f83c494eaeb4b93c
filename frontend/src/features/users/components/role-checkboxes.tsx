import { Checkbox, CheckboxGroup, Stack, Text } from '@chakra-ui/react';
import { ALL_ROLES, Role, ROLE_LABELS } from '@meritline/shared';
import { useId } from 'react';
import { FormField } from '@/components/form/form-field';

const ROLE_HINTS: Record<Role, string> = {
  [Role.Analyst]: 'Runs validation studies and routine batches.',
  [Role.Reviewer]: 'Checks and signs the work of others.',
  [Role.QualityManager]: 'Owns methods, criteria and released versions.',
  [Role.Admin]: 'Manages accounts and roles.',
};

export interface RoleCheckboxesProps {
  value: readonly string[];
  onChange: (roles: Role[]) => void;
  onBlur?: () => void;
}

export function RoleCheckboxes({ value, onChange, onBlur }: RoleCheckboxesProps) {
  // Inside a form field every checkbox would take the field's one input id, so a click on any label toggles the first.
  const idPrefix = useId();
  return (
    <CheckboxGroup value={[...value]} onValueChange={(roles) => onChange(roles as Role[])} onBlur={onBlur}>
      <Stack gap="3">
        {ALL_ROLES.map((role) => (
          <Checkbox.Root
            key={role}
            value={role}
            alignItems="flex-start"
            ids={{ hiddenInput: `${idPrefix}-${role}-input`, label: `${idPrefix}-${role}-label` }}
          >
            <Checkbox.HiddenInput />
            <Checkbox.Control mt="0.5" />
            <Checkbox.Label>
              <Text as="span" display="block" fontWeight="500">
                {ROLE_LABELS[role]}
              </Text>
              <Text as="span" display="block" fontSize="sm" color="fg.muted" fontWeight="400">
                {ROLE_HINTS[role]}
              </Text>
            </Checkbox.Label>
          </Checkbox.Root>
        ))}
      </Stack>
    </CheckboxGroup>
  );
}

/** The roles of an account as a field of the Form wrapper. */
export function RolesField() {
  return (
    <FormField name="roles" label="Roles" required>
      {(field, helpers) => (
        <RoleCheckboxes
          value={field.value as string[]}
          onChange={(roles) => void helpers.setValue(roles)}
          onBlur={() => void helpers.setTouched(true)}
        />
      )}
    </FormField>
  );
}
