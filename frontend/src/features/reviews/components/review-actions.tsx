import { Button, HStack } from '@chakra-ui/react';
import { hasAnyRole, Role, type CurrentUser } from '@meritline/shared';
import { Link as RouterLink, useNavigate } from 'react-router';
import { ReportDownloadButton } from '@/components/report-download-button';
import { toaster } from '@/components/ui/toaster';
import { paths } from '@/lib/config/paths';
import { useCopyStudy } from '../api/copy-study';
import type { Signature, StudyView } from '../api/review-types';
import { ReturnDialog } from './return-dialog';
import { SignDialog } from './sign-dialog';
import { ReassignDialog } from './reassign-dialog';
import { submitStep } from './signing-steps';

interface ReviewActionsProps {
  study: StudyView;
  signatures: readonly Signature[];
  user: CurrentUser;
}

/** The actions this user may take on this study now; the server enforces the same rules. */
export function ReviewActions({ study, signatures, user }: ReviewActionsProps) {
  const navigate = useNavigate();
  const copy = useCopyStudy(study.id);
  const isAuthor = study.author.id === user.id;
  const involved = isAuthor || study.editorIds.includes(user.id);
  const round = signatures.slice(signatures.map((s) => s.meaning).lastIndexOf('authored'));
  const firstApproval = study.status === 'submitted' ? round.find((s) => s.meaning === 'reviewed-and-approved') : undefined;

  const actions = [];
  if ((study.status === 'draft' || study.status === 'returned') && user.roles.includes(Role.Analyst)) {
    actions.push(
      <Button key="edit" variant="outline" asChild>
        <RouterLink to={paths.studyEdit.getHref(study.id)}>
          {!isAuthor ? 'Open in the wizard' : study.status === 'returned' ? 'Make the changes' : 'Edit the study'}
        </RouterLink>
      </Button>,
    );
  }
  if (study.status === 'draft' && user.roles.includes(Role.Admin)) {
    actions.push(<ReassignDialog key="reassign" study={study} />);
  }
  if (isAuthor && (study.status === 'draft' || study.status === 'returned') && study.result) {
    actions.push(<SignDialog key="submit" studyId={study.id} lockVersion={study.lockVersion} step={submitStep(study.status)} />);
  }
  if (study.status === 'submitted' && !involved && hasAnyRole(user.roles, [Role.Reviewer, Role.QualityManager])) {
    const canRelease = firstApproval && user.roles.includes(Role.QualityManager) && firstApproval.signerId !== user.id;
    if (!firstApproval || canRelease) {
      actions.push(<ReturnDialog key="return" studyId={study.id} lockVersion={study.lockVersion} authorName={study.author.name} />);
      const step = firstApproval ? 'release' : 'approve';
      actions.push(<SignDialog key={step} studyId={study.id} lockVersion={study.lockVersion} step={step} />);
    }
  }
  if (study.status === 'approved') {
    actions.push(<ReportDownloadButton key="report" studyId={study.id} status={study.status} variant="outline" />);
    if (user.roles.includes(Role.Analyst)) {
      actions.push(
        <Button
          key="copy"
          variant="outline"
          loading={copy.isPending}
          onClick={async () => {
            const created = await copy.mutateAsync();
            toaster.create({ type: 'success', title: 'New draft started', description: created.title });
            void navigate(paths.studyEdit.getHref(created.id));
          }}
        >
          Start a new study from this one
        </Button>,
      );
    }
  }
  return actions.length ? (
    <HStack gap="3" wrap="wrap">
      {actions}
    </HStack>
  ) : null;
}
