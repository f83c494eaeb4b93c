import { formatNumber, formatDateTime, type RunModel, type RunSummaryDto } from '@meritline/shared';
import { Stack, Text } from '@chakra-ui/react';
import { dataTableColumns } from '@/components/data-table';
import { NameCell } from '@/components/name-cell';
import { paths } from '@/lib/config/paths';
import { RunStatusBadge } from './run-status-badge';

const MODEL_NAMES: Record<RunModel, string> = {
  'one-point': 'One point',
  'two-point': 'Two points',
  linear: 'Straight line',
  quadratic: 'Quadratic',
};

const column = dataTableColumns<RunSummaryDto>();

export const runsColumns = column.columns([
  column.accessor('title', {
    header: 'Run',
    cell: (info) => (
      <NameCell
        name={info.getValue()}
        href={paths.runDetail.getHref(info.row.original.id)}
        detail={`${info.row.original.method.name}, version ${info.row.original.versionNumber}`}
      />
    ),
  }),
  column.accessor('status', { header: 'Status', cell: (info) => <RunStatusBadge status={info.getValue()} short /> }),
  column.accessor('model', {
    header: 'Calibration',
    cell: (info) => (
      <Stack gap="0">
        <Text whiteSpace="nowrap">{MODEL_NAMES[info.getValue()]}</Text>
        <Text fontSize="sm" color="fg.muted" whiteSpace="nowrap">
          slope {formatNumber(info.row.original.slope, 4)}
        </Text>
      </Stack>
    ),
  }),
  column.accessor('unknownCount', { header: 'Samples', meta: { align: 'end' } }),
  column.accessor((run) => run.author.name, { id: 'author', header: 'Analyst' }),
  column.accessor('createdAt', {
    header: 'Created',
    meta: { align: 'end' },
    cell: (info) => <Text whiteSpace="nowrap">{formatDateTime(info.getValue())}</Text>,
  }),
]);
