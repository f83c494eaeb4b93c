import { formatDateTime, type OutboxMessageDto } from '@meritline/shared';
import { Box, Button, Grid, Heading, HStack, Link, Stack, Text } from '@chakra-ui/react';
import { useQuery } from '@tanstack/react-query';
import { Fragment } from 'react';
import { Link as RouterLink, useParams } from 'react-router';
import { DataTable, dataTableColumns } from '@/components/data-table';
import { PageHeader } from '@/components/page-header';
import { QueryError } from '@/components/query-error';
import { paths } from '@/lib/config/paths';
import { outboxQueries } from '../api/outbox-queries';

const column = dataTableColumns<OutboxMessageDto>();

const outboxColumns = column.columns([
  column.accessor('subject', {
    header: 'E-mail',
    cell: (info) => (
      <Stack gap="0.5">
        <Link asChild color="brand.fg" fontWeight="500">
          <RouterLink to={paths.outboxMessage.getHref(info.row.original.id)}>{info.getValue()}</RouterLink>
        </Link>
        <Text fontSize="sm" color="fg.muted" wordBreak="break-all">
          To {info.row.original.to.join(', ')}
        </Text>
      </Stack>
    ),
  }),
  column.accessor('receivedAt', {
    header: 'Sent',
    meta: { align: 'end' },
    cell: (info) => {
      const [date, time] = formatDateTime(info.getValue()).split(' ');
      return (
        <Stack gap="0" fontSize="sm" whiteSpace="nowrap">
          <Text as="span">{date}</Text>
          <Text as="span" color="fg.muted">
            {time} UTC
          </Text>
        </Stack>
      );
    },
  }),
]);

export default function OutboxPage() {
  const { messageId } = useParams();
  const outbox = useQuery(outboxQueries.list());
  const selected = messageId ? outbox.data?.find((message) => message.id === messageId) : undefined;

  return (
    <>
      <PageHeader
        section="Administration"
        title="Outbox"
        description="E-mails Meritline has sent, newest first: invitations and notifications. In this installation they are kept here instead of being delivered."
        actions={
          <Button variant="outline" onClick={() => void outbox.refetch()} loading={outbox.isFetching && !outbox.isPending}>
            Refresh
          </Button>
        }
      />
      {outbox.isError ? (
        <QueryError error={outbox.error} onRetry={() => void outbox.refetch()} />
      ) : (
        <Grid templateColumns={{ base: '1fr', xl: messageId ? 'minmax(0, 2fr) minmax(0, 3fr)' : '1fr' }} gap="6" alignItems="start">
          <DataTable
            label="Sent e-mails"
            columns={outboxColumns}
            data={outbox.data}
            getRowId={(message) => message.id}
            selectedRowId={messageId}
            isLoading={outbox.isPending}
            pageSize={20}
            emptyTitle="No e-mails sent yet"
            emptyDescription="Invitations to new users appear here."
          />
          {messageId && !outbox.isPending && <MessageView message={selected} />}
        </Grid>
      )}
    </>
  );
}

const URL_PATTERN = /(https?:\/\/[^\s<>"]+)/g;

/** Plain text with its web addresses clickable, so an invitation link can be followed from here. */
function TextWithLinks({ text }: { text: string }) {
  return text.split(URL_PATTERN).map((part, index) =>
    index % 2 === 1 ? (
      <Link key={index} href={part} color="brand.fg" wordBreak="break-all">
        {part}
      </Link>
    ) : (
      <Fragment key={index}>{part}</Fragment>
    ),
  );
}

function MessageView({ message }: { message: OutboxMessageDto | undefined }) {
  if (!message) {
    return (
      <Box borderWidth="1px" borderColor="border" borderRadius="l3" bg="bg.panel" p="6">
        <Text color="fg.muted">This e-mail is no longer in the outbox.</Text>
      </Box>
    );
  }
  return (
    <Box as="article" aria-labelledby="message-subject" borderWidth="1px" borderColor="border" borderRadius="l3" bg="bg.panel">
      <Stack gap="3" p="6" borderBottomWidth="1px" borderColor="border">
        <HStack justify="space-between" align="flex-start" gap="4">
          <Heading id="message-subject" as="h2" size="md">
            {message.subject}
          </Heading>
          <Button asChild size="xs" variant="ghost">
            <RouterLink to={paths.outbox.getHref()}>Close</RouterLink>
          </Button>
        </HStack>
        <Grid templateColumns="auto 1fr" columnGap="4" rowGap="1" fontSize="sm">
          <Text color="fg.muted">From</Text>
          <Text>{message.from}</Text>
          <Text color="fg.muted">To</Text>
          <Text>{message.to.join(', ')}</Text>
          <Text color="fg.muted">Sent</Text>
          <Text>{formatDateTime(message.receivedAt)}</Text>
        </Grid>
      </Stack>
      <Text as="pre" data-testid="message-text" p="6" fontFamily="body" fontSize="sm" whiteSpace="pre-wrap" wordBreak="break-word">
        <TextWithLinks text={message.text} />
      </Text>
    </Box>
  );
}
