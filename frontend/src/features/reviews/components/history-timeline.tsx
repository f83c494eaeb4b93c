import { formatDateTime } from '@meritline/shared';
import { Badge, Box, HStack, Stack, Text } from '@chakra-ui/react';
import { STATUS_LABELS, type HistoryItem } from '../api/review-types';

const KIND_COLOURS: Record<HistoryItem['kind'], string> = { status: 'brand', signature: 'green', comment: 'orange', record: 'gray' };
const KIND_LABELS: Record<HistoryItem['kind'], string> = { status: 'Status', signature: 'Signature', comment: 'Comment', record: 'Record' };

function statusChange(item: HistoryItem): string | null {
  const change = item.changes?.status;
  if (!change) return null;
  const label = (value: unknown) =>
    typeof value === 'string' && value in STATUS_LABELS ? STATUS_LABELS[value as keyof typeof STATUS_LABELS] : 'New';
  return change.from === change.to ? null : `${label(change.from)} → ${label(change.to)}`;
}

/** Everything that happened to the study, oldest first, as the audit trail and signatures record it. */
export function HistoryTimeline({ items }: { items: readonly HistoryItem[] }) {
  if (!items.length) return <Text color="fg.muted">Nothing recorded yet.</Text>;
  return (
    <Stack as="ol" listStyleType="none" gap="0" borderLeftWidth="2px" borderColor="border" ml="2">
      {items.map((item) => {
        const change = statusChange(item);
        return (
          <Box as="li" key={item.id} position="relative" pl="6" pb="5" data-testid="history-item">
            <Box position="absolute" left="-7px" top="1.5" boxSize="3" borderRadius="full" bg={`${KIND_COLOURS[item.kind]}.solid`} />
            <HStack gap="2" wrap="wrap">
              <Badge colorPalette={KIND_COLOURS[item.kind]} variant="subtle">
                {KIND_LABELS[item.kind]}
              </Badge>
              <Text fontWeight="600">{item.summary}</Text>
              {item.valid === false && (
                <Badge colorPalette="red" variant="solid">
                  Broken signature
                </Badge>
              )}
            </HStack>
            <Text fontSize="sm" color="fg.muted">
              {item.actorName} · {formatDateTime(item.at)}
              {change && ` · ${change}`}
            </Text>
            {item.detail && (
              <Text fontSize="sm" mt="1" whiteSpace="pre-wrap">
                {item.lines?.length ? `Reason: ${item.detail}` : item.detail}
              </Text>
            )}
            {item.lines && item.lines.length > 0 && (
              <Box as="ul" fontSize="sm" mt="1" ps="5" listStyleType="disc" overflowWrap="anywhere" data-testid="history-changes">
                {item.lines.map((line, index) => (
                  <li key={index}>{line}</li>
                ))}
              </Box>
            )}
          </Box>
        );
      })}
    </Stack>
  );
}
