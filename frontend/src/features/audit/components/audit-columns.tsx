import { Box, Stack, Text } from '@chakra-ui/react';
import type { AuditTrailEntryDto } from '@meritline/shared';
import { dataTableColumns } from '@/components/data-table';
import { formatDateTime } from '@/lib/format';

const column = dataTableColumns<AuditTrailEntryDto>();

export const auditColumns = column.columns([
  column.accessor('seq', { header: 'No.', meta: { align: 'end' }, cell: (info) => <Text color="fg.muted">{info.getValue()}</Text> }),
  column.accessor('at', {
    header: 'When',
    cell: (info) => (
      <Text whiteSpace="nowrap" title={info.getValue()}>
        {formatDateTime(info.getValue())}
      </Text>
    ),
  }),
  column.accessor('actorName', { header: 'Who' }),
  column.accessor('actionText', {
    header: 'What',
    cell: (info) => (
      <Stack gap="0">
        <Text fontWeight="600">{info.getValue()}</Text>
        <Text fontSize="sm" color="fg.muted">
          {info.row.original.recordText}
        </Text>
      </Stack>
    ),
  }),
  column.accessor('changesInWords', {
    header: 'Old and new values',
    cell: (info) =>
      info.getValue().length ? (
        <Stack gap="1" fontSize="sm" width="xs" whiteSpace="normal">
          {info.getValue().map((change) => (
            <Box key={change.field}>
              <Text as="span" fontWeight="600">
                {change.field}:
              </Text>{' '}
              <Text as="span" color="fg.muted" overflowWrap="anywhere">
                {change.from}
              </Text>{' '}
              →{' '}
              <Text as="span" overflowWrap="anywhere">
                {change.to}
              </Text>
            </Box>
          ))}
        </Stack>
      ) : (
        <Text color="fg.subtle">—</Text>
      ),
  }),
  column.accessor('reason', {
    header: 'Reason',
    cell: (info) => (
      <Text fontSize="sm" whiteSpace="pre-wrap" width="3xs">
        {info.getValue() ?? '—'}
      </Text>
    ),
  }),
]);
