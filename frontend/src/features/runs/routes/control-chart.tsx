import { Alert, Box, Button, Field, Link, SimpleGrid, Stack, Text } from '@chakra-ui/react';
import { formatDateTime, formatNumber, QC_SERIES, QC_SERIES_LABELS, Role, type QcSeries, type QcTrendSignalDto } from '@meritline/shared';
import { useQuery } from '@tanstack/react-query';
import { useState } from 'react';
import { Link as RouterLink, useSearchParams } from 'react-router';
import { DataTable, dataTableColumns } from '@/components/data-table';
import { PageHeader } from '@/components/page-header';
import { QueryError } from '@/components/query-error';
import { useSession } from '@/lib/auth';
import { paths } from '@/lib/config/paths';
import { SelectControl } from '@/components/select-control';
import { runsQueries } from '../api/runs-queries';
import { BaselinePicker } from '../components/baseline-picker';
import { TrendChartPlot } from '../components/trend-chart-plot';
import { versionChoices } from '../utils/version-choices';

const column = dataTableColumns<QcTrendSignalDto>();
const columns = column.columns([
  column.accessor('message', { header: 'Signal', cell: (info) => <Text whiteSpace="normal">{info.getValue()}</Text> }),
  column.accessor('runTitle', {
    header: 'Run',
    cell: (info) => (
      <Link asChild color="brand.fg" fontWeight="500">
        <RouterLink to={paths.runDetail.getHref(info.row.original.runId)}>{info.getValue()}</RouterLink>
      </Link>
    ),
  }),
  column.accessor('createdAt', { header: 'Created', cell: (info) => formatDateTime(info.getValue()) }),
]);

const isSeries = (value: string | null): value is QcSeries => (QC_SERIES as readonly string[]).includes(value ?? '');

export default function ControlChartPage() {
  const [params, setParams] = useSearchParams();
  const versionId = params.get('versionId') ?? '';
  const seriesParam = params.get('series');
  const series: QcSeries = isSeries(seriesParam) ? seriesParam : 'slope';
  const { user } = useSession();
  const isQualityManager = user?.roles.includes(Role.QualityManager) ?? false;
  const [picking, setPicking] = useState(false);
  const methods = useQuery(runsQueries.methodChoices());
  const methodId = methods.data?.find((m) => m.versions.some((v) => v.id === versionId))?.id ?? '';
  const chart = useQuery({ ...runsQueries.qcTrends(methodId, series, versionId), enabled: methodId !== '' });
  const set = (next: { versionId?: string; series?: QcSeries }) => {
    const merged = { versionId, series, ...next };
    setParams(merged.versionId ? { versionId: merged.versionId, series: merged.series } : {});
  };

  return (
    <>
      <PageHeader
        section="Routine batches"
        title="Control charts"
        description="A series of every accepted run of a method version (check standard or QC sample recovery, method blank reading, calibration slope or intercept) against the mean and the warning (± 2 s) and action (± 3 s) limits of a baseline of released runs chosen by a quality manager. The run rules name each signal in words."
      />
      <Stack gap="6">
        <SimpleGrid columns={{ base: 1, md: 2 }} gap="4" maxW="4xl">
          <Field.Root>
            <Field.Label>Method version</Field.Label>
            <SelectControl
              value={versionId}
              onChange={(value) => set({ versionId: value })}
              placeholder="Choose a method version"
              options={versionChoices(methods.data ?? [])}
            />
          </Field.Root>
          <Field.Root>
            <Field.Label>Series</Field.Label>
            <SelectControl
              value={series}
              onChange={(value) => set({ series: value as QcSeries })}
              options={QC_SERIES.map((s) => ({ value: s, label: QC_SERIES_LABELS[s] }))}
            />
          </Field.Root>
        </SimpleGrid>
        {!versionId && <Text color="fg.muted">Choose a method version to see its charts.</Text>}
        {chart.isError && <QueryError error={chart.error} onRetry={() => void chart.refetch()} />}
        {chart.data && (
          <>
            {isQualityManager && !picking && (
              <Box>
                <Button size="sm" variant="outline" onClick={() => setPicking(true)}>
                  {chart.data.baseline ? 'Change the baseline' : 'Choose the baseline'}
                </Button>
              </Box>
            )}
            {picking && <BaselinePicker key={chart.data.methodVersionId} chart={chart.data} onClose={() => setPicking(false)} />}
            {chart.data.message && (
              <Alert.Root status="info" variant="surface">
                <Alert.Indicator />
                <Alert.Description>{chart.data.message}</Alert.Description>
              </Alert.Root>
            )}
            {chart.data.signals.length > 0 && (
              <Alert.Root status="warning" variant="surface">
                <Alert.Indicator />
                <Alert.Content>
                  <Alert.Title>
                    {chart.data.signals.length === 1 ? 'One signal' : `${chart.data.signals.length} signals`}: look into the method before
                    more results are released
                  </Alert.Title>
                  <Alert.Description>The quality managers were e-mailed once about each signal.</Alert.Description>
                </Alert.Content>
              </Alert.Root>
            )}
            {chart.data.points.length > 0 && (
              <Box borderWidth="1px" borderColor="border" borderRadius="l3" bg="bg.panel" p="3">
                <TrendChartPlot chart={chart.data} />
              </Box>
            )}
            {chart.data.limits && (
              <Text fontSize="sm" color="fg.muted">
                Baseline of {chart.data.limits.n} values from {chart.data.baseline?.runIds.length} released runs, chosen by{' '}
                {chart.data.baseline?.chosenBy.name} on {formatDateTime(chart.data.baseline?.chosenAt ?? '')} ({chart.data.baseline?.reason}
                ): mean {formatNumber(chart.data.limits.mean, 5)}, s {formatNumber(chart.data.limits.sd, 3)} {chart.data.unit}; warning
                limits {formatNumber(chart.data.limits.warning[0], 5)} to {formatNumber(chart.data.limits.warning[1], 5)}, action limits{' '}
                {formatNumber(chart.data.limits.action[0], 5)} to {formatNumber(chart.data.limits.action[1], 5)}. Only the runs after the
                baseline are judged; rejected and replaced runs are left out.
              </Text>
            )}
            {chart.data.signals.length > 0 && (
              <DataTable
                label="Signals"
                columns={columns}
                data={chart.data.signals}
                getRowId={(s) => `${s.rule}:${s.runId}:${s.item ?? ''}`}
              />
            )}
          </>
        )}
      </Stack>
    </>
  );
}
