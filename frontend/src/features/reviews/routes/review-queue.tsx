import { formatDateTime, type ReviewQueueEntryDto } from '@meritline/shared';
import { Badge, Button, HStack, Link, Stack, Text } from '@chakra-ui/react';
import { useQuery } from '@tanstack/react-query';
import { useState } from 'react';
import { Link as RouterLink } from 'react-router';
import { CursorPager } from '@/components/cursor-pager';
import { DataTable, dataTableColumns } from '@/components/data-table';
import { PageHeader } from '@/components/page-header';
import { paths } from '@/lib/config/paths';
import { reviewQueueQueries } from '../api/review-queries';

/** The queue lists validation studies and routine runs; each item says which. */
type QueueEntry = ReviewQueueEntryDto;
type KindFilter = 'all' | 'study' | 'run';
const KIND_FILTERS: { value: KindFilter; label: string }[] = [
  { value: 'all', label: 'Everything' },
  { value: 'study', label: 'Validation studies' },
  { value: 'run', label: 'Routine runs' },
];

const column = dataTableColumns<QueueEntry>();
const columns = column.columns([
  column.accessor('title', {
    header: 'Item',
    cell: (info) => (
      <Link asChild fontWeight="600" color="brand.fg">
        <RouterLink
          to={
            info.row.original.kind === 'run' ? paths.runDetail.getHref(info.row.original.id) : paths.studyView.getHref(info.row.original.id)
          }
        >
          {info.getValue()}
        </RouterLink>
      </Link>
    ),
  }),
  column.accessor('kind', { header: 'Kind', cell: (info) => (info.getValue() === 'run' ? 'Routine run' : 'Validation study') }),
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
      info.row.original.kind === 'run' ? (
        <Badge colorPalette="orange">Review and release</Badge>
      ) : info.row.original.stage === 'release' ? (
        <Badge colorPalette="purple">Quality release</Badge>
      ) : (
        <Badge colorPalette="orange">Review</Badge>
      ),
  }),
]);

const PAGE_SIZE = 25;

export default function ReviewQueuePage() {
  const [kind, setKind] = useState<KindFilter>('all');
  // The queue pages forward only; the cursors of the pages before are kept to step back.
  const [cursors, setCursors] = useState<(string | undefined)[]>([undefined]);
  const cursor = cursors[cursors.length - 1];
  const queue = useQuery(reviewQueueQueries.list({ kind: kind === 'all' ? undefined : kind, cursor, pageSize: PAGE_SIZE }));
  const showKind = (value: KindFilter) => {
    setKind(value);
    setCursors([undefined]);
  };
  return (
    <>
      <PageHeader
        section="Second person review"
        title="Review queue"
        description="Studies and routine runs submitted by analysts and waiting for your check, oldest first. What you wrote, edited or performed is not listed: a second person must review it."
      />
      <Stack gap="4">
        <HStack gap="2" role="group" aria-label="Show">
          {KIND_FILTERS.map((filter) => (
            <Button
              key={filter.value}
              size="sm"
              variant={kind === filter.value ? 'solid' : 'outline'}
              aria-pressed={kind === filter.value}
              onClick={() => showKind(filter.value)}
            >
              {filter.label}
            </Button>
          ))}
        </HStack>
        <DataTable
          label="Items awaiting review"
          columns={columns}
          query={queue}
          data={queue.data?.items}
          getRowId={(item) => `${item.kind}-${item.id}`}
          emptyTitle="Nothing waits for you"
          emptyDescription="Submitted studies and runs appear here; you are notified when one arrives."
        />
        <CursorPager
          noun="Items"
          query={queue}
          page={queue.data && { ...queue.data, prevCursor: cursors.length > 1 ? 'before' : null }}
          pageNumber={cursors.length}
          onMove={(next, page) => setCursors((trail) => (page < trail.length ? trail.slice(0, page) : [...trail, next]))}
        />
        <Text fontSize="sm" color="fg.muted">
          Approval supports, and does not replace, the laboratory’s procedures, qualified review and the regulations that apply.
        </Text>
      </Stack>
    </>
  );
}
