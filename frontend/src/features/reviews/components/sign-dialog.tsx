import { Alert, Button } from '@chakra-ui/react';
import { MIN_JUSTIFICATION_LENGTH } from '@meritline/shared';
import { useQuery } from '@tanstack/react-query';
import * as yup from 'yup';
import { FormDialog } from '@/components/form-dialog';
import { TextareaField } from '@/components/form/textarea-field';
import { SignatureNotice, SignaturePasswordField } from '@/components/signature-dialog';
import { toaster } from '@/components/ui/toaster';
import { studyReviewQueries } from '../api/review-queries';
import { signSchema, useSignStudy, type SignValues } from '../api/sign-study';
import { APPROVAL_CAUTION, FAILED_VERDICT_CAUTION } from './approval-caution';
import { OpenCommentList, openThreads } from './reviewer-remarks';
import { SIGNING_STEPS, type SignatureStepName } from './signing-steps';

export interface SignDialogProps {
  studyId: string;
  lockVersion: number;
  step: SignatureStepName;
  onSigned?: () => void;
}

const initialValues: SignValues = { password: '', comment: '', justification: '' };

const justifiedSignSchema = signSchema.shape({
  justification: yup
    .string()
    .trim()
    .required('Write why the study may be approved although it does not meet all its criteria.')
    .min(MIN_JUSTIFICATION_LENGTH, `Write at least ${MIN_JUSTIFICATION_LENGTH} characters.`)
    .max(4000, 'Keep the justification under 4000 characters.'),
});

/** An electronic signature: the meaning in words, the password re-entered, an optional comment. */
export function SignDialog({ studyId, lockVersion, step, onSigned }: SignDialogProps) {
  const { action, meaning, title, triggerLabel, submitLabel, successTitle } = SIGNING_STEPS[step];
  const sign = useSignStudy(studyId, action);
  // The study page has loaded the study already; read it from the cache rather than ask again.
  const study = useQuery({ ...studyReviewQueries.detail(studyId), enabled: false });
  const needsJustification = action === 'approve' && study.data?.result?.verdict.pass === false;
  const comments = useQuery({ ...studyReviewQueries.comments(studyId), enabled: action === 'approve' });
  const openComments = action === 'approve' ? openThreads(comments.data ?? []) : [];

  return (
    <FormDialog
      trigger={<Button>{triggerLabel}</Button>}
      title={title}
      notice={
        <SignatureNotice
          meaning={meaning}
          recorded={
            <>
              Your name, role, the time (UTC) and a fingerprint of the study’s data and results are recorded with the signature.
              {action === 'approve' && ` ${APPROVAL_CAUTION}`}
            </>
          }
        >
          {action === 'approve' && comments.data && (
            <Alert.Root status={openComments.length ? 'warning' : 'success'} variant="subtle" data-testid="open-comments-note">
              <Alert.Indicator />
              <Alert.Content minW="0">
                <Alert.Title>
                  {openComments.length === 0
                    ? 'No comment is open.'
                    : openComments.length === 1
                      ? 'One comment is still open.'
                      : `${openComments.length} comments are still open.`}
                </Alert.Title>
                {openComments.length > 0 && (
                  <Alert.Description>
                    <OpenCommentList comments={openComments} />
                  </Alert.Description>
                )}
              </Alert.Content>
            </Alert.Root>
          )}
          {needsJustification && (
            <Alert.Root status="warning" variant="subtle">
              <Alert.Indicator />
              <Alert.Content>
                <Alert.Title>This study does not meet all its acceptance criteria</Alert.Title>
                <Alert.Description>{FAILED_VERDICT_CAUTION}</Alert.Description>
              </Alert.Content>
            </Alert.Root>
          )}
        </SignatureNotice>
      }
      formKey={needsJustification ? 'justified' : 'plain'}
      initialValues={initialValues}
      validationSchema={needsJustification ? justifiedSignSchema : signSchema}
      onSubmit={async (values) => {
        const result = await sign.mutateAsync({ values, lockVersion });
        toaster.create({
          type: 'success',
          title: result.stage === 'release' ? 'Approved; now awaiting release by a quality manager' : successTitle,
        });
        onSigned?.();
      }}
      submitLabel={submitLabel}
    >
      <SignaturePasswordField />
      {needsJustification && (
        <TextareaField
          name="justification"
          label="Justification for approving although criteria are not met"
          required
          rows={4}
          helperText="Printed with your signature in the report and kept in the review history."
        />
      )}
      <TextareaField name="comment" label="Comment (optional)" />
    </FormDialog>
  );
}
