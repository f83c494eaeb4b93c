import type { CriteriaTemplateDto } from '@meritline/shared';
import { Alert, Button, Input, SimpleGrid, Skeleton, Stack, Text } from '@chakra-ui/react';
import { useQuery } from '@tanstack/react-query';
import { useFormikContext } from 'formik';
import { useId, useState } from 'react';
import { useNavigate } from 'react-router';
import { FormDialog } from '@/components/form-dialog';
import { FormField } from '@/components/form/form-field';
import { SelectField } from '@/components/form/select-field';
import { toaster } from '@/components/ui/toaster';
import { paths } from '@/lib/config/paths';
import { createMethodSchema, useCreateMethod, type CreateMethodValues } from '../api/create-method';
import { criteriaTemplatesQueries } from '../api/criteria-templates-queries';
import { CriteriaList } from './criteria-list';

export const TECHNIQUES = [
  'UV-Vis absorbance',
  'fluorescence',
  'ion chromatography',
  'HPLC-UV',
  'LC-MS/MS',
  'GC-MS',
  'flame AAS',
  'ICP-OES',
  'potentiometry',
];

const initialValues: CreateMethodValues = {
  name: '',
  analyte: '',
  matrix: '',
  technique: '',
  xUnit: '',
  yUnit: '',
  purpose: '',
  changeSummary: '',
};

function TemplatePreview({ templates }: { templates: readonly CriteriaTemplateDto[] }) {
  const { values } = useFormikContext<CreateMethodValues>();
  const template = templates.find((t) => t.key === values.purpose);
  if (!template) return null;
  return (
    <Stack gap="2">
      <Text fontSize="sm" color="fg.muted">
        {template.description}
      </Text>
      <CriteriaList criteria={template.criteria} label={`Criteria of ${template.name}`} units={{ x: values.xUnit, y: values.yUnit }} />
      {template.note && (
        <Alert.Root status="info" variant="subtle">
          <Alert.Indicator />
          <Alert.Description>{template.note}</Alert.Description>
        </Alert.Root>
      )}
    </Stack>
  );
}

export function CreateMethodDialog({ proposal }: { proposal: boolean }) {
  const [open, setOpen] = useState(false);
  const templates = useQuery({ ...criteriaTemplatesQueries.list(), enabled: open });
  const createMethod = useCreateMethod();
  const navigate = useNavigate();
  const techniqueList = useId();

  return (
    <FormDialog
      open={open}
      onOpenChange={setOpen}
      trigger={<Button>{proposal ? 'Propose a method' : 'New method'}</Button>}
      title={proposal ? 'Propose a method' : 'New method'}
      description="The method starts with version 1 as a draft. Its acceptance criteria come from the set you choose and can be edited while the version is a draft."
      size="lg"
      scrollBehavior="inside"
      initialValues={initialValues}
      validationSchema={createMethodSchema}
      onSubmit={async (values) => {
        const template = templates.data?.find((t) => t.key === values.purpose);
        const method = await createMethod.mutateAsync({ ...values, criteria: template?.criteria });
        toaster.create({ type: 'success', title: `${method.name} created`, description: 'Version 1 is a draft.' });
        void navigate(paths.methodDetail.getHref(method.id));
      }}
      submitLabel={proposal ? 'Propose the method' : 'Create the method'}
    >
      <FormField name="name" label="Method name" required placeholder="Nitrate in drinking water by ion chromatography" />
      <SimpleGrid columns={{ base: 1, md: 2 }} gap="4">
        <FormField name="analyte" label="Analyte" required />
        <FormField name="matrix" label="Matrix" required placeholder="drinking water" />
      </SimpleGrid>
      <FormField name="technique" label="Technique" required helperText="Choose a suggestion or type your own, up to 80 characters.">
        {(field) => (
          <>
            <Input {...field} value={String(field.value ?? '')} list={techniqueList} autoComplete="off" maxLength={80} />
            <datalist id={techniqueList}>
              {TECHNIQUES.map((t) => (
                <option key={t} value={t} />
              ))}
            </datalist>
          </>
        )}
      </FormField>
      <SimpleGrid columns={{ base: 1, md: 2 }} gap="4">
        <FormField name="xUnit" label="Concentration unit (x)" required placeholder="mg/L" />
        <FormField name="yUnit" label="Response unit (y)" required placeholder="AU, counts, µS·min" />
      </SimpleGrid>
      {templates.isPending ? (
        <Skeleton height="16" />
      ) : (
        <SelectField
          name="purpose"
          label="Starting acceptance criteria"
          required
          placeholder="Choose a set…"
          options={(templates.data ?? []).map((t) => ({ value: t.key, label: t.name }))}
        />
      )}
      <TemplatePreview templates={templates.data ?? []} />
      <FormField name="changeSummary" label="Note for version 1" placeholder="First version" />
    </FormDialog>
  );
}
