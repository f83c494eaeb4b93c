import { useMemo } from 'react';
import { Badge, Stack, Text } from '@chakra-ui/react';
import { DataTable, dataTableColumns } from '@/components/data-table';
import { formatNumber } from '@/components/study-results';
import type { RunUnknown } from '../api/types';

const column = dataTableColumns<RunUnknown>();

function columnsFor(xUnit: string, yUnit: string, confidencePct: number) {
  return column.columns([
    column.accessor('id', { header: 'Sample', cell: (info) => <Text fontWeight="500">{info.getValue()}</Text> }),
    column.accessor('m', { header: 'Readings', meta: { align: 'end' } }),
    column.accessor('yMean', { header: `Mean response (${yUnit})`, meta: { align: 'end' }, cell: (info) => formatNumber(info.getValue(), 5) }),
    column.accessor('dilution', { header: 'Dilution', meta: { align: 'end' }, cell: (info) => formatNumber(info.getValue(), 4) }),
    column.accessor('x0', { header: `Read off the line (${xUnit})`, meta: { align: 'end' }, cell: (info) => formatNumber(info.getValue(), 4) }),
    column.accessor('ci', {
      header: `${confidencePct} % interval`,
      meta: { align: 'end' },
      cell: (info) => {
        const ci = info.getValue();
        return ci ? `${formatNumber(ci[0], 4)} to ${formatNumber(ci[1], 4)}` : <Text color="fg.muted">none</Text>;
      },
    }),
    column.accessor('reported', {
      header: 'Reported',
      meta: { align: 'end' },
      cell: (info) => (
        <Stack gap="1" align="flex-end">
          <Text fontWeight="600" whiteSpace="nowrap" textDecoration={info.row.original.reportable ? undefined : 'line-through'}>
            {info.getValue()}
          </Text>
          {!info.row.original.reportable && (
            <Badge colorPalette="red" variant="subtle">
              Not reportable
            </Badge>
          )}
        </Stack>
      ),
    }),
    column.accessor('remarks', {
      header: 'Remarks',
      cell: (info) =>
        info.getValue().length ? (
          <Stack gap="1" maxW="md" fontSize="sm">
            {info.getValue().map((remark) => (
              <Text key={remark}>{remark}</Text>
            ))}
          </Stack>
        ) : (
          <Text color="fg.muted">—</Text>
        ),
    }),
  ]);
}

export function ResultsTable({ unknowns, xUnit, yUnit, confidence }: { unknowns: RunUnknown[]; xUnit: string; yUnit: string; confidence: number }) {
  const columns = useMemo(() => columnsFor(xUnit, yUnit, Math.round(confidence * 100)), [xUnit, yUnit, confidence]);
  return <DataTable label="Sample results" columns={columns} data={unknowns} getRowId={(u) => u.id} />;
}
