import { Button, CloseButton, Dialog, NativeSelect, Portal, Text, Textarea } from '@chakra-ui/react';
import { useQuery } from '@tanstack/react-query';
import { useState } from 'react';
import { Form } from '@/components/form/form';
import { FormField } from '@/components/form/form-field';
import { toaster } from '@/components/ui/toaster';
import { analystChoicesQuery, reassignSchema, useReassignStudy, type ReassignValues } from '../api/reassign-study';
import type { StudyView } from '../api/review-types';

const initialValues: ReassignValues = { authorId: '', reason: '' };

/** An administrator hands a draft to another analyst; the reason goes into the audit trail. */
export function ReassignDialog({ study }: { study: Pick<StudyView, 'id' | 'lockVersion' | 'author'> }) {
  const [open, setOpen] = useState(false);
  const reassign = useReassignStudy(study.id);
  const analysts = useQuery({ ...analystChoicesQuery(), enabled: open });
  const choices = (analysts.data ?? []).filter((u) => u.id !== study.author.id);

  return (
    <Dialog.Root open={open} onOpenChange={(event) => setOpen(event.open)} size="md">
      <Dialog.Trigger asChild>
        <Button variant="outline">Give to another analyst…</Button>
      </Dialog.Trigger>
      <Portal>
        <Dialog.Backdrop />
        <Dialog.Positioner>
          <Dialog.Content>
            <Dialog.Header>
              <Dialog.Title>Give the draft to another analyst</Dialog.Title>
            </Dialog.Header>
            <Dialog.Body pb="6">
              <Text mb="5" color="fg.muted">
                {study.author.name} writes this draft now. The analyst you choose becomes its author and the only one who may change it; the
                change and your reason are kept in the audit trail.
              </Text>
              <Form
                initialValues={initialValues}
                validationSchema={reassignSchema}
                onSubmit={async (values) => {
                  await reassign.mutateAsync({ values, lockVersion: study.lockVersion });
                  setOpen(false);
                  const name = choices.find((u) => u.id === values.authorId)?.name ?? 'the analyst chosen';
                  toaster.create({ type: 'success', title: `The draft is now ${name}’s` });
                }}
                submitLabel="Give the draft"
                secondaryAction={
                  <Dialog.ActionTrigger asChild>
                    <Button variant="outline">Cancel</Button>
                  </Dialog.ActionTrigger>
                }
              >
                <FormField name="authorId" label="New author" required>
                  {(field) => (
                    <NativeSelect.Root disabled={analysts.isPending}>
                      <NativeSelect.Field {...field} value={field.value as string}>
                        <option value="">{analysts.isPending ? 'Loading the analysts…' : 'Choose an analyst'}</option>
                        {choices.map((u) => (
                          <option key={u.id} value={u.id}>
                            {u.name}
                          </option>
                        ))}
                      </NativeSelect.Field>
                      <NativeSelect.Indicator />
                    </NativeSelect.Root>
                  )}
                </FormField>
                <FormField name="reason" label="Why the draft changes hands" required>
                  {(field) => <Textarea {...field} value={(field.value as string) ?? ''} rows={3} maxLength={500} />}
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
