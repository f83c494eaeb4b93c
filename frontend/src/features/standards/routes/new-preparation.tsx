import { Box, Grid, Heading, Skeleton, Stack } from '@chakra-ui/react';
import { useQuery } from '@tanstack/react-query';
import { useNavigate } from 'react-router';
import { Form } from '@/components/form/form';
import { FormField } from '@/components/form/form-field';
import { QueryError } from '@/components/query-error';
import { PageHeader } from '@/components/page-header';
import { toaster } from '@/components/ui/toaster';
import { isApiError } from '@/lib/api-client';
import { paths } from '@/lib/config/paths';
import { emptyPreparation, preparationSchema, previewRequest, usableMaterials, type PreparationValues } from '../api/preparation-form';
import { useCreatePreparation } from '../api/preparations';
import { referenceMaterialsQueries } from '../api/reference-materials-queries';
import { MaterialField, StepFields, StockFields } from '../components/preparation-fields';
import { PreparationBudget, PreparationPreview } from '../components/preparation-preview';

export default function NewPreparationPage() {
  const materials = useQuery(referenceMaterialsQueries.list());
  const create = useCreatePreparation();
  const navigate = useNavigate();

  const save = async (values: PreparationValues, helpers: { setStatus: (status: string) => void }) => {
    const body = previewRequest(values);
    if (!body) return;
    try {
      const saved = await create.mutateAsync({ ...body, name: values.name });
      toaster.create({ type: 'success', title: `${saved.name} saved`, description: `${saved.steps.length} working standards recorded.` });
      void navigate(paths.preparations.getHref());
    } catch (error) {
      // Fields of the stock and of each dilution are nested; the server's words name them.
      if (!isApiError(error)) throw error;
      const errors = error.body.errors ?? [];
      helpers.setStatus(errors.length ? errors.map((e) => e.message).join(' ') : error.body.message);
    }
  };

  return (
    <>
      <PageHeader
        section="Traceable standards"
        title="Prepare standards"
        description="Weigh a registered reference material into a stock solution and dilute it into working standards. The concentrations and their standard uncertainties follow as you type."
      />
      {materials.isError ? (
        <QueryError error={materials.error} onRetry={() => void materials.refetch()} />
      ) : materials.isPending ? (
        <Skeleton height="60" />
      ) : (
        <Form initialValues={emptyPreparation} validationSchema={preparationSchema} onSubmit={save} submitLabel="Save the preparation">
          <Grid templateColumns={{ base: '1fr', xl: 'minmax(0, 3fr) minmax(0, 2fr)' }} gap="8" alignItems="start">
            <Stack gap="6">
              <FormField name="name" label="Name of the preparation" required placeholder="Cadmium stock and working standards, week 49" />
              <MaterialField materials={usableMaterials(materials.data)} />
              <StockFields />
              <StepFields />
            </Stack>
            <Box position={{ xl: 'sticky' }} top="4" borderWidth="1px" borderRadius="l3" p="5" bg="bg.panel">
              <Heading as="h2" size="md" mb="4">
                Concentrations and uncertainty
              </Heading>
              <PreparationPreview />
            </Box>
          </Grid>
          <PreparationBudget />
        </Form>
      )}
    </>
  );
}
