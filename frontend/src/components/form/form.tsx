import { Alert, Button, HStack, Stack } from '@chakra-ui/react';
import { Formik, Form as FormikForm, type FormikHelpers, type FormikValues } from 'formik';
import type { ReactNode } from 'react';
import type { AnyObjectSchema } from 'yup';
import { toFormErrors } from './form-errors';

export interface FormProps<Values extends FormikValues> {
  initialValues: Values;
  /** A Yup object schema; values reach `onSubmit` cast by it (trimmed strings and so on). */
  validationSchema?: AnyObjectSchema;
  /** Throw (or return a rejected promise) to show the server's answer: 422 field errors land on their fields. */
  onSubmit: (values: Values, helpers: FormikHelpers<Values>) => Promise<unknown> | unknown;
  submitLabel: string;
  children: ReactNode;
  /** Rendered before the submit button, e.g. a Cancel button in a dialog. */
  secondaryAction?: ReactNode;
  resetOnSuccess?: boolean;
  submitFullWidth?: boolean;
  /** A red submit button, for what cannot be taken back. */
  destructive?: boolean;
  id?: string;
}

export function Form<Values extends FormikValues>({
  initialValues,
  validationSchema,
  onSubmit,
  submitLabel,
  children,
  secondaryAction,
  resetOnSuccess = false,
  submitFullWidth = false,
  destructive = false,
  id,
}: FormProps<Values>) {
  const handleSubmit = async (values: Values, helpers: FormikHelpers<Values>) => {
    helpers.setStatus(undefined);
    const submitted = (validationSchema ? validationSchema.cast(values) : values) as Values;
    try {
      await onSubmit(submitted, helpers);
      if (resetOnSuccess) helpers.resetForm();
    } catch (error) {
      const { fieldErrors, formError } = toFormErrors(error, Object.keys(initialValues));
      helpers.setErrors(fieldErrors as Parameters<typeof helpers.setErrors>[0]);
      helpers.setStatus(formError);
    }
  };

  return (
    <Formik initialValues={initialValues} validationSchema={validationSchema} onSubmit={handleSubmit}>
      {({ isSubmitting, status }) => (
        <FormikForm id={id} noValidate>
          <Stack gap="5">
            {typeof status === 'string' && (
              <Alert.Root status="error" role="alert">
                <Alert.Indicator />
                <Alert.Content>
                  <Alert.Description>{status}</Alert.Description>
                </Alert.Content>
              </Alert.Root>
            )}
            {children}
            <HStack justify="flex-end" gap="3" pt="1">
              {secondaryAction}
              <Button
                type="submit"
                loading={isSubmitting}
                width={submitFullWidth ? 'full' : undefined}
                colorPalette={destructive ? 'red' : undefined}
              >
                {submitLabel}
              </Button>
            </HStack>
          </Stack>
        </FormikForm>
      )}
    </Formik>
  );
}
