import { formatNumber, type RunCheck } from '@meritline/shared';
import { useMemo } from 'react';
import { Badge } from '@chakra-ui/react';
import { DataTable, dataTableColumns } from '@/components/data-table';
import { headerWithUnit } from './column-header';

const column = dataTableColumns<RunCheck>();

function columnsFor(xUnit: string, yUnit: string) {
  return column.columns([
    column.accessor('id', { header: 'Check standard' }),
    column.accessor('nominal', {
      header: headerWithUnit('Nominal', xUnit),
      meta: { align: 'end' },
      cell: (info) => formatNumber(info.getValue(), 6),
    }),
    column.accessor('yMean', {
      header: headerWithUnit('Mean response', yUnit),
      meta: { align: 'end' },
      cell: (info) => formatNumber(info.getValue(), 5),
    }),
    column.accessor('found', {
      header: headerWithUnit('Found', xUnit),
      meta: { align: 'end' },
      cell: (info) => formatNumber(info.getValue(), 4),
    }),
    column.accessor('recoveryPct', { header: 'Recovery', meta: { align: 'end' }, cell: (info) => `${info.getValue().toFixed(1)} %` }),
    column.accessor('pass', {
      header: 'Outcome',
      cell: (info) =>
        info.getValue() ? (
          <Badge colorPalette="brand" variant="subtle">
            Within the window
          </Badge>
        ) : (
          <Badge colorPalette="red" variant="solid">
            Outside the window
          </Badge>
        ),
    }),
  ]);
}

export function ChecksTable({ checks, xUnit, yUnit }: { checks: RunCheck[]; xUnit: string; yUnit: string }) {
  const columns = useMemo(() => columnsFor(xUnit, yUnit), [xUnit, yUnit]);
  return <DataTable label="Check standards" columns={columns} data={checks} getRowId={(c) => c.id} />;
}
