import { Button, Field, Stack, Table, Text, Textarea } from '@chakra-ui/react';
import { useDeferredValue, useState } from 'react';
import { DialogCancel, DialogShell } from '@/components/dialog-shell';
import { FillModeChoice, type FillMode } from './fill-mode-choice';
import { rowsFromPaste } from '../../utils/grid-paste';
import { rowProblems, type GridColumn, type GridRow } from '../../utils/grid-sections';

export interface PasteDialogProps {
  sectionName: string;
  columns: readonly GridColumn[];
  hasRows: boolean;
  onPaste: (rows: GridRow[], mode: FillMode) => void;
  disabled?: boolean;
}

/** Paste a block copied from a spreadsheet: a header row is recognised, decimal commas are read. */
export function PasteDialog({ sectionName, columns, hasRows, onPaste, disabled }: PasteDialogProps) {
  const [open, setOpen] = useState(false);
  const [text, setText] = useState('');
  const [mode, setMode] = useState<FillMode>('replace');
  const deferredText = useDeferredValue(text);
  const parsed = rowsFromPaste(columns, deferredText);
  const problems = parsed.rows.filter((row) => Object.keys(rowProblems(row, columns)).length > 0).length;
  const used = columns.filter((c) => parsed.targets.includes(c.key));

  const close = () => {
    setOpen(false);
    setText('');
  };

  return (
    <DialogShell
      open={open}
      onOpenChange={(next) => (next ? setOpen(true) : close())}
      size="lg"
      trigger={
        <Button size="sm" variant="outline" disabled={disabled}>
          Paste from a spreadsheet
        </Button>
      }
      title={`Paste ${sectionName}`}
      footer={
        <>
          <DialogCancel />
          <Button
            disabled={parsed.rows.length === 0}
            onClick={() => {
              onPaste(rowsFromPaste(columns, text).rows, hasRows ? mode : 'replace');
              close();
            }}
          >
            Put {parsed.rows.length || ''} row{parsed.rows.length === 1 ? '' : 's'} in the grid
          </Button>
        </>
      }
    >
      <Stack gap="4">
        <Text color="fg.muted" fontSize="sm">
          Copy the cells in your spreadsheet and paste them below. Columns in order: {columns.map((c) => c.label).join(', ')}; or a first
          row naming them. Decimal commas are fine.
        </Text>
        <Field.Root>
          <Field.Label>Cells to paste</Field.Label>
          <Textarea
            value={text}
            onChange={(e) => setText(e.target.value)}
            rows={8}
            fontFamily="mono"
            fontSize="sm"
            placeholder={columns.map((c) => c.label).join('\t')}
          />
        </Field.Root>
        {parsed.rows.length > 0 && (
          <Stack gap="2" aria-live="polite">
            <Text fontSize="sm">
              {parsed.rows.length} row{parsed.rows.length === 1 ? '' : 's'} read
              {parsed.header ? ', first row taken as the column names' : ''}.
              {problems > 0 &&
                ` ${problems} with a cell that is not a number or is missing: it will be marked in the grid and not used until corrected.`}
            </Text>
            <Table.ScrollArea position="relative" borderWidth="1px" borderColor="border" borderRadius="l2" maxH="48">
              <Table.Root size="sm" aria-label="Rows to paste">
                <Table.Header>
                  <Table.Row>
                    {used.map((c) => (
                      <Table.ColumnHeader key={c.key}>{c.label}</Table.ColumnHeader>
                    ))}
                  </Table.Row>
                </Table.Header>
                <Table.Body>
                  {parsed.rows.slice(0, 6).map((row) => (
                    <Table.Row key={row.id}>
                      {used.map((c) => (
                        <Table.Cell key={c.key}>{row.cells[c.key] ?? ''}</Table.Cell>
                      ))}
                    </Table.Row>
                  ))}
                </Table.Body>
              </Table.Root>
            </Table.ScrollArea>
          </Stack>
        )}
        {hasRows && <FillModeChoice value={mode} onChange={setMode} appendLabel={'Add after the rows in the grid'} />}
      </Stack>
    </DialogShell>
  );
}
