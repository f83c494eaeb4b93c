import { isApiError } from '@/lib/api-client';

export interface FormErrors {
  /** One message per form field, keyed by the top-level field name, ready for Formik `setErrors`. */
  fieldErrors: Record<string, string>;
  /** What the form shows above its buttons: messages that belong to no field of this form. */
  formError?: string;
}

const topLevelName = (field: string) => field.split(/[.[]/)[0] ?? field;

export function toFormErrors(error: unknown, fieldNames: readonly string[]): FormErrors {
  if (!isApiError(error)) {
    return { fieldErrors: {}, formError: 'Something went wrong in the browser. Reload the page and try again.' };
  }
  const fieldErrors: Record<string, string> = {};
  const unplaced: string[] = [];
  for (const { field, message } of error.body.errors ?? []) {
    const name = topLevelName(field);
    if (fieldNames.includes(name)) fieldErrors[name] ??= message;
    else unplaced.push(message);
  }
  const placedAny = Object.keys(fieldErrors).length > 0;
  if (!placedAny) return { fieldErrors, formError: unplaced.length > 0 ? unplaced.join(' ') : error.body.message };
  return { fieldErrors, formError: unplaced.length > 0 ? unplaced.join(' ') : undefined };
}
