import { formatNumber, type OnePointBias } from '@meritline/shared';
import { useMemo } from 'react';
import { Stack, Text } from '@chakra-ui/react';
import { DataTable, dataTableColumns } from '@/components/data-table';
import { headerWithUnit } from './column-header';

type Item = OnePointBias['items'][number];
const column = dataTableColumns<Item>();

function columnsFor(unit: string) {
  return column.columns([
    column.accessor('id', { header: 'Sample' }),
    column.accessor('onePoint', {
      header: headerWithUnit('One-point reading', unit),
      meta: { align: 'end' },
      cell: (info) => formatNumber(info.getValue(), 4),
    }),
    column.accessor('regression', {
      header: headerWithUnit('Validation line reading', unit),
      meta: { align: 'end' },
      cell: (info) => formatNumber(info.getValue(), 4),
    }),
    column.accessor('bias', {
      header: headerWithUnit('Bias', unit),
      meta: { align: 'end' },
      cell: (info) => formatNumber(info.getValue(), 3),
    }),
    column.accessor('biasPct', {
      header: 'Bias (%)',
      meta: { align: 'end' },
      cell: (info) => {
        const pct = info.getValue();
        return pct === null ? '—' : `${pct > 0 ? '+' : ''}${pct.toFixed(1)} %`;
      },
    }),
  ]);
}

/** What forcing the line through the origin costs at each sample, against the validation's straight line. */
export function OnePointBiasTable({ bias, unit }: { bias: OnePointBias; unit: string }) {
  const columns = useMemo(() => columnsFor(unit), [unit]);
  return (
    <Stack gap="3" data-testid="one-point-bias">
      <Text color="fg.muted">
        The validation's straight line crosses the response axis at the equivalent of {formatNumber(bias.interceptAsConcentration, 3)}{' '}
        {unit}. Drawn through today's standard, it reads each sample as below; the difference is the bias the one-point line makes. It is
        zero at the standard and grows with the distance from it, so keep the samples near the standard's concentration.
      </Text>
      <DataTable label="Bias of the one-point line" columns={columns} data={bias.items} getRowId={(b) => b.id} />
    </Stack>
  );
}
