import { MIN_JUSTIFICATION_LENGTH, type VersionComparisonResponse } from '@meritline/shared';
import { SignatureDialog } from '@/components/signature-dialog';
import { useAssessVersion } from '../../api/assess-version';

/** The quality manager's e-signature on the comparison: a signed PDF kept against the later version. */
export function AssessmentAction({ comparison, lockVersion }: { comparison: VersionComparisonResponse; lockVersion: number }) {
  const assess = useAssessVersion();
  const { from, to, method } = comparison;
  return (
    <SignatureDialog
      title={`Sign the change assessment of version ${to.number}`}
      meaning={`Change assessed: you have compared version ${to.number} of ${method.name} with version ${from.number} and record your assessment. The signed report is kept against version ${to.number} and can be checked on the verify page.`}
      triggerLabel="Sign the change assessment"
      submitLabel="Sign and download"
      commentLabel="Your assessment"
      commentRequired
      commentMinLength={MIN_JUSTIFICATION_LENGTH}
      onSign={({ password, comment }) =>
        assess.mutateAsync({
          versionId: to.versionId,
          compareWith: from.versionId,
          lockVersion,
          statement: comment,
          password,
          fileName: `meritline-change-assessment-v${to.number}-against-v${from.number}.pdf`,
        })
      }
    />
  );
}
