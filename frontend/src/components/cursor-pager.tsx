import { Button, HStack, Text } from '@chakra-ui/react';
import type { KeysetPage } from '@meritline/shared';
import type { UseQueryResult } from '@tanstack/react-query';

type PagerPage = Pick<KeysetPage<unknown>, 'items' | 'nextCursor' | 'prevCursor' | 'pageSize'> &
  Partial<Pick<KeysetPage<unknown>, 'total' | 'totalIsCapped'>>;

/**
 * The pager reads the page the query answered (and shows nothing before it has); a list that keeps its cursors itself
 * hands it the page as it should read it.
 */
type CursorPagerProps = {
  /** Plural noun of the rows, e.g. "Studies". */
  noun: string;
  /** 1-based position of the page, kept beside the cursor for the words only. */
  pageNumber: number;
  onMove: (cursor: string | undefined, pageNumber: number) => void;
} & ({ query: UseQueryResult<PagerPage>; page?: undefined } | { query: UseQueryResult<unknown>; page: PagerPage | undefined });

/** Previous and next for a list paged by cursor, with the rows shown and the (capped) count. */
export function CursorPager({ noun, query, page: ownPage, pageNumber, onMove }: CursorPagerProps) {
  const page = ownPage ?? (query.data as PagerPage | undefined);
  if (!page) return null;
  const fetching = query.isFetching;
  // The rows shown belong to the query before (a new sort or filter is loading): their cursors do not apply.
  const stale = query.isPlaceholderData;
  const number = page.prevCursor ? Math.max(2, pageNumber) : 1;
  if (!page.items.length && number === 1) return null;
  const first = (number - 1) * page.pageSize + 1;
  const last = first + page.items.length - 1;
  const of = page.total === undefined ? '' : page.totalIsCapped ? ` of more than ${page.total}` : ` of ${page.total}`;
  return (
    <HStack justify="space-between">
      <Text fontSize="sm" color="fg.muted" aria-live="polite">
        {noun} {first}–{last}
        {of}
        {fetching && ' · updating…'}
      </Text>
      <HStack gap="2">
        <Button
          size="sm"
          variant="outline"
          disabled={stale || !page.prevCursor}
          onClick={() => onMove(number - 1 <= 1 ? undefined : (page.prevCursor ?? undefined), number - 1)}
        >
          Previous
        </Button>
        <Button
          size="sm"
          variant="outline"
          disabled={stale || !page.nextCursor}
          onClick={() => onMove(page.nextCursor ?? undefined, number + 1)}
        >
          Next
        </Button>
      </HStack>
    </HStack>
  );
}
