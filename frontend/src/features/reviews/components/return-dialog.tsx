import { Button } from '@chakra-ui/react';
import { FormDialog } from '@/components/form-dialog';
import { TextareaField } from '@/components/form/textarea-field';
import { toaster } from '@/components/ui/toaster';
import { returnSchema, useReturnStudy, type ReturnValues } from '../api/return-study';

const initialValues: ReturnValues = { comment: '' };

export function ReturnDialog({ studyId, lockVersion, authorName }: { studyId: string; lockVersion: number; authorName: string }) {
  const returnStudy = useReturnStudy(studyId);

  return (
    <FormDialog
      trigger={<Button variant="outline">Return for changes</Button>}
      title={`Return the study to ${authorName}`}
      description="The study goes back to its author for changes; nothing is signed. Your comment is e-mailed to the author and kept in the study’s history."
      initialValues={initialValues}
      validationSchema={returnSchema}
      onSubmit={async (values) => {
        await returnStudy.mutateAsync({ values, lockVersion });
        toaster.create({ type: 'success', title: `Returned to ${authorName}` });
      }}
      submitLabel="Return the study"
    >
      <TextareaField name="comment" label="What should the author change?" required rows={4} />
    </FormDialog>
  );
}
