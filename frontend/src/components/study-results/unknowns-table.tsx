import { type EvaluationResult, formatInterval, formatNumber, type UnknownFlag, type UnknownResult } from '@meritline/shared';
import { DataTable, dataTableColumns } from '@/components/data-table';

const FLAG_WORDS: Record<UnknownFlag, string> = {
  belowRange: 'below the lowest standard',
  aboveRange: 'above the highest standard',
  belowLod: 'below LOD',
  belowLoq: 'below LOQ',
};

const column = dataTableColumns<UnknownResult>();
const columns = column.columns([
  column.accessor('id', { header: 'Sample' }),
  column.accessor('m', { header: 'Readings', meta: { align: 'end' } }),
  column.accessor('yMean', { header: 'Mean response', meta: { align: 'end' }, cell: (info) => formatNumber(info.getValue(), 5) }),
  column.accessor('dilution', { header: 'Dilution', meta: { align: 'end' }, cell: (info) => formatNumber(info.getValue(), 4) }),
  column.accessor('x0', { header: 'Result', meta: { align: 'end' }, cell: (info) => formatNumber(info.getValue(), 4) }),
  column.accessor('ci', { header: 'Confidence interval', cell: (info) => formatInterval(info.getValue(), 4) }),
  column.accessor('flags', {
    header: 'Flags',
    cell: (info) =>
      info
        .getValue()
        .map((f) => FLAG_WORDS[f] ?? f)
        .join('; ') || '—',
  }),
]);

/** Samples read off the calibration, dilution applied. */
export function UnknownsTable({ result, unit }: { result: EvaluationResult; unit?: string }) {
  return (
    <DataTable
      label={unit ? `Samples read off the calibration (${unit})` : 'Samples read off the calibration'}
      columns={columns}
      data={result.unknowns ?? []}
      getRowId={(row) => row.id}
    />
  );
}
