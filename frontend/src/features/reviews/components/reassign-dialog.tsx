import { Button } from '@chakra-ui/react';
import { useQuery } from '@tanstack/react-query';
import { useState } from 'react';
import { FormDialog } from '@/components/form-dialog';
import { TextareaField } from '@/components/form/textarea-field';
import { toaster } from '@/components/ui/toaster';
import { SelectField } from '@/components/form/select-field';
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
    <FormDialog
      open={open}
      onOpenChange={setOpen}
      trigger={<Button variant="outline">Give to another analyst…</Button>}
      title="Give the draft to another analyst"
      description={`${study.author.name} writes this draft now. The analyst you choose becomes its author and the only one who may change it; the change and your reason are kept in the audit trail.`}
      initialValues={initialValues}
      validationSchema={reassignSchema}
      onSubmit={async (values) => {
        await reassign.mutateAsync({ values, lockVersion: study.lockVersion });
        const name = choices.find((u) => u.id === values.authorId)?.name ?? 'the analyst chosen';
        toaster.create({ type: 'success', title: `The draft is now ${name}’s` });
      }}
      submitLabel="Give the draft"
    >
      <SelectField
        name="authorId"
        label="New author"
        required
        disabled={analysts.isPending}
        placeholder={analysts.isPending ? 'Loading the analysts…' : 'Choose an analyst'}
        options={choices.map((u) => ({ value: u.id, label: u.name }))}
      />
      <TextareaField name="reason" label="Why the draft changes hands" required maxLength={500} />
    </FormDialog>
  );
}
