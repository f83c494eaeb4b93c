import { type AuditTrailEntryDto, formatDateTime } from '@meritline/shared';
import { Box, Stack, Text } from '@chakra-ui/react';
import { dataTableColumns } from '@/components/data-table';

const column = dataTableColumns<AuditTrailEntryDto>();

export const auditColumns = column.columns([
  column.accessor('seq', { header: 'No.', meta: { align: 'end' }, cell: (info) => <Text color="fg.muted">{info.getValue()}</Text> }),
  column.accessor('at', {
    header: 'When and who',
    cell: (info) => (
      <Stack gap="0">
        <Text whiteSpace="nowrap" title={info.getValue()}>
          {formatDateTime(info.getValue())}
        </Text>
        <Text fontWeight="600">{info.row.original.actorName}</Text>
      </Stack>
    ),
  }),
  column.accessor('actionText', {
    header: 'What and why',
    cell: (info) => (
      <Stack gap="0.5" width="2xs" whiteSpace="normal">
        <Text fontWeight="600">{info.getValue()}</Text>
        <Text fontSize="sm" color="fg.muted">
          {info.row.original.recordText}
        </Text>
        {info.row.original.reason && (
          <Text fontSize="sm" whiteSpace="pre-wrap" overflowWrap="anywhere">
            <Text as="span" fontWeight="600">
              Reason:
            </Text>{' '}
            {info.row.original.reason}
          </Text>
        )}
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
]);
