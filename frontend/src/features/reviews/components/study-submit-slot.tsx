import { Alert, HStack, Link, Text } from '@chakra-ui/react';
import type { StudyStatus } from '@meritline/shared';
import { Link as RouterLink, useNavigate } from 'react-router';
import { paths } from '@/lib/config/paths';
import { SignDialog } from './sign-dialog';
import { submitStep } from './signing-steps';

export interface StudySubmitSlotProps {
  study: { id: string; status: StudyStatus; lockVersion: number; result: unknown; resultErrors?: { message: string }[] | null };
}

/** The wizard's last step: sign and submit the study for review; the app hands it to the studies feature. */
export function StudySubmitSlot({ study }: StudySubmitSlotProps) {
  const navigate = useNavigate();
  const view = paths.studyView.getHref(study.id);

  if (study.status === 'submitted' || study.status === 'approved') {
    return (
      <Text>
        This study is {study.status === 'approved' ? 'approved' : 'awaiting review'}.{' '}
        <Link asChild color="brand.fg">
          <RouterLink to={view}>Open its review page</RouterLink>
        </Link>
      </Text>
    );
  }
  if (!study.result) {
    return (
      <Alert.Root status="warning">
        <Alert.Indicator />
        <Alert.Content>
          <Alert.Title>Not ready to submit</Alert.Title>
          <Alert.Description>
            {study.resultErrors?.map((error) => error.message).join(' ') || 'The results cannot be computed from the data yet.'}
          </Alert.Description>
        </Alert.Content>
      </Alert.Root>
    );
  }
  return (
    <HStack gap="4" wrap="wrap">
      <Text color="fg.muted">When the data and conclusion are complete, sign and submit the study; a second person then reviews it.</Text>
      <SignDialog studyId={study.id} lockVersion={study.lockVersion} step={submitStep(study.status)} onSigned={() => void navigate(view)} />
    </HStack>
  );
}
