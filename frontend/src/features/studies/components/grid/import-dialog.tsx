import { NOT_DETECTED_WORDS, type ImportPreviewDto, type ImportSection, type StudyDto } from '@meritline/shared';
import { Alert, Button, Field, HStack, List, SimpleGrid, Spinner, Stack, Table, Text } from '@chakra-ui/react';
import { useState } from 'react';
import { DialogCancel, DialogShell } from '@/components/dialog-shell';
import { isApiError } from '@/lib/api-client';
import { SelectControl } from '@/components/select-control';
import { useApplyImport, usePreviewImport } from '../../api/import-study-file';

interface ImportField {
  key: string;
  label: string;
  required?: boolean;
}

/** The fields the server reads for each section, in the words of the grid. */
const IMPORT_FIELDS: Record<ImportSection, ImportField[]> = {
  standards: [
    { key: 'x', label: 'Concentration', required: true },
    { key: 'y', label: 'Response', required: true },
    { key: 'id', label: 'Identifier' },
  ],
  blanks: [{ key: 'value', label: 'Blank response', required: true }],
  recovery: [
    { key: 'id', label: 'Spike' },
    { key: 'level', label: 'Level' },
    { key: 'added', label: 'Added', required: true },
    { key: 'found', label: 'Found', required: true },
    { key: 'native', label: 'Native' },
  ],
  precision: [
    { key: 'group', label: 'Series', required: true },
    { key: 'value', label: 'Result', required: true },
  ],
  accuracy: [
    { key: 'level', label: 'Level', required: true },
    { key: 'series', label: 'Series', required: true },
    { key: 'nominal', label: 'Nominal', required: true },
    { key: 'found', label: 'Found', required: true },
  ],
  unknowns: [
    { key: 'id', label: 'Sample', required: true },
    { key: 'y', label: 'Response' },
    { key: 'dilution', label: 'Dilution factor' },
  ],
  lowSpikes: [
    { key: 'spiked', label: 'Low-level spike result' },
    { key: 'blank', label: 'Method blank result' },
  ],
};

function fieldsFor(section: ImportSection, preview: ImportPreviewDto | undefined): ImportField[] {
  const known = IMPORT_FIELDS[section];
  const replicates = Object.keys(preview?.mapping ?? {})
    .filter((key) => !known.some((f) => f.key === key))
    .map((key) => ({ key, label: key.replace(/^y(\d+)$/, 'Response $1') }));
  return [...known, ...replicates];
}

const cellText = (value: unknown): string => {
  if (value === null) return NOT_DETECTED_WORDS;
  if (Array.isArray(value)) return value.map(cellText).join(', ');
  if (typeof value === 'object' && value !== undefined) return 'excluded' in (value as object) ? 'excluded' : JSON.stringify(value);
  return value === undefined ? '' : String(value);
};

/** The rows the server would import, as a small table. */
function previewTable(section: ImportSection, rows: unknown[]): { headers: string[]; body: string[][] } {
  if (section === 'lowSpikes') {
    const spikes = (rows[0] ?? {}) as { spiked?: number[]; blanks?: (number | null)[] };
    const length = Math.max(spikes.spiked?.length ?? 0, spikes.blanks?.length ?? 0);
    return {
      headers: ['Spiked', 'Blank'],
      body: Array.from({ length }, (_, i) => [
        cellText(spikes.spiked?.[i]),
        i < (spikes.blanks?.length ?? 0) ? cellText(spikes.blanks?.[i]) : '',
      ]),
    };
  }
  if (rows.every((row) => typeof row === 'number')) return { headers: ['Value'], body: rows.map((row) => [cellText(row)]) };
  const headers = [...new Set(rows.flatMap((row) => Object.keys(row as object)))];
  return { headers, body: rows.map((row) => headers.map((h) => cellText((row as Record<string, unknown>)[h]))) };
}

export interface ImportDialogProps {
  studyId: string;
  section: ImportSection;
  sectionName: string;
  /** Saves pending edits and answers the lock version (and the reason, for a returned study) to import against. */
  prepare: () => Promise<{ lockVersion: number; reason?: string } | null>;
  onImported: (study: StudyDto) => void;
  disabled?: boolean;
}

/** Upload a CSV or XLSX file: the server previews it, the analyst checks the column mapping, then imports. */
export function ImportDialog({ studyId, section, sectionName, prepare, onImported, disabled }: ImportDialogProps) {
  const [open, setOpen] = useState(false);
  const [file, setFile] = useState<File | null>(null);
  const preview = usePreviewImport(studyId);
  const apply = useApplyImport(studyId);
  const [applyError, setApplyError] = useState<string | null>(null);

  const reset = () => {
    setFile(null);
    setApplyError(null);
    preview.reset();
    apply.reset();
  };

  const choose = (chosen: File | undefined) => {
    reset();
    if (!chosen) return;
    setFile(chosen);
    preview.mutate({ file: chosen, section });
  };

  const data = preview.data;
  const fields = fieldsFor(section, data);
  const remap = (key: string, column: string) => {
    if (!file || !data) return;
    const mapping: Record<string, string | null> = {};
    for (const f of fields) mapping[f.key] = f.key === key ? column || null : (data.mapping[f.key] ?? null);
    preview.mutate({ file, section, mapping });
  };

  const importRows = async () => {
    if (!file || !data) return;
    setApplyError(null);
    const target = await prepare();
    if (!target) {
      setApplyError('The draft could not be saved first, so nothing was imported. See the message at the top of the page.');
      return;
    }
    const mapping = Object.fromEntries(fields.map((f) => [f.key, data.mapping[f.key] ?? null]));
    try {
      const study = await apply.mutateAsync({ file, section, mapping, ...target });
      onImported(study);
      setOpen(false);
      reset();
    } catch (error) {
      if (isApiError(error) && error.status === 409)
        setApplyError('Someone else saved this study meanwhile; nothing was imported. Reload the study, then import again.');
      else if (isApiError(error)) setApplyError([error.body.message, ...(error.body.errors ?? []).map((e) => e.message)].join(' '));
      else setApplyError('The file could not be imported. Try again.');
    }
  };

  const table = data && data.errors.length === 0 ? previewTable(section, data.rows) : null;
  const previewError = preview.error && isApiError(preview.error) ? preview.error : null;
  const count = data?.rowCount ?? 0;

  return (
    <DialogShell
      open={open}
      onOpenChange={(next) => {
        setOpen(next);
        if (!next) reset();
      }}
      size="xl"
      scrollBehavior="inside"
      trigger={
        <Button size="sm" variant="outline" disabled={disabled}>
          Upload CSV or Excel
        </Button>
      }
      title={`Upload ${sectionName}`}
      footer={
        <>
          <DialogCancel />
          <Button
            onClick={() => void importRows()}
            disabled={!data || data.errors.length > 0 || preview.isPending}
            loading={apply.isPending}
          >
            Import {count > 0 ? `${count} row${count === 1 ? '' : 's'}` : ''}
          </Button>
        </>
      }
    >
      <Stack gap="5">
        <Text fontSize="sm" color="fg.muted">
          A CSV file (separated by commas, semicolons or tabs) or an Excel workbook (.xlsx, first sheet), with a first row naming the
          columns. Meritline reads the file and shows what it found before anything changes. Importing replaces the {sectionName} of this
          study.
        </Text>
        <Field.Root>
          <Field.Label>File</Field.Label>
          <input
            type="file"
            accept=".csv,.txt,.tsv,.xlsx,text/csv,application/vnd.openxmlformats-officedocument.spreadsheetml.sheet"
            aria-label="File to upload"
            onChange={(e) => choose(e.target.files?.[0])}
          />
        </Field.Root>
        {preview.isPending && (
          <HStack gap="2" role="status">
            <Spinner size="sm" />
            <Text>Reading the file…</Text>
          </HStack>
        )}
        {previewError && (
          <Alert.Root status="error">
            <Alert.Indicator />
            <Alert.Content>
              <Alert.Title>{previewError.body.message}</Alert.Title>
              {previewError.body.errors?.map((e, i) => (
                <Alert.Description key={i}>{e.message}</Alert.Description>
              ))}
            </Alert.Content>
          </Alert.Root>
        )}
        {data && (
          <Stack gap="4">
            <Stack gap="2">
              <Text fontWeight="600">Columns</Text>
              <Text fontSize="sm" color="fg.muted">
                Which column of the file holds what. Meritline guessed from the column names; change any that is wrong.
              </Text>
              <SimpleGrid columns={{ base: 1, md: 3 }} gap="3">
                {fields.map((f) => (
                  <Field.Root key={f.key} required={f.required}>
                    <Field.Label>
                      {f.label}
                      {f.required && <Field.RequiredIndicator />}
                    </Field.Label>
                    <SelectControl
                      size="sm"
                      disabled={preview.isPending}
                      value={data.mapping[f.key] ?? ''}
                      onChange={(value) => remap(f.key, value)}
                      placeholder="Not in the file"
                      options={data.columns.map((column) => ({ value: column, label: column }))}
                    />
                  </Field.Root>
                ))}
              </SimpleGrid>
            </Stack>
            {data.errors.length > 0 ? (
              <Alert.Root status="error">
                <Alert.Indicator />
                <Alert.Content>
                  <Alert.Title>
                    The file cannot be imported as it is ({data.errors.length} problem{data.errors.length === 1 ? '' : 's'}). Correct the
                    mapping above or the file.
                  </Alert.Title>
                  <List.Root as="ul" ps="4" fontSize="sm">
                    {data.errors.map((e, i) => (
                      <List.Item key={i}>{e.message}</List.Item>
                    ))}
                  </List.Root>
                </Alert.Content>
              </Alert.Root>
            ) : (
              table && (
                <Stack gap="2">
                  <Text fontWeight="600">
                    {count} row{count === 1 ? '' : 's'} read{table.body.length > 10 ? '; the first 10:' : ':'}
                  </Text>
                  <Table.ScrollArea position="relative" borderWidth="1px" borderColor="border" borderRadius="l2">
                    <Table.Root size="sm" aria-label="Rows found in the file">
                      <Table.Header>
                        <Table.Row>
                          {table.headers.map((h) => (
                            <Table.ColumnHeader key={h}>{h}</Table.ColumnHeader>
                          ))}
                        </Table.Row>
                      </Table.Header>
                      <Table.Body>
                        {table.body.slice(0, 10).map((row, i) => (
                          <Table.Row key={i}>
                            {row.map((cell, j) => (
                              <Table.Cell key={j}>{cell}</Table.Cell>
                            ))}
                          </Table.Row>
                        ))}
                      </Table.Body>
                    </Table.Root>
                  </Table.ScrollArea>
                </Stack>
              )
            )}
          </Stack>
        )}
        {applyError && (
          <Alert.Root status="error">
            <Alert.Indicator />
            <Alert.Description>{applyError}</Alert.Description>
          </Alert.Root>
        )}
      </Stack>
    </DialogShell>
  );
}
