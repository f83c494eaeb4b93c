import { Button, CloseButton, Dialog, Portal, Text } from '@chakra-ui/react';
import type { MethodVersionStatus } from '@meritline/shared';
import { useState } from 'react';
import { toaster } from '@/components/ui/toaster';
import { isApiError } from '@/lib/api-client';
import type { MethodVersionDto } from '../api/types';
import { useChangeVersionStatus } from '../api/update-version';

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
  const [open, setOpen] = useState(false);
  const changeStatus = useChangeVersionStatus(version);
  const action = ACTIONS[version.status];
  if (!action) return null;

  const confirm = () =>
    changeStatus.mutate(action.to, {
      onSuccess: () => {
        setOpen(false);
        toaster.create({ type: 'success', title: `Version ${version.number} is now ${action.to}` });
      },
      onError: (error) => {
        setOpen(false);
        if (isApiError(error) && error.status === 409) {
          toaster.create({
            type: 'warning',
            title: 'Not changed',
            description: 'Someone else changed this version first. The page now shows the current state.',
          });
        }
      },
    });

  return (
    <Dialog.Root open={open} onOpenChange={(e) => setOpen(e.open)} role="alertdialog">
      <Dialog.Trigger asChild>
        <Button size="sm" variant={action.to === 'active' ? 'solid' : 'outline'} colorPalette={action.to === 'retired' ? 'red' : undefined}>
          {action.label} version {version.number}
        </Button>
      </Dialog.Trigger>
      <Portal>
        <Dialog.Backdrop />
        <Dialog.Positioner>
          <Dialog.Content>
            <Dialog.Header>
              <Dialog.Title>
                {action.label} version {version.number}?
              </Dialog.Title>
            </Dialog.Header>
            <Dialog.Body>
              <Text>{action.explain}</Text>
              {action.to === 'active' && replaces !== undefined && (
                <Text mt="3">Version {replaces}, active until now, will be retired.</Text>
              )}
            </Dialog.Body>
            <Dialog.Footer>
              <Dialog.ActionTrigger asChild>
                <Button variant="outline">Cancel</Button>
              </Dialog.ActionTrigger>
              <Button onClick={confirm} loading={changeStatus.isPending} colorPalette={action.to === 'retired' ? 'red' : undefined}>
                {action.label}
              </Button>
            </Dialog.Footer>
            <Dialog.CloseTrigger asChild>
              <CloseButton size="sm" />
            </Dialog.CloseTrigger>
          </Dialog.Content>
        </Dialog.Positioner>
      </Portal>
    </Dialog.Root>
  );
}
