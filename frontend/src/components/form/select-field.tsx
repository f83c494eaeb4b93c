import { SelectControl, type SelectControlProps } from '../select-control';
import { FormField, type FormFieldProps } from './form-field';

export interface SelectFieldProps
  extends
    Pick<FormFieldProps, 'name' | 'label' | 'helperText' | 'required'>,
    Pick<SelectControlProps, 'options' | 'placeholder' | 'disabled'> {}

/** A form field choosing one of a few values from a drop-down list. */
export function SelectField({ name, label, helperText, required, ...select }: SelectFieldProps) {
  return (
    <FormField name={name} label={label} helperText={helperText} required={required}>
      {(field, helpers) => (
        <SelectControl
          {...select}
          name={field.name}
          value={String(field.value ?? '')}
          onChange={(value) => void helpers.setValue(value)}
          onBlur={field.onBlur}
        />
      )}
    </FormField>
  );
}
