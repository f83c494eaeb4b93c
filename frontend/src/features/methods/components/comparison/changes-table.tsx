import { Text } from '@chakra-ui/react';
import { useMemo } from 'react';
import type { VersionChangeRow } from '@meritline/shared';
import { DataTable, dataTableColumns } from '@/components/data-table';

const column = dataTableColumns<VersionChangeRow>();

const sideCell = (value: string | null, changed: boolean) => (
  <Text whiteSpace="normal" minW="12rem" maxW="28rem" fontWeight={changed ? '600' : '400'} color={value === null ? 'fg.muted' : undefined}>
    {value ?? '—'}
  </Text>
);

export function changesColumns(fromLabel: string, toLabel: string) {
  return column.columns([
    column.accessor('aspect', {
      header: 'Aspect',
      cell: (info) => (
        <Text whiteSpace="normal" minW="10rem">
          {info.getValue()}
        </Text>
      ),
    }),
    column.accessor('from', { header: fromLabel, cell: (info) => sideCell(info.getValue(), info.row.original.changed) }),
    column.accessor('to', { header: toLabel, cell: (info) => sideCell(info.getValue(), info.row.original.changed) }),
    column.accessor('changed', {
      header: 'Changed',
      cell: (info) => (info.getValue() ? <Text fontWeight="600">Changed</Text> : <Text color="fg.muted">Same</Text>),
    }),
  ]);
}

export function ChangesTable({ rows, fromLabel, toLabel }: { rows: VersionChangeRow[]; fromLabel: string; toLabel: string }) {
  const columns = useMemo(() => changesColumns(fromLabel, toLabel), [fromLabel, toLabel]);
  return <DataTable label="What changed between the versions" columns={columns} data={rows} getRowId={(row) => row.aspect} />;
}
