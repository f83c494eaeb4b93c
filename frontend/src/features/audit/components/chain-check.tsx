import { Alert, Button, List, Stack } from '@chakra-ui/react';
import { auditBreakMeaning, type AuditVerificationDto } from '@meritline/shared';
import { useMutation } from '@tanstack/react-query';
import { QueryError } from '@/components/query-error';
import { verifyChain } from '../api/audit-queries';

/** The chain check with its answer in words: intact over N entries, or each broken entry and what it means. */
export function ChainCheck() {
  const check = useMutation({ mutationFn: verifyChain });
  return (
    <Stack gap="3">
      <Button variant="outline" alignSelf="flex-start" loading={check.isPending} onClick={() => check.mutate()}>
        Verify the chain
      </Button>
      {check.isError && <QueryError error={check.error} onRetry={() => check.mutate()} />}
      {check.data && <ChainAnswer result={check.data} />}
    </Stack>
  );
}

function ChainAnswer({ result }: { result: AuditVerificationDto }) {
  if (result.ok) {
    return (
      <Alert.Root status="success" data-testid="chain-answer">
        <Alert.Indicator />
        <Alert.Content>
          <Alert.Title>The chain is intact over {result.rows} entries</Alert.Title>
          <Alert.Description>
            Every entry links to the one before it and still matches what was written; no entry has been removed since the last signed
            checkpoint.
          </Alert.Description>
        </Alert.Content>
      </Alert.Root>
    );
  }
  return (
    <Alert.Root status="error" data-testid="chain-answer">
      <Alert.Indicator />
      <Alert.Content>
        <Alert.Title>
          The chain is broken: {result.broken.length} finding{result.broken.length === 1 ? '' : 's'} over {result.rows} entries
        </Alert.Title>
        <Alert.Description>
          <List.Root gap="1" mt="2">
            {result.broken.map((b) => (
              <List.Item key={`${b.seq}-${b.reason}`}>
                {b.seq ? `Entry ${b.seq}: ` : ''}
                {auditBreakMeaning(b.reason)} ({b.reason})
              </List.Item>
            ))}
          </List.Root>
          Keep the database as it is and tell your administrator: the trail can no longer be relied on for these entries.
        </Alert.Description>
      </Alert.Content>
    </Alert.Root>
  );
}
