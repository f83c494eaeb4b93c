import { formatNumber, formatDateTime, type RunModel, type RunSummaryDto } from '@meritline/shared';
import { Link, Stack, Text } from '@chakra-ui/react';
import { Link as RouterLink } from 'react-router';
import { dataTableColumns } from '@/components/data-table';
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
      <Stack gap="0">
        <Link asChild fontWeight="600" color="brand.fg">
          <RouterLink to={paths.runDetail.getHref(info.row.original.id)}>{info.getValue()}</RouterLink>
        </Link>
        <Text fontSize="sm" color="fg.muted">
          {info.row.original.method.name}, version {info.row.original.versionNumber}
        </Text>
      </Stack>
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
