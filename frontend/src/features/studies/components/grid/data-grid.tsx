import { Box, chakra, IconButton, Table, Text } from '@chakra-ui/react';
import { HiddenHeader } from '@/components/data-table';
import { Fragment, useRef, useState, type ClipboardEvent, type KeyboardEvent, type ReactNode } from 'react';
import { pasteIntoRows, isTablePaste } from '../../utils/grid-paste';
import { cellExclusion, excludedCount, isBlankRow, newRowId, rowProblems, type GridColumn, type GridRow } from '../../utils/grid-sections';

export interface DataGridProps {
  /** Names the grid for assistive technology and tests. */
  label: string;
  columns: readonly GridColumn[];
  rows: readonly GridRow[];
  onRowsChange: (rows: GridRow[]) => void;
  readOnly?: boolean;
  /** Extra controls at the end of a row, e.g. exclude a standard. */
  rowActions?: (row: GridRow, index: number) => ReactNode;
}

const CellInput = chakra('input', {
  base: {
    width: 'full',
    minWidth: { base: '5rem', md: '7.5rem' },
    px: '2',
    py: '1.5',
    fontSize: 'sm',
    fontVariantNumeric: 'tabular-nums',
    bg: 'transparent',
    borderWidth: '1px',
    borderColor: 'transparent',
    borderRadius: 'l1',
    outline: 'none',
    _hover: { borderColor: 'border' },
    _focus: { borderColor: 'colorPalette.focusRing', bg: 'bg.panel', boxShadow: '0 0 0 1px var(--chakra-colors-color-palette-focus-ring)' },
    _invalid: { borderColor: 'border.error', bg: 'bg.error' },
    _readOnly: { cursor: 'default', _hover: { borderColor: 'transparent' } },
  },
});

/**
 * A spreadsheet-like grid: type, Tab and Enter move on (Enter down, Shift+Enter up), arrows move
 * between rows, a pasted block of cells spreads from the cell it lands in. The last row is always
 * empty, ready for the next value.
 */
export function DataGrid({ label, columns, rows, onRowsChange, readOnly = false, rowActions }: DataGridProps) {
  const [spareId, setSpareId] = useState(newRowId);
  const gridRef = useRef<HTMLDivElement>(null);
  const shown: GridRow[] = readOnly ? [...rows] : [...rows, { id: spareId, cells: {} }];

  const focusCell = (row: number, column: number) => {
    const target = gridRef.current?.querySelector<HTMLInputElement>(`[data-cell="${row}:${column}"]`);
    target?.focus();
    target?.select();
  };

  const commit = (next: GridRow[]) => {
    if (next.some((row) => row.id === spareId)) setSpareId(newRowId());
    onRowsChange(next);
  };

  const setCell = (rowIndex: number, key: string, value: string) => {
    const next = [...shown];
    next[rowIndex] = { ...next[rowIndex], cells: { ...next[rowIndex].cells, [key]: value } };
    // The spare row becomes a real row as soon as it holds something.
    commit(next.filter((row, i) => i < rows.length || !isBlankRow(row, columns)));
  };

  const removeRow = (rowIndex: number) => onRowsChange(rows.filter((_, i) => i !== rowIndex));

  const onKeyDown = (event: KeyboardEvent<HTMLInputElement>, row: number, column: number) => {
    if (event.key === 'Enter') {
      event.preventDefault();
      focusCell(event.shiftKey ? Math.max(0, row - 1) : Math.min(shown.length - 1, row + 1), column);
    } else if (event.key === 'ArrowDown' && row < shown.length - 1) {
      event.preventDefault();
      focusCell(row + 1, column);
    } else if (event.key === 'ArrowUp' && row > 0) {
      event.preventDefault();
      focusCell(row - 1, column);
    }
  };

  const onPaste = (event: ClipboardEvent<HTMLInputElement>, row: number, column: number) => {
    const text = event.clipboardData.getData('text/plain');
    if (!isTablePaste(text)) return;
    event.preventDefault();
    const { rows: pasted } = pasteIntoRows(
      shown.filter((r, i) => i < rows.length || r.id !== spareId),
      columns,
      text,
      { row, column },
    );
    commit(pasted.filter((r) => !isBlankRow(r, columns) || excludedCount(r) > 0));
  };

  return (
    <Box ref={gridRef} borderWidth="1px" borderColor="border" borderRadius="l3" bg="bg.panel" overflow="hidden">
      <Table.ScrollArea position="relative" maxH="36rem" overflowY="auto">
        <Table.Root size="sm" aria-label={label} stickyHeader>
          <Table.Header>
            <Table.Row bg="bg.subtle">
              <Table.ColumnHeader width="3rem" textAlign="end" color="fg.muted" textStyle="sectionLabel" py="2.5">
                Row
              </Table.ColumnHeader>
              {columns.map((column) => (
                <Table.ColumnHeader
                  key={column.key}
                  py="2.5"
                  color="fg.muted"
                  fontWeight="600"
                  fontSize="xs"
                  minW={{ base: '5.5rem', md: '8rem' }}
                >
                  {column.label}
                  {column.unit && (
                    <Text as="span" fontWeight="400">
                      {' '}
                      ({column.unit})
                    </Text>
                  )}
                  {column.required && (
                    <Text as="span" color="fg.error" aria-hidden="true">
                      {' '}
                      *
                    </Text>
                  )}
                </Table.ColumnHeader>
              ))}
              {!readOnly && (
                <Table.ColumnHeader width="1%" py="2.5">
                  <HiddenHeader>Row actions</HiddenHeader>
                </Table.ColumnHeader>
              )}
            </Table.Row>
          </Table.Header>
          <Table.Body>
            {shown.map((row, r) => {
              const problems = rowProblems(row, columns);
              const spare = !readOnly && r === rows.length;
              const reasons = row.excluded
                ? [`Excluded: ${row.excluded.reason}`]
                : columns.flatMap((c) => {
                    const excluded = row.excludedCells?.[c.key];
                    return excluded ? [`${c.label} excluded: ${excluded.reason}`] : [];
                  });
              return (
                <Fragment key={row.id}>
                  <Table.Row bg={reasons.length ? 'bg.muted' : undefined} data-excluded={reasons.length ? 'true' : undefined}>
                    <Table.Cell textAlign="end" color="fg.muted" fontSize="xs" verticalAlign="top" pt="3">
                      {spare ? '+' : r + 1}
                    </Table.Cell>
                    {columns.map((column, c) => {
                      const problem = problems[column.key];
                      const errorId = `${row.id}-${column.key}-problem`;
                      return (
                        <Table.Cell key={column.key} verticalAlign="top" py="1" px="1">
                          <CellInput
                            data-cell={`${r}:${c}`}
                            aria-label={`${column.label}, row ${r + 1}`}
                            aria-invalid={problem ? true : undefined}
                            aria-describedby={problem ? errorId : undefined}
                            value={row.cells[column.key] ?? ''}
                            placeholder={spare ? (c === 0 ? 'Type or paste here' : undefined) : column.placeholder}
                            readOnly={readOnly}
                            inputMode={column.kind === 'text' ? 'text' : 'decimal'}
                            autoComplete="off"
                            textDecoration={cellExclusion(row, column.key) ? 'line-through' : undefined}
                            onChange={(e) => setCell(r, column.key, e.target.value)}
                            onKeyDown={(e) => onKeyDown(e, r, c)}
                            onPaste={(e) => onPaste(e, r, c)}
                          />
                          {problem && (
                            <Text id={errorId} fontSize="xs" color="fg.error" px="2" pt="0.5">
                              {problem}
                            </Text>
                          )}
                        </Table.Cell>
                      );
                    })}
                    {!readOnly && (
                      <Table.Cell verticalAlign="top" py="1" whiteSpace="nowrap">
                        {!spare && (
                          <Box display="flex" gap="1" alignItems="center" justifyContent="flex-end">
                            {rowActions?.(row, r)}
                            <IconButton
                              size="xs"
                              variant="ghost"
                              aria-label={`Remove row ${r + 1}`}
                              title="Remove the row"
                              onClick={() => removeRow(r)}
                            >
                              ×
                            </IconButton>
                          </Box>
                        )}
                      </Table.Cell>
                    )}
                  </Table.Row>
                  {reasons.length > 0 && (
                    <Table.Row bg="bg.muted">
                      <Table.Cell />
                      <Table.Cell colSpan={columns.length + (readOnly ? 0 : 1)} pt="0" pb="2" px="3" fontSize="xs" color="fg.muted">
                        {/* Wraps and stays in view while the grid scrolls sideways, so that a long reason can be read on a phone. */}
                        <Box position="sticky" left="3" maxW="calc(100vw - 6rem)" whiteSpace="normal" overflowWrap="anywhere">
                          {reasons.map((reason, i) => (
                            <Text key={i}>{reason}</Text>
                          ))}
                        </Box>
                      </Table.Cell>
                    </Table.Row>
                  )}
                </Fragment>
              );
            })}
          </Table.Body>
        </Table.Root>
      </Table.ScrollArea>
    </Box>
  );
}
