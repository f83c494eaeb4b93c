import { Box, Button, chakra, EmptyState, HStack, Skeleton, Table, Text, VStack } from '@chakra-ui/react';
import {
  createColumnHelper,
  createPaginatedRowModel,
  createSortedRowModel,
  metaHelper,
  rowPaginationFeature,
  rowSortingFeature,
  sortFn_alphanumeric,
  sortFn_basic,
  sortFn_datetime,
  sortFn_text,
  tableFeatures,
  useTable,
  type ColumnDef,
  type RowData,
  type SortingState,
} from '@tanstack/react-table';
import type { UseQueryResult } from '@tanstack/react-query';
import type { ReactNode } from 'react';
import { QueryError } from './query-error';

export interface DataTableColumnMeta {
  /** Numbers and dates line up on the right, as in a lab notebook. */
  align?: 'start' | 'end';
}

export const dataTableFeatures = tableFeatures({
  rowSortingFeature,
  sortedRowModel: createSortedRowModel(),
  sortFns: { alphanumeric: sortFn_alphanumeric, text: sortFn_text, datetime: sortFn_datetime, basic: sortFn_basic },
  rowPaginationFeature,
  paginatedRowModel: createPaginatedRowModel(),
  columnMeta: metaHelper<DataTableColumnMeta>(),
});

export type DataTableFeatures = typeof dataTableFeatures;

/** Column definitions for a DataTable: `const column = dataTableColumns<UserDto>()` then `column.columns([...])`. */
export const dataTableColumns = <TData extends RowData>() => createColumnHelper<DataTableFeatures, TData>();

// eslint-disable-next-line @typescript-eslint/no-explicit-any -- each column keeps its own value type
export type DataTableColumns<TData extends RowData> = ReadonlyArray<ColumnDef<DataTableFeatures, TData, any>>;

interface DataTableBaseProps<TData extends RowData> {
  /** Names the table for assistive technology (and tests). */
  label: string;
  /** Keep the array stable: declare it at module scope or memoize it. */
  columns: DataTableColumns<TData>;
  getRowId?: (row: TData) => string;
  /** Highlights the row whose id (from `getRowId`) is shown in a detail view beside the table. */
  selectedRowId?: string;
  isLoading?: boolean;
  emptyTitle?: string;
  emptyDescription?: ReactNode;
  /** Click a header to sort the rows in the browser. */
  sortable?: boolean;
  initialSorting?: SortingState;
  /** Split the rows into pages of this size in the browser; all rows on one page when left out. */
  pageSize?: number;
}

/** The rows, or the query that loads them: placeholder rows while it is pending, its error with a retry in place of the table when it fails. */
type DataTableRows<TData extends RowData> =
  { data: readonly TData[] | undefined; query?: UseQueryResult<unknown> } | { query: UseQueryResult<readonly TData[]>; data?: undefined };

export type DataTableProps<TData extends RowData> = DataTableBaseProps<TData> & DataTableRows<TData>;

const NO_ROWS: never[] = [];

export function DataTable<TData extends RowData>({
  label,
  columns,
  data,
  getRowId,
  selectedRowId,
  isLoading: loading = false,
  query,
  emptyTitle = 'Nothing here yet',
  emptyDescription,
  sortable = false,
  initialSorting = [],
  pageSize,
}: DataTableProps<TData>) {
  const table = useTable({
    features: dataTableFeatures,
    columns: columns as ColumnDef<DataTableFeatures, TData>[],
    data: (data ?? (query?.data as readonly TData[] | undefined) ?? NO_ROWS) as TData[],
    getRowId: getRowId ? (row) => getRowId(row) : undefined,
    enableSorting: sortable,
    manualPagination: pageSize === undefined,
    initialState: { sorting: initialSorting, pagination: { pageIndex: 0, pageSize: pageSize ?? Number.MAX_SAFE_INTEGER } },
  });

  if (query?.isError) return <QueryError error={query.error} onRetry={() => void query.refetch()} />;
  const isLoading = loading || query?.isPending === true;
  const rows = table.getRowModel().rows;
  const columnCount = table.getAllLeafColumns().length;
  const { pageIndex } = table.state.pagination;
  const rowCount = table.getRowCount();

  return (
    <Box borderWidth="1px" borderColor="border" borderRadius="l3" bg="bg.panel" overflow="hidden">
      <Table.ScrollArea position="relative">
        <Table.Root size="md" aria-label={label} aria-busy={isLoading || undefined} interactive={rows.length > 0}>
          <Table.Header>
            {table.getHeaderGroups().map((headerGroup) => (
              <Table.Row key={headerGroup.id} bg="bg.subtle">
                {headerGroup.headers.map((header) => {
                  const align = header.column.columnDef.meta?.align === 'end' ? 'end' : 'start';
                  const sorted = header.column.getIsSorted();
                  const canSort = header.column.getCanSort();
                  return (
                    <Table.ColumnHeader
                      key={header.id}
                      textAlign={align}
                      textStyle="sectionLabel"
                      // Headers carry units (mg/L, µS·min) whose case is meaningful.
                      textTransform="none"
                      // Long headers wrap rather than push the last columns out of sight (the scroll area keeps cells on one line).
                      whiteSpace="normal"
                      letterSpacing="0.04em"
                      color="fg.muted"
                      py="3"
                      aria-sort={sorted === 'asc' ? 'ascending' : sorted === 'desc' ? 'descending' : canSort ? 'none' : undefined}
                    >
                      {header.isPlaceholder ? null : canSort ? (
                        <SortButton
                          width="full"
                          whiteSpace="nowrap"
                          onClick={header.column.getToggleSortingHandler()}
                          justifyContent={align === 'end' ? 'flex-end' : 'flex-start'}
                        >
                          <table.FlexRender header={header} />
                          <SortArrow direction={sorted || undefined} />
                        </SortButton>
                      ) : (
                        <table.FlexRender header={header} />
                      )}
                    </Table.ColumnHeader>
                  );
                })}
              </Table.Row>
            ))}
          </Table.Header>
          <Table.Body>
            {isLoading ? (
              [0, 1, 2].map((index) => (
                <Table.Row key={index}>
                  <Table.Cell colSpan={columnCount}>
                    <Skeleton height="5" />
                  </Table.Cell>
                </Table.Row>
              ))
            ) : rows.length === 0 ? (
              <Table.Row>
                <Table.Cell colSpan={columnCount}>
                  <EmptyState.Root size="sm">
                    <EmptyState.Content>
                      <VStack textAlign="center" gap="1">
                        <EmptyState.Title>{emptyTitle}</EmptyState.Title>
                        {emptyDescription && <EmptyState.Description>{emptyDescription}</EmptyState.Description>}
                      </VStack>
                    </EmptyState.Content>
                  </EmptyState.Root>
                </Table.Cell>
              </Table.Row>
            ) : (
              rows.map((row) => (
                <Table.Row
                  key={row.id}
                  aria-current={row.id === selectedRowId ? 'true' : undefined}
                  css={{ '&[aria-current=true]': { bg: 'brand.subtle' } }}
                >
                  {row.getAllCells().map((cell) => (
                    <Table.Cell key={cell.id} textAlign={cell.column.columnDef.meta?.align === 'end' ? 'end' : 'start'} py="3">
                      <table.FlexRender cell={cell} />
                    </Table.Cell>
                  ))}
                </Table.Row>
              ))
            )}
          </Table.Body>
        </Table.Root>
      </Table.ScrollArea>
      {pageSize !== undefined && rowCount > pageSize && (
        <HStack justify="space-between" px="4" py="3" borderTopWidth="1px" borderColor="border">
          <Text fontSize="sm" color="fg.muted">
            Rows {pageIndex * pageSize + 1}–{Math.min((pageIndex + 1) * pageSize, rowCount)} of {rowCount}
          </Text>
          <HStack gap="2">
            <Button size="xs" variant="outline" onClick={() => table.previousPage()} disabled={!table.getCanPreviousPage()}>
              Previous
            </Button>
            <Button size="xs" variant="outline" onClick={() => table.nextPage()} disabled={!table.getCanNextPage()}>
              Next
            </Button>
          </HStack>
        </HStack>
      )}
    </Box>
  );
}

/** A header that sorts its column when clicked; the server-sorted lists use it too. */
export const SortButton = chakra('button', {
  base: {
    display: 'inline-flex',
    alignItems: 'center',
    gap: '1.5',
    font: 'inherit',
    letterSpacing: 'inherit',
    textTransform: 'inherit',
    color: 'inherit',
    cursor: 'pointer',
    borderRadius: 'l1',
    _hover: { color: 'fg' },
    _focusVisible: { outline: '2px solid', outlineColor: 'colorPalette.focusRing', outlineOffset: '2px' },
  },
});

/** Which way a column is sorted, for the eye; the header's aria-sort or label says it in words. */
export function SortArrow({ direction }: { direction: 'asc' | 'desc' | undefined }) {
  return (
    <Text as="span" aria-hidden="true" color={direction ? 'brand.fg' : 'fg.subtle'}>
      {direction === 'asc' ? '↑' : direction === 'desc' ? '↓' : '↕'}
    </Text>
  );
}

/** A header in words for assistive technology only; positioned, so that the hidden words stay inside the table's scroll area. */
export function HiddenHeader({ children }: { children: ReactNode }) {
  return (
    <Text as="span" position="relative">
      <Text as="span" srOnly>
        {children}
      </Text>
    </Text>
  );
}
