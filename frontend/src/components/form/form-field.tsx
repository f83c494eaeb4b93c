import { Field, Input } from '@chakra-ui/react';
import { useField, useFormikContext, type FieldHelperProps, type FieldInputProps } from 'formik';
import type { ReactNode } from 'react';

export interface FormFieldProps {
  name: string;
  label: ReactNode;
  helperText?: ReactNode;
  required?: boolean;
  type?: 'text' | 'email' | 'password' | 'number' | 'url';
  autoComplete?: string;
  placeholder?: string;
  /** A custom control instead of the text input; it receives Formik's value and setters for this field. */
  children?: (field: FieldInputProps<unknown>, helpers: FieldHelperProps<unknown>) => ReactNode;
}

export function FormField({ name, label, helperText, required, type = 'text', autoComplete, placeholder, children }: FormFieldProps) {
  const [field, meta, helpers] = useField<unknown>(name);
  const { submitCount } = useFormikContext();
  const error = typeof meta.error === 'string' ? meta.error : undefined;
  const invalid = Boolean(error) && (meta.touched || submitCount > 0);

  return (
    <Field.Root invalid={invalid} required={required}>
      <Field.Label>
        {label}
        {required && <Field.RequiredIndicator />}
      </Field.Label>
      {children ? (
        children(field, helpers)
      ) : (
        <Input
          {...field}
          value={(field.value as string | number | undefined) ?? ''}
          type={type}
          autoComplete={autoComplete}
          placeholder={placeholder}
        />
      )}
      {helperText && !invalid && <Field.HelperText>{helperText}</Field.HelperText>}
      {invalid && <Field.ErrorText>{error}</Field.ErrorText>}
    </Field.Root>
  );
}
