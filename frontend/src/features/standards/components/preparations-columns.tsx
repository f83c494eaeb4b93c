import { formatDateTime, type PreparationDto } from '@meritline/shared';
import { Stack, Text } from '@chakra-ui/react';
import { dataTableColumns } from '@/components/data-table';
import { NameCell } from '@/components/name-cell';
import { concentrationWords } from './concentration-words';

const column = dataTableColumns<PreparationDto>();

export const preparationsColumns = column.columns([
  column.accessor('name', {
    header: 'Preparation',
    sortFn: 'text',
    cell: (info) => {
      const { material } = info.row.original;
      return <NameCell name={info.getValue()} detail={material ? `${material.name}, lot ${material.lot}` : 'Purity entered by hand'} />;
    },
  }),
  column.accessor((p) => p.result.stock.concentration, {
    id: 'stock',
    header: 'Stock',
    enableSorting: false,
    cell: (info) => {
      const { stock } = info.row.original.result;
      return concentrationWords(stock.concentration, stock.u, stock.unit);
    },
  }),
  column.accessor((p) => p.steps.length, {
    id: 'standards',
    header: 'Working standards',
    enableSorting: false,
    cell: (info) => {
      const { steps, stock } = info.row.original.result;
      return (
        <Stack gap="0" fontSize="sm">
          {steps.map((s, i) => (
            <Text key={i}>
              {i + 1}: {concentrationWords(s.concentration, s.u, stock.unit)}
            </Text>
          ))}
        </Stack>
      );
    },
  }),
  column.accessor('createdAt', {
    header: 'Saved',
    sortFn: 'datetime',
    meta: { align: 'end' },
    cell: (info) => (
      <Stack gap="0" align="flex-end">
        <Text>{formatDateTime(info.getValue())}</Text>
        <Text fontSize="sm" color="fg.muted">
          {info.row.original.createdBy.name}
        </Text>
      </Stack>
    ),
  }),
]);
