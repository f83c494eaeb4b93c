import type { StudyDto } from '@meritline/shared';
import { Button, CloseButton, Dialog, Portal, Text } from '@chakra-ui/react';
import { useState } from 'react';
import { useNavigate } from 'react-router';
import { toaster } from '@/components/ui/toaster';
import { paths } from '@/lib/config/paths';
import { useDeleteStudy } from '../../api/delete-study';

/** Deletes a draft its author no longer needs; submitted and returned studies stay on record. */
export function DeleteDraft({ study }: { study: StudyDto }) {
  const [open, setOpen] = useState(false);
  const deleteStudy = useDeleteStudy();
  const navigate = useNavigate();

  const confirm = () =>
    deleteStudy.mutate(study.id, {
      onSuccess: () => {
        setOpen(false);
        toaster.create({ type: 'success', title: 'Draft deleted', description: study.title });
        void navigate(paths.studies.getHref());
      },
    });

  return (
    <Dialog.Root open={open} onOpenChange={(e) => setOpen(e.open)} role="alertdialog">
      <Dialog.Trigger asChild>
        <Button variant="outline" colorPalette="red" size="sm" alignSelf="flex-start">
          Delete this draft
        </Button>
      </Dialog.Trigger>
      <Portal>
        <Dialog.Backdrop />
        <Dialog.Positioner>
          <Dialog.Content>
            <Dialog.Header>
              <Dialog.Title>Delete the draft “{study.title}”?</Dialog.Title>
            </Dialog.Header>
            <Dialog.Body>
              <Text>The study and all its data are removed. The deletion is kept in the audit trail; the data cannot be brought back.</Text>
            </Dialog.Body>
            <Dialog.Footer>
              <Dialog.ActionTrigger asChild>
                <Button variant="outline">Keep the draft</Button>
              </Dialog.ActionTrigger>
              <Button colorPalette="red" onClick={confirm} loading={deleteStudy.isPending}>
                Delete
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
