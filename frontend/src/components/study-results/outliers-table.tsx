import { type EvaluationResult, formatNumber, type OutlierFlag } from '@meritline/shared';
import { HStack, Text } from '@chakra-ui/react';
import { DataTable, dataTableColumns } from '@/components/data-table';
import { FailsIcon, MeetsIcon } from './icons';

export const OUTLIER_TESTS: Record<OutlierFlag['test'], string> = {
  grubbs: 'Grubbs, two-sided',
  dixon: 'Dixon r10',
  cochran: "Cochran's C (replicate variances)",
  standardizedResidual: 'Standardised residual above 3',
};

const column = dataTableColumns<OutlierFlag & { id: string }>();
const columns = column.columns([
  column.accessor('set', { header: 'Values tested' }),
  column.accessor('test', { header: 'Test', cell: (info) => OUTLIER_TESTS[info.getValue()] ?? info.getValue() }),
  column.accessor('value', { header: 'Suspect value', meta: { align: 'end' }, cell: (info) => formatNumber(info.getValue(), 5) }),
  column.accessor('statistic', { header: 'Statistic', meta: { align: 'end' }, cell: (info) => formatNumber(info.getValue(), 4) }),
  column.accessor('critical', { header: 'Critical value', meta: { align: 'end' }, cell: (info) => formatNumber(info.getValue(), 4) }),
  column.accessor('outlier', {
    header: 'Outcome',
    cell: (info) =>
      info.getValue() ? (
        <HStack as="span" gap="1.5" color="red.fg" fontWeight="600" whiteSpace="nowrap">
          <FailsIcon />
          <Text as="span">Possible outlier</Text>
        </HStack>
      ) : (
        <HStack as="span" gap="1.5" color="green.fg" whiteSpace="nowrap">
          <MeetsIcon />
          <Text as="span">No outlier</Text>
        </HStack>
      ),
  }),
]);

/** Outlier tests flag values only: nothing is removed without an analyst's written reason. */
export function OutliersTable({ result }: { result: EvaluationResult }) {
  const rows = (result.outliers ?? []).map((flag, i) => ({ ...flag, id: `${i}` }));
  return (
    <DataTable
      label="Outlier tests"
      columns={columns}
      data={rows}
      getRowId={(row) => row.id}
      sortable
      initialSorting={[{ id: 'outlier', desc: true }]}
      pageSize={12}
      emptyTitle="No set was large enough for an outlier test"
    />
  );
}
