import { formatNumber, formatDateTime } from '@meritline/shared';
import { Alert, Badge, Box, Field, HStack, Link, Stack, Text } from '@chakra-ui/react';
import { useQuery } from '@tanstack/react-query';
import { Link as RouterLink, useSearchParams } from 'react-router';
import { DataTable, dataTableColumns } from '@/components/data-table';
import { PageHeader } from '@/components/page-header';
import { QueryError } from '@/components/query-error';
import { paths } from '@/lib/config/paths';
import { runsQueries } from '../api/runs-queries';
import type { ControlChart, ControlFlag } from '../api/types';
import { ControlChartPlot } from '../components/control-chart-plot';
import { VersionSelect } from '../components/version-filter';

const FLAG_WORDS: Record<ControlFlag, string> = {
  beyondWarning: 'beyond a warning limit',
  beyondAction: 'beyond an action limit',
  sevenOnOneSide: '7th run in a row on one side of the mean',
};

type Point = ControlChart['points'][number] & { position: number };
const column = dataTableColumns<Point>();
const columns = column.columns([
  column.accessor('position', { header: 'Run no.', meta: { align: 'end' } }),
  column.accessor('title', {
    header: 'Run',
    cell: (info) => (
      <Link asChild color="brand.fg" fontWeight="500">
        <RouterLink to={paths.runDetail.getHref(info.row.original.runId)}>{info.getValue()}</RouterLink>
      </Link>
    ),
  }),
  column.accessor('createdAt', { header: 'Created', cell: (info) => formatDateTime(info.getValue()) }),
  column.accessor('slope', { header: 'Slope', meta: { align: 'end' }, cell: (info) => formatNumber(info.getValue(), 5) }),
  column.accessor('flags', {
    header: 'Signal',
    cell: (info) => (
      <HStack gap="1.5" wrap="wrap">
        {info.getValue().map((flag) => (
          <Badge key={flag} colorPalette={flag === 'beyondWarning' ? 'orange' : 'red'} variant="subtle">
            {FLAG_WORDS[flag]}
          </Badge>
        ))}
      </HStack>
    ),
  }),
]);

export default function ControlChartPage() {
  const [params, setParams] = useSearchParams();
  const versionId = params.get('versionId') ?? '';
  const methods = useQuery(runsQueries.methodChoices());
  const chart = useQuery({ ...runsQueries.controlChart(versionId), enabled: versionId !== '' });
  const flagged = (chart.data?.points ?? []).map((p, i) => ({ ...p, position: i + 1 })).filter((p) => p.flags.length > 0);

  return (
    <>
      <PageHeader
        section="Routine batches"
        title="Slope control chart"
        description="The calibration slope of every accepted run of a method version, against the mean and the warning (± 2 s) and action (± 3 s) limits of those runs. A slope beyond the action limits, or seven in a row on one side of the mean, asks for a look at the instrument and the standards."
      />
      <Stack gap="6">
        <Field.Root maxW="lg">
          <Field.Label>Method version</Field.Label>
          <VersionSelect
            methods={methods.data ?? []}
            value={versionId}
            onChange={(value) => setParams(value ? { versionId: value } : {})}
            emptyLabel="Choose a method version"
          />
        </Field.Root>
        {!versionId && <Text color="fg.muted">Choose a method version to see its chart.</Text>}
        {chart.isError && <QueryError error={chart.error} onRetry={() => void chart.refetch()} />}
        {chart.data && (
          <>
            {chart.data.message && (
              <Alert.Root status={chart.data.limits ? 'warning' : 'info'} variant="surface">
                <Alert.Indicator />
                <Alert.Description>{chart.data.message}</Alert.Description>
              </Alert.Root>
            )}
            {chart.data.n > 0 && (
              <Box borderWidth="1px" borderColor="border" borderRadius="l3" bg="bg.panel" p="3">
                <ControlChartPlot chart={chart.data} />
              </Box>
            )}
            {chart.data.limits && chart.data.mean !== null && chart.data.sd !== null && (
              <Text fontSize="sm" color="fg.muted">
                {chart.data.n} accepted runs: mean slope {formatNumber(chart.data.mean, 5)}, s {formatNumber(chart.data.sd, 3)}{' '}
                {chart.data.slopeUnit}; warning limits {formatNumber(chart.data.limits.warning[0], 5)} to{' '}
                {formatNumber(chart.data.limits.warning[1], 5)}, action limits {formatNumber(chart.data.limits.action[0], 5)} to{' '}
                {formatNumber(chart.data.limits.action[1], 5)}. Rejected runs are left out.
              </Text>
            )}
            {flagged.length > 0 && <DataTable label="Runs with a signal" columns={columns} data={flagged} getRowId={(p) => p.runId} />}
          </>
        )}
      </Stack>
    </>
  );
}
