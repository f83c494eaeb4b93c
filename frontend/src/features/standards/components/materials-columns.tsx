import { Stack, Text } from '@chakra-ui/react';
import type { ReferenceMaterialDto } from '@meritline/shared';
import { dataTableColumns, HiddenHeader } from '@/components/data-table';
import { NameCell } from '@/components/name-cell';
import { certifiedValueWords } from './certified-value';
import { MaterialActions } from './material-actions';
import { MaterialStatus } from './material-status';

const column = dataTableColumns<ReferenceMaterialDto>();

export const materialsColumns = column.columns([
  column.accessor('name', {
    header: 'Material',
    sortFn: 'text',
    cell: (info) => (
      <NameCell name={info.getValue()} detail={`${info.row.original.analyte} · ${info.row.original.supplier}`} minW="13rem" />
    ),
  }),
  column.accessor('lot', {
    header: 'Lot and certificate',
    sortFn: 'text',
    cell: (info) => (
      <Stack gap="0">
        <Text>Lot {info.getValue()}</Text>
        <Text fontSize="sm" color="fg.muted">
          Certificate {info.row.original.certificateNumber}
        </Text>
      </Stack>
    ),
  }),
  column.accessor((m) => certifiedValueWords(m), {
    id: 'value',
    header: 'Certified value',
    enableSorting: false,
    cell: (info) => (
      <Text whiteSpace="normal" minW="10rem">
        {info.getValue()}
      </Text>
    ),
  }),
  column.accessor('expiresOn', {
    header: 'Status',
    sortFn: 'text',
    cell: (info) => (
      <Stack gap="1" minW="12rem">
        <MaterialStatus material={info.row.original} />
        {info.row.original.withdrawnReason && (
          <Text fontSize="sm" whiteSpace="normal" maxW="16rem">
            {info.row.original.withdrawnReason}
          </Text>
        )}
        <Text fontSize="xs" color="fg.muted">
          Use until {info.getValue()}
        </Text>
      </Stack>
    ),
  }),
  column.display({
    id: 'actions',
    header: () => <HiddenHeader>Actions</HiddenHeader>,
    meta: { align: 'end' },
    cell: (info) => <MaterialActions material={info.row.original} />,
  }),
]);
