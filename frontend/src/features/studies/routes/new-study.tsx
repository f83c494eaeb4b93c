import type { MethodDto } from '@meritline/shared';
import { Box, Field, Input, SimpleGrid, Skeleton, Stack, Text } from '@chakra-ui/react';
import { useQuery } from '@tanstack/react-query';
import { getIn, useFormikContext } from 'formik';
import { useState } from 'react';
import { useNavigate } from 'react-router';
import { Form } from '@/components/form/form';
import { FormField } from '@/components/form/form-field';
import { PageHeader } from '@/components/page-header';
import { QueryError } from '@/components/query-error';
import { paths } from '@/lib/config/paths';
import { createStudySchema, useCreateStudy, type CreateStudyValues } from '../api/create-study';
import { methodChoicesQueries } from '../api/method-choices-queries';
import { defaultVersion, MethodSelect, VersionPicker } from '../components/wizard/method-version-picker';
import { LAST_STEP } from '../components/wizard/wizard-steps';

const isoToday = () => new Date().toISOString().slice(0, 10);

function ChooseMethod({ methods }: { methods: readonly MethodDto[] }) {
  const { values, errors, submitCount, setFieldValue } = useFormikContext<CreateStudyValues>();
  const method = methods.find((m) => m.id === values.methodId);
  const versionError = submitCount > 0 ? (getIn(errors, 'methodVersionId') as string | undefined) : undefined;

  const chooseMethod = (methodId: string) => {
    const chosen = methods.find((m) => m.id === methodId);
    void setFieldValue('methodId', methodId);
    void setFieldValue('methodVersionId', defaultVersion(chosen));
    if (chosen && !values.title.trim()) void setFieldValue('title', `${chosen.name}: validation ${isoToday()}`);
  };

  return (
    <Stack gap="5">
      <FormField name="methodId" label="Method" required helperText="What the study validates: the analyte, the matrix and the technique.">
        {(field) => <MethodSelect methods={methods} value={String(field.value ?? '')} onChange={chooseMethod} />}
      </FormField>
      {method && (
        <Field.Root invalid={Boolean(versionError)} required>
          <Field.Label>
            Version
            <Field.RequiredIndicator />
          </Field.Label>
          <Box width="full">
            <VersionPicker method={method} value={values.methodVersionId} onChange={(id) => void setFieldValue('methodVersionId', id)} />
          </Box>
          {versionError && <Field.ErrorText>{versionError}</Field.ErrorText>}
        </Field.Root>
      )}
    </Stack>
  );
}

function DateField({ name, label }: { name: 'startedOn' | 'finishedOn'; label: string }) {
  return (
    <FormField name={name} label={label}>
      {(field) => <Input {...field} value={String(field.value ?? '')} type="date" />}
    </FormField>
  );
}

export default function NewStudyPage() {
  const methods = useQuery(methodChoicesQueries.list());
  const createStudy = useCreateStudy();
  const navigate = useNavigate();
  const [initialValues] = useState<CreateStudyValues>(() => ({
    methodId: '',
    methodVersionId: '',
    title: '',
    instrument: '',
    startedOn: isoToday(),
    finishedOn: '',
  }));

  return (
    <>
      <PageHeader
        section={`Validation study · step 1 of ${LAST_STEP}`}
        title="New validation study"
        description="Choose the method and version the study validates. The study is saved as a draft; the next steps take the standards, blanks, recovery and precision data."
      />
      <Box maxW="3xl" borderWidth="1px" borderColor="border" borderRadius="l3" bg="bg.panel" p={{ base: '4', md: '8' }}>
        {methods.isError ? (
          <QueryError error={methods.error} title="The methods could not be loaded" onRetry={() => void methods.refetch()} />
        ) : methods.isPending ? (
          <Skeleton height="40" />
        ) : methods.data.length === 0 ? (
          <Text>There is no method yet. A quality manager sets methods up on the Methods page; analysts may propose one there.</Text>
        ) : (
          <Form
            initialValues={initialValues}
            validationSchema={createStudySchema}
            submitLabel="Create the study"
            onSubmit={async (values) => {
              const study = await createStudy.mutateAsync(values);
              await navigate(paths.studyEdit.getHref(study.id, 2));
            }}
          >
            <ChooseMethod methods={methods.data} />
            <FormField name="title" label="Title" required helperText="How colleagues and reviewers will find the study." />
            <FormField name="instrument" label="Instrument" placeholder="e.g. IC-2, conductivity detector" />
            <SimpleGrid columns={{ base: 1, sm: 2 }} gap="4">
              <DateField name="startedOn" label="Started on" />
              <DateField name="finishedOn" label="Finished on" />
            </SimpleGrid>
          </Form>
        )}
      </Box>
    </>
  );
}
