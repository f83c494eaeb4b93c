import { Alert, Button, Stack, Text } from '@chakra-ui/react';
import type { ReactNode } from 'react';
import * as yup from 'yup';
import { FormField } from '@/components/form/form-field';
import { TextareaField } from '@/components/form/textarea-field';
import { FormDialog } from './form-dialog';

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

/** What a signature means and what is recorded with it, above the password of every signing dialog. */
export function SignatureNotice({ meaning, recorded, children }: { meaning: string; recorded: ReactNode; children?: ReactNode }) {
  return (
    <Stack gap="4" mb="5">
      <Alert.Root status="info" variant="subtle">
        <Alert.Indicator />
        <Alert.Content>
          <Alert.Title>What your signature means</Alert.Title>
          <Alert.Description>{meaning}</Alert.Description>
        </Alert.Content>
      </Alert.Root>
      <Text fontSize="sm" color="fg.muted">
        {recorded}
      </Text>
      {children}
    </Stack>
  );
}

export function SignaturePasswordField() {
  return (
    <FormField
      name="password"
      label="Your password"
      type="password"
      autoComplete="current-password"
      required
      helperText="Re-enter the password you sign in with."
    />
  );
}

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
  const limited = yup.string().trim().max(2000, 'Keep the comment under 2000 characters.');
  const comment = commentMinLength ? limited.min(commentMinLength, `Write at least ${commentMinLength} characters.`) : limited;
  const schema = yup.object({
    password: yup.string().required('Enter your password to sign.').max(200),
    comment: commentRequired ? comment.required('Say why.') : comment.default(''),
  });

  return (
    <FormDialog
      trigger={<Button variant={triggerVariant}>{triggerLabel}</Button>}
      title={title}
      notice={
        <SignatureNotice
          meaning={meaning}
          recorded="Your name, role, the time and a fingerprint of the data and results are recorded with the signature."
        />
      }
      initialValues={initialValues}
      validationSchema={schema}
      onSubmit={onSign}
      submitLabel={submitLabel}
    >
      <SignaturePasswordField />
      {commentLabel && <TextareaField name="comment" label={commentLabel} required={commentRequired} />}
    </FormDialog>
  );
}
