import { Alert, Button, CloseButton, Dialog, Portal, Stack, Text, Textarea } from '@chakra-ui/react';
import { useState } from 'react';
import * as yup from 'yup';
import { Form } from '@/components/form/form';
import { FormField } from '@/components/form/form-field';

export interface SignatureValues {
  password: string;
  comment: string;
}

export interface SignatureDialogProps {
  title: string;
  /** What the signature means, in words, shown above the password. */
  meaning: string;
  triggerLabel: string;
  submitLabel: string;
  /** Shown when a comment is asked for; `commentRequired` makes it mandatory (e.g. when returning work). */
  commentLabel?: string;
  commentRequired?: boolean;
  /** Shortest comment accepted, e.g. for a written assessment. */
  commentMinLength?: number;
  triggerVariant?: 'solid' | 'outline';
  /** Throw to keep the dialog open and show the server's answer. */
  onSign: (values: SignatureValues) => Promise<unknown>;
}

const initialValues: SignatureValues = { password: '', comment: '' };

/** An electronic signature: the meaning in words and the password re-entered. */
export function SignatureDialog({
  title,
  meaning,
  triggerLabel,
  submitLabel,
  commentLabel,
  commentRequired = false,
  commentMinLength,
  triggerVariant = 'solid',
  onSign,
}: SignatureDialogProps) {
  const [open, setOpen] = useState(false);
  const limited = yup.string().trim().max(2000, 'Keep the comment under 2000 characters.');
  const comment = commentMinLength ? limited.min(commentMinLength, `Write at least ${commentMinLength} characters.`) : limited;
  const schema = yup.object({
    password: yup.string().required('Enter your password to sign.').max(200),
    comment: commentRequired ? comment.required('Say why.') : comment.default(''),
  });

  return (
    <Dialog.Root open={open} onOpenChange={(event) => setOpen(event.open)} size="md">
      <Dialog.Trigger asChild>
        <Button variant={triggerVariant}>{triggerLabel}</Button>
      </Dialog.Trigger>
      <Portal>
        <Dialog.Backdrop />
        <Dialog.Positioner>
          <Dialog.Content>
            <Dialog.Header>
              <Dialog.Title>{title}</Dialog.Title>
            </Dialog.Header>
            <Dialog.Body pb="6">
              <Stack gap="4" mb="5">
                <Alert.Root status="info" variant="subtle">
                  <Alert.Indicator />
                  <Alert.Content>
                    <Alert.Title>What your signature means</Alert.Title>
                    <Alert.Description>{meaning}</Alert.Description>
                  </Alert.Content>
                </Alert.Root>
                <Text fontSize="sm" color="fg.muted">
                  Your name, role, the time and a fingerprint of the data and results are recorded with the signature.
                </Text>
              </Stack>
              <Form
                initialValues={initialValues}
                validationSchema={schema}
                onSubmit={async (values) => {
                  await onSign(values);
                  setOpen(false);
                }}
                submitLabel={submitLabel}
                secondaryAction={
                  <Dialog.ActionTrigger asChild>
                    <Button variant="outline">Cancel</Button>
                  </Dialog.ActionTrigger>
                }
              >
                <FormField
                  name="password"
                  label="Your password"
                  type="password"
                  autoComplete="current-password"
                  required
                  helperText="Re-enter the password you sign in with."
                />
                {commentLabel && (
                  <FormField name="comment" label={commentLabel} required={commentRequired}>
                    {(field) => <Textarea {...field} value={(field.value as string) ?? ''} rows={3} />}
                  </FormField>
                )}
              </Form>
            </Dialog.Body>
            <Dialog.CloseTrigger asChild>
              <CloseButton size="sm" />
            </Dialog.CloseTrigger>
          </Dialog.Content>
        </Dialog.Positioner>
      </Portal>
    </Dialog.Root>
  );
}
