import { Alert, Button, Field, Input, List, Text, Textarea } from '@chakra-ui/react';
import {
  MIN_JUSTIFICATION_LENGTH,
  REVALIDATION_FAMILY_LABELS,
  Role,
  type MethodVersionStatus,
  type MethodVersionDto,
} from '@meritline/shared';
import { useId, useState } from 'react';
import { ConfirmDialog } from '@/components/confirm-dialog';
import { toaster } from '@/components/ui/toaster';
import { isApiError } from '@/lib/api-client';
import { useSession } from '@/lib/auth';
import { useChangeVersionStatus, type ActivationSignature } from '../api/update-version';

const ACTIONS: Partial<Record<MethodVersionStatus, { to: MethodVersionStatus; label: string; explain: string }>> = {
  draft: {
    to: 'active',
    label: 'Activate',
    explain:
      'New studies and routine batches will use this version. Its criteria and settings can no longer be edited; a change needs a new version.',
  },
  active: {
    to: 'retired',
    label: 'Retire',
    explain: 'No new studies can use this version. Studies already made on it stay as they are, for the record.',
  },
};

/** Moves a version on: draft → active, active → retired (quality managers and administrators). */
export function VersionStatusAction({
  version,
  replaces,
}: {
  version: MethodVersionDto;
  /** The number of the version now active, which activation retires. */ replaces?: number;
}) {
  const [justification, setJustification] = useState('');
  const [password, setPassword] = useState('');
  const ids = useId();
  const { user } = useSession();
  const changeStatus = useChangeVersionStatus(version);
  const action = ACTIONS[version.status];
  if (!action) return null;

  const activating = action.to === 'active';
  const uncovered = activating && version.coverage && !version.coverage.covered;
  const isQualityManager = user?.roles.includes(Role.QualityManager) ?? false;
  const justificationShort = justification.trim().length < MIN_JUSTIFICATION_LENGTH;

  const confirm = async (signature?: ActivationSignature) => {
    try {
      await changeStatus.mutateAsync({ status: action.to, signature });
    } catch (error) {
      if (!isApiError(error) || error.status !== 409) throw error;
      toaster.create({
        type: 'warning',
        title: 'Not changed',
        description: 'Someone else changed this version first. The page now shows the current state.',
      });
      return;
    }
    toaster.create({
      type: 'success',
      title: `Version ${version.number} is now ${action.to}${signature ? ', with your signed justification' : ''}`,
    });
  };
  const signing = uncovered && isQualityManager;

  return (
    <ConfirmDialog
      onOpenChange={() => setPassword('')}
      size="md"
      trigger={
        <Button size="sm" variant={activating ? 'solid' : 'outline'} colorPalette={action.to === 'retired' ? 'red' : undefined}>
          {action.label} version {version.number}
        </Button>
      }
      title={`${action.label} version ${version.number}?`}
      confirmLabel={signing ? 'Sign and activate with justification' : uncovered ? undefined : action.label}
      destructive={action.to === 'retired'}
      confirmDisabled={signing && (justificationShort || !password)}
      onConfirm={() => (signing ? confirm({ activationJustification: justification.trim(), password }) : confirm())}
      describeError={(error) =>
        isApiError(error) && error.status === 401 ? 'Password not correct; the version was not activated.' : undefined
      }
    >
      <Text>{action.explain}</Text>
      {activating && replaces !== undefined && <Text>Version {replaces}, active until now, will be retired.</Text>}
      {uncovered && (
        <Alert.Root status="warning" variant="subtle">
          <Alert.Indicator />
          <Alert.Content>
            <Alert.Title>Not yet shown again</Alert.Title>
            <Alert.Description>
              No approved study of this version shows these figures again, as the change requires:
              <List.Root ms="5" mt="1">
                {version.coverage.missing.map((family) => (
                  <List.Item key={family}>{REVALIDATION_FAMILY_LABELS[family]}</List.Item>
                ))}
              </List.Root>
              {isQualityManager
                ? 'You may activate it all the same with a written justification, signed with your password.'
                : 'Approve a study covering them first; only a quality manager may activate without one, with a signed justification.'}
            </Alert.Description>
          </Alert.Content>
        </Alert.Root>
      )}
      {signing && (
        <>
          <Field.Root required invalid={justification.length > 0 && justificationShort}>
            <Field.Label htmlFor={`${ids}-justification`}>
              Justification for activating without coverage
              <Field.RequiredIndicator />
            </Field.Label>
            <Textarea id={`${ids}-justification`} value={justification} onChange={(e) => setJustification(e.target.value)} rows={3} />
            <Field.HelperText>At least {MIN_JUSTIFICATION_LENGTH} characters; kept in the audit trail.</Field.HelperText>
          </Field.Root>
          <Field.Root required>
            <Field.Label htmlFor={`${ids}-password`}>
              Your password
              <Field.RequiredIndicator />
            </Field.Label>
            <Input
              id={`${ids}-password`}
              type="password"
              autoComplete="current-password"
              value={password}
              onChange={(e) => setPassword(e.target.value)}
            />
            <Field.HelperText>Your signature means: activated with justification.</Field.HelperText>
          </Field.Root>
        </>
      )}
    </ConfirmDialog>
  );
}
