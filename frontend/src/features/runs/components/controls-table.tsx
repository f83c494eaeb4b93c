import { formatNumber, type RunBlankResult, type RunQcSampleResult, type RunQcWindow } from '@meritline/shared';
import { Badge, Stack, Text } from '@chakra-ui/react';
import { useMemo } from 'react';
import { DataTable, dataTableColumns } from '@/components/data-table';
import { headerWithUnit } from './column-header';

const outcome = (pass: boolean, ok: string, bad: string) =>
  pass ? (
    <Badge colorPalette="brand" variant="subtle">
      {ok}
    </Badge>
  ) : (
    <Badge colorPalette="red" variant="solid">
      {bad}
    </Badge>
  );

const blankColumn = dataTableColumns<RunBlankResult>();
const qcColumn = dataTableColumns<RunQcSampleResult>();

/** Method blanks and QC samples of known value, each with its verdict in words. */
export function ControlsTables({
  blanks,
  qcSamples,
  window,
  xUnit,
}: {
  blanks: RunBlankResult[];
  qcSamples: RunQcSampleResult[];
  window: RunQcWindow | undefined;
  xUnit: string;
}) {
  const blankColumns = useMemo(
    () =>
      blankColumn.columns([
        blankColumn.accessor('id', { header: 'Method blank' }),
        blankColumn.accessor('found', {
          header: headerWithUnit('Found', xUnit),
          meta: { align: 'end' },
          cell: (info) => formatNumber(info.getValue(), 3),
        }),
        blankColumn.accessor('limit', {
          header: headerWithUnit('Must stay below', xUnit),
          meta: { align: 'end' },
          cell: (info) =>
            `${formatNumber(info.getValue(), 3)} (${info.row.original.limitBasis === 'lod' ? 'LOD of the validation' : 'set limit'})`,
        }),
        blankColumn.accessor('pass', {
          header: 'Outcome',
          cell: (info) => outcome(info.getValue(), 'Below the limit', 'Not below the limit'),
        }),
      ]),
    [xUnit],
  );
  const qcColumns = useMemo(
    () =>
      qcColumn.columns([
        qcColumn.accessor('id', { header: 'QC sample' }),
        qcColumn.accessor('known', {
          header: headerWithUnit('Known', xUnit),
          meta: { align: 'end' },
          cell: (info) => formatNumber(info.getValue(), 6),
        }),
        qcColumn.accessor('found', {
          header: headerWithUnit('Found', xUnit),
          meta: { align: 'end' },
          cell: (info) => formatNumber(info.getValue(), 4),
        }),
        qcColumn.accessor('recoveryPct', { header: 'Recovery', meta: { align: 'end' }, cell: (info) => `${info.getValue().toFixed(1)} %` }),
        qcColumn.accessor('pass', {
          header: 'Outcome',
          cell: (info) => outcome(info.getValue(), 'Within the window', 'Outside the window'),
        }),
      ]),
    [xUnit],
  );
  return (
    <Stack gap="3">
      {blanks.length > 0 && <DataTable label="Method blanks" columns={blankColumns} data={blanks} getRowId={(b) => b.id} />}
      {qcSamples.length > 0 && (
        <>
          <DataTable label="QC samples" columns={qcColumns} data={qcSamples} getRowId={(q) => q.id} />
          {window && (
            <Text fontSize="sm" color="fg.muted">
              QC samples must recover {window.low} to {window.high} % of their known value ({window.basis}).
            </Text>
          )}
        </>
      )}
    </Stack>
  );
}
