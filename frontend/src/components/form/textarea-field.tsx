import { Textarea } from '@chakra-ui/react';
import type { ReactNode } from 'react';
import { FormField } from './form-field';

export interface TextareaFieldProps {
  name: string;
  label: ReactNode;
  required?: boolean;
  helperText?: ReactNode;
  rows?: number;
  maxLength?: number;
  /** Grows with the text instead of scrolling. */
  autoresize?: boolean;
}

/** A multi-line text field of the Form wrapper: comments, reasons, justifications. */
export function TextareaField({ name, label, required, helperText, rows = 3, maxLength, autoresize }: TextareaFieldProps) {
  return (
    <FormField name={name} label={label} required={required} helperText={helperText}>
      {(field) => <Textarea {...field} value={String(field.value ?? '')} rows={rows} maxLength={maxLength} autoresize={autoresize} />}
    </FormField>
  );
}
