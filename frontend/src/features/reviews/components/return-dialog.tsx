import { Button, CloseButton, Dialog, Portal, Text, Textarea } from '@chakra-ui/react';
import { useState } from 'react';
import { Form } from '@/components/form/form';
import { FormField } from '@/components/form/form-field';
import { toaster } from '@/components/ui/toaster';
import { returnSchema, useReturnStudy, type ReturnValues } from '../api/return-study';

const initialValues: ReturnValues = { comment: '' };

export function ReturnDialog({ studyId, lockVersion, authorName }: { studyId: string; lockVersion: number; authorName: string }) {
  const [open, setOpen] = useState(false);
  const returnStudy = useReturnStudy(studyId);

  return (
    <Dialog.Root open={open} onOpenChange={(event) => setOpen(event.open)} size="md">
      <Dialog.Trigger asChild>
        <Button variant="outline">Return for changes</Button>
      </Dialog.Trigger>
      <Portal>
        <Dialog.Backdrop />
        <Dialog.Positioner>
          <Dialog.Content>
            <Dialog.Header>
              <Dialog.Title>Return the study to {authorName}</Dialog.Title>
            </Dialog.Header>
            <Dialog.Body pb="6">
              <Text mb="5" color="fg.muted">
                The study goes back to its author for changes; nothing is signed. Your comment is e-mailed to the author and kept in the
                study’s history.
              </Text>
              <Form
                initialValues={initialValues}
                validationSchema={returnSchema}
                onSubmit={async (values) => {
                  await returnStudy.mutateAsync({ values, lockVersion });
                  setOpen(false);
                  toaster.create({ type: 'success', title: `Returned to ${authorName}` });
                }}
                submitLabel="Return the study"
                secondaryAction={
                  <Dialog.ActionTrigger asChild>
                    <Button variant="outline">Cancel</Button>
                  </Dialog.ActionTrigger>
                }
              >
                <FormField name="comment" label="What should the author change?" required>
                  {(field) => <Textarea {...field} value={(field.value as string) ?? ''} rows={4} />}
                </FormField>
              </Form>
            </Dialog.Body>
            <Dialog.CloseTrigger asChild>
              <CloseButton size="sm" />
            </Dialog.CloseTrigger>
          </Dialog.Content>
        </Dialog.Positioner>
      </Portal>
    </Dialog.Root>
  );
}
