import { Alert, Button, Stack, Text } from '@chakra-ui/react';
import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { DataTable } from '@/components/data-table';
import { PageHeader } from '@/components/page-header';
import { QueryError } from '@/components/query-error';
import { qualificationQueries, runQualification } from '../api/qualification-queries';
import { digitsText, qualificationColumns } from '../components/qualification-columns';

export default function QualificationPage() {
  const queryClient = useQueryClient();
  const runs = useQuery(qualificationQueries.list());
  const run = useMutation({
    mutationFn: runQualification,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: qualificationQueries.all }),
  });
  const latest = run.data;

  return (
    <>
      <PageHeader
        section="Quality"
        title="Self-qualification"
        description="Recompute published reference values (NIST Statistical Reference Datasets, printed statistical tables, textbook and guide worked examples) with the calculations of this installation and keep a signed report of the agreement, e.g. after an update or a move to another server."
        actions={
          <Button loading={run.isPending} onClick={() => run.mutate()}>
            Run the self-qualification
          </Button>
        }
      />
      <Stack gap="6">
        {run.isError && <QueryError error={run.error} onRetry={() => run.mutate()} />}
        {latest && (
          <Alert.Root status={latest.allPassed ? 'success' : 'error'} data-testid="qualification-answer">
            <Alert.Indicator />
            <Alert.Content>
              <Alert.Title>
                {latest.allPassed
                  ? `All ${latest.total} checks passed`
                  : `${latest.failed} of ${latest.total} checks failed: do not rely on new results until this is explained`}
              </Alert.Title>
              <Alert.Description>
                Fewest digits agreeing with the published values: {digitsText(latest.minDigits)}. The signed report is in the list below.
              </Alert.Description>
            </Alert.Content>
          </Alert.Root>
        )}
        <DataTable
          label="Self-qualification runs"
          columns={qualificationColumns}
          query={runs}
          getRowId={(r) => r.id}
          emptyTitle="Not run yet"
          emptyDescription="Run it once after installing and after each update."
        />
        <Text fontSize="sm" color="fg.muted" maxW="4xl">
          The checks show that the calculations reproduce published values on this installation. They do not replace the validation of the
          computerised system or of your methods under your laboratory&apos;s procedures and the regulations that apply.
        </Text>
      </Stack>
    </>
  );
}
