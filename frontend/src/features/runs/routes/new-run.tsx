import type { RunDto } from '@meritline/shared';
import { Button } from '@chakra-ui/react';
import { useQuery, useQueryClient } from '@tanstack/react-query';
import { Link as RouterLink, useNavigate, useSearchParams } from 'react-router';
import { Form } from '@/components/form/form';
import { PageHeader } from '@/components/page-header';
import { PageSpinner } from '@/components/page-spinner';
import { QueryError } from '@/components/query-error';
import { toaster } from '@/components/ui/toaster';
import { paths } from '@/lib/config/paths';
import { buildRunInput, emptyRunForm, runFormSchema, useCreateRun, type RunFormValues } from '../api/create-run';
import { runsQueries } from '../api/runs-queries';
import { RunFormFields } from '../components/run-form-fields';
import { blanksText, checksText, qcSamplesText, standardsText, unknownsText } from '../utils/measurement-text';

/** A saved run's data as a starting point: a correction or a second calibration is always a new run. */
function valuesFrom(run: RunDto): RunFormValues {
  const standards = run.data.standards.map(({ x, y, sd }) => (sd !== undefined ? { x, y, sd } : { x, y }));
  const calibrant = run.model === 'one-point' ? run.data.standards.find((s) => !s.excluded)?.x : undefined;
  return {
    methodVersionId: run.methodVersionId,
    title: `${run.title} (recalculated)`,
    model: run.model,
    bracketing: run.data.twoPoint?.bracketing === true,
    calibrant: calibrant === undefined ? '' : String(calibrant),
    standards: standardsText(standards),
    checks: checksText(run.data.checks),
    unknowns: unknownsText(run.data.unknowns),
    blanks: blanksText(run.data.blanks),
    qcSamples: qcSamplesText(run.data.qcSamples),
  };
}

export default function NewRunPage() {
  const [params] = useSearchParams();
  const fromRunId = params.get('from');
  const navigate = useNavigate();
  const queryClient = useQueryClient();
  const createRun = useCreateRun();
  const methods = useQuery(runsQueries.methodChoices());
  const source = useQuery({ ...runsQueries.detail(fromRunId ?? ''), enabled: fromRunId !== null });

  if (methods.isPending || (fromRunId && source.isPending)) return <PageSpinner label="Loading the methods" />;
  if (methods.isError) return <QueryError error={methods.error} onRetry={() => void methods.refetch()} />;
  if (source.isError) return <QueryError error={source.error} title="The run to start from could not be loaded" />;

  const initialValues = source.data ? valuesFrom(source.data) : { ...emptyRunForm, methodVersionId: params.get('versionId') ?? '' };

  const submit = async (values: RunFormValues) => {
    const options = await queryClient.fetchQuery(runsQueries.options(values.methodVersionId));
    const input = buildRunInput(
      values,
      options.models.find((m) => m.model === values.model),
      options.lockVersion,
    );
    if (!input) return;
    const run = await createRun.mutateAsync(input);
    toaster.create({
      type: run.status === 'accepted' ? 'success' : 'warning',
      title: run.status === 'accepted' ? 'Run saved and accepted' : 'Run saved and rejected',
      description: run.status === 'accepted' ? run.title : 'A check standard failed: the results are not reportable.',
    });
    await navigate(paths.runDetail.getHref(run.id));
  };

  return (
    <>
      <PageHeader
        section="Routine batches"
        title={source.data ? 'New run from a saved one' : 'New run'}
        description="Enter the day's standards, check standards and samples. The calibration choices are those the method version's validation justifies; the preview shows what will be saved."
        actions={
          <Button variant="outline" asChild>
            <RouterLink to={paths.runs.getHref()}>Back to the runs</RouterLink>
          </Button>
        }
      />
      <Form initialValues={initialValues} validationSchema={runFormSchema} onSubmit={submit} submitLabel="Save run">
        <RunFormFields methods={methods.data} />
      </Form>
    </>
  );
}
