import type { StudyDto } from '@meritline/shared';
import { Button, Text } from '@chakra-ui/react';
import { useNavigate } from 'react-router';
import { ConfirmDialog } from '@/components/confirm-dialog';
import { toaster } from '@/components/ui/toaster';
import { paths } from '@/lib/config/paths';
import { useDeleteStudy } from '../../api/delete-study';

/** Deletes a draft its author no longer needs; submitted and returned studies stay on record. */
export function DeleteDraft({ study }: { study: StudyDto }) {
  const deleteStudy = useDeleteStudy();
  const navigate = useNavigate();

  return (
    <ConfirmDialog
      trigger={
        <Button variant="outline" colorPalette="red" size="sm" alignSelf="flex-start">
          Delete this draft
        </Button>
      }
      title={`Delete the draft “${study.title}”?`}
      size="md"
      confirmLabel="Delete"
      cancelLabel="Keep the draft"
      destructive
      onConfirm={async () => {
        await deleteStudy.mutateAsync(study.id);
        toaster.create({ type: 'success', title: 'Draft deleted', description: study.title });
        void navigate(paths.studies.getHref());
      }}
    >
      <Text>The study and all its data are removed. The deletion is kept in the audit trail; the data cannot be brought back.</Text>
    </ConfirmDialog>
  );
}
