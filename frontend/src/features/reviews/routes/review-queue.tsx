import { Badge, Link, Stack, Text } from '@chakra-ui/react';
import { useQuery } from '@tanstack/react-query';
import { Link as RouterLink } from 'react-router';
import { DataTable, dataTableColumns } from '@/components/data-table';
import { PageHeader } from '@/components/page-header';
import { QueryError } from '@/components/query-error';
import { paths } from '@/lib/config/paths';
import { formatDateTime } from '@/lib/format';
import { reviewQueueQueries } from '../api/review-queries';
import type { QueueItem } from '../api/review-types';

const column = dataTableColumns<QueueItem>();
const columns = column.columns([
  column.accessor('title', {
    header: 'Study',
    cell: (info) => (
      <Link asChild fontWeight="600" color="brand.fg">
        <RouterLink to={paths.studyView.getHref(info.row.original.id)}>{info.getValue()}</RouterLink>
      </Link>
    ),
  }),
  column.accessor('methodName', {
    header: 'Method',
    cell: (info) => (
      <Stack gap="0">
        <Text>{info.getValue()}</Text>
        <Text fontSize="xs" color="fg.muted">
          Version {info.row.original.methodVersionNumber}
        </Text>
      </Stack>
    ),
  }),
  column.accessor('authorName', { header: 'Author' }),
  column.accessor('submittedAt', { header: 'Submitted', cell: (info) => formatDateTime(info.getValue()) }),
  column.accessor('stage', {
    header: 'Waiting for',
    cell: (info) =>
      info.getValue() === 'release' ? <Badge colorPalette="purple">Quality release</Badge> : <Badge colorPalette="orange">Review</Badge>,
  }),
]);

export default function ReviewQueuePage() {
  const queue = useQuery(reviewQueueQueries.list());
  return (
    <>
      <PageHeader
        section="Second person review"
        title="Review queue"
        description="Studies submitted by analysts and waiting for your check, oldest first. Studies you wrote or edited are not listed: a second person must review them."
      />
      <Stack gap="4">
        {queue.isError ? (
          <QueryError error={queue.error} onRetry={() => void queue.refetch()} />
        ) : (
          <DataTable
            label="Studies awaiting review"
            columns={columns}
            data={queue.data}
            getRowId={(item) => item.id}
            isLoading={queue.isPending}
            pageSize={25}
            emptyTitle="Nothing waits for you"
            emptyDescription="Submitted studies appear here; you are notified when one arrives."
          />
        )}
        <Text fontSize="sm" color="fg.muted">
          Approval supports, and does not replace, the laboratory’s procedures, qualified review and the regulations that apply.
        </Text>
      </Stack>
    </>
  );
}
