import { Alert, Button, Field, HStack, List, SimpleGrid, Stack, Text } from '@chakra-ui/react';
import {
  IMPORT_MAPPING_FIELDS,
  IMPORT_MAPPING_LABELS,
  type ImportMappingColumns,
  type ImportMappingField,
  type InstrumentImportData,
} from '@meritline/shared';
import { useQuery, useQueryClient } from '@tanstack/react-query';
import { useFormikContext } from 'formik';
import { useState } from 'react';
import { isApiError } from '@/lib/api-client';
import { SelectControl } from '@/components/select-control';
import type { RunFormValues } from '../api/create-run';
import { uploadInstrumentExport, saveImportMapping } from '../api/instrument-import';
import { runsQueries } from '../api/runs-queries';
import { blanksText, checksText, qcSamplesText, standardsText, unknownsText } from '../utils/measurement-text';

const REQUIRED: ImportMappingField[] = ['sampleId', 'sampleType', 'response'];

/** A first guess from the header words; the analyst confirms or changes each choice. */
const HINTS: Record<ImportMappingField, RegExp> = {
  sampleId: /name|sample ?id|^id$|sample$/i,
  sampleType: /type|kind|role/i,
  response: /area|height|response|signal|abs/i,
  replicate: /inj|rep/i,
  dilution: /dil/i,
  concentration: /amount|conc|nominal|level|known/i,
};

function guess(columns: string[]): Record<ImportMappingField, string> {
  const taken = new Set<string>();
  const out = {} as Record<ImportMappingField, string>;
  for (const field of IMPORT_MAPPING_FIELDS) {
    const hit = columns.find((c) => !taken.has(c) && HINTS[field].test(c)) ?? '';
    if (hit) taken.add(hit);
    out[field] = hit;
  }
  return out;
}

function errorLines(error: unknown): string[] {
  if (!isApiError(error)) return ['The file could not be read.'];
  return error.body.errors?.length ? error.body.errors.map((e) => e.message) : [error.body.message];
}

/** Fill the run from an instrument export: the columns are mapped once per method version and reused. */
export function InstrumentImport({ versionId }: { versionId: string }) {
  const queryClient = useQueryClient();
  const { setFieldValue } = useFormikContext<RunFormValues>();
  const mapping = useQuery(runsQueries.importMapping(versionId));
  const [file, setFile] = useState<File | null>(null);
  const [columns, setColumns] = useState<string[] | null>(null);
  const [choice, setChoice] = useState<Record<ImportMappingField, string> | null>(null);
  const [problems, setProblems] = useState<string[]>([]);
  const [done, setDone] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);

  const fill = (data: InstrumentImportData, rows: number) => {
    void setFieldValue('standards', standardsText(data.standards));
    void setFieldValue('checks', checksText(data.checks));
    void setFieldValue('unknowns', unknownsText(data.unknowns));
    void setFieldValue('blanks', blanksText(data.blanks));
    void setFieldValue('qcSamples', qcSamplesText(data.qcSamples));
    const n = (count: number, one: string, many = `${one}s`) => `${count} ${count === 1 ? one : many}`;
    setDone(
      `Read ${n(rows, 'row')}: ${n(data.standards.length, 'standard reading')}, ${n(data.checks.length, 'check standard')}, ${n(data.unknowns.length, 'sample')}, ${n(data.blanks.length, 'method blank')} and ${n(data.qcSamples.length, 'QC sample')}. Check them below before saving the run.`,
    );
  };

  const read = async (chosen: File) => {
    setBusy(true);
    setProblems([]);
    setDone(null);
    try {
      const result = await uploadInstrumentExport(versionId, chosen);
      setColumns(result.columns);
      if (result.status === 'needs-mapping') setChoice(guess(result.columns));
      else {
        setChoice(null);
        fill(result.data, result.rows);
      }
    } catch (error) {
      setProblems(errorLines(error));
    } finally {
      setBusy(false);
    }
  };

  const save = async () => {
    if (!choice || !file) return;
    const missing = REQUIRED.filter((f) => !choice[f]);
    if (missing.length)
      return setProblems(missing.map((f) => `Choose the column that holds the ${IMPORT_MAPPING_LABELS[f].toLowerCase()}.`));
    setBusy(true);
    try {
      const columnsChosen = Object.fromEntries(IMPORT_MAPPING_FIELDS.map((f) => [f, choice[f] || null])) as unknown as ImportMappingColumns;
      await saveImportMapping(versionId, columnsChosen, mapping.data?.lockVersion ?? 0);
      await queryClient.invalidateQueries({ queryKey: runsQueries.importMapping(versionId).queryKey });
      setChoice(null);
      await read(file);
    } catch (error) {
      setProblems(errorLines(error));
      setBusy(false);
    }
  };

  return (
    <Stack as="section" aria-label="Instrument export" gap="3" borderWidth="1px" borderColor="border" borderRadius="l3" p="4" bg="bg.panel">
      <Text fontWeight="600">Fill from an instrument export (optional)</Text>
      <Text fontSize="sm" color="fg.muted">
        A CSV or XLSX file with one reading per row. Its columns are mapped once for this method version
        {mapping.data?.columns ? ` (mapping saved by ${mapping.data.updatedBy})` : ''} and the same mapping reads the next exports.
      </Text>
      <HStack gap="3" wrap="wrap">
        <input
          type="file"
          accept=".csv,.txt,.tsv,.xlsx,text/csv,application/vnd.openxmlformats-officedocument.spreadsheetml.sheet"
          aria-label="Instrument export (CSV or XLSX)"
          onChange={(e) => {
            const chosen = e.target.files?.[0] ?? null;
            setFile(chosen);
            if (chosen) void read(chosen);
          }}
        />
        {mapping.data?.columns && columns && !choice && (
          <Button size="sm" variant="outline" onClick={() => setChoice(guess(columns))}>
            Map the columns again
          </Button>
        )}
      </HStack>
      {choice && columns && (
        <Stack gap="3">
          <Text fontSize="sm">Which column of this file holds what? Sample types are read as standard, check, blank, QC or sample.</Text>
          <SimpleGrid columns={{ base: 1, md: 3 }} gap="3">
            {IMPORT_MAPPING_FIELDS.map((field) => (
              <Field.Root key={field} required={REQUIRED.includes(field)}>
                <Field.Label>{IMPORT_MAPPING_LABELS[field]}</Field.Label>
                <SelectControl
                  size="sm"
                  value={choice[field]}
                  onChange={(value) => setChoice({ ...choice, [field]: value })}
                  placeholder={REQUIRED.includes(field) ? 'Choose a column' : 'Not in this file'}
                  options={columns.map((c) => ({ value: c, label: c }))}
                />
              </Field.Root>
            ))}
          </SimpleGrid>
          <HStack>
            <Button size="sm" loading={busy} onClick={() => void save()}>
              Save the mapping and read the file
            </Button>
          </HStack>
        </Stack>
      )}
      {problems.length > 0 && (
        <Alert.Root status="error" variant="surface">
          <Alert.Indicator />
          <Alert.Content>
            <Alert.Title>The file was not imported</Alert.Title>
            <Alert.Description>
              <List.Root ps="4">
                {problems.map((p) => (
                  <List.Item key={p}>{p}</List.Item>
                ))}
              </List.Root>
            </Alert.Description>
          </Alert.Content>
        </Alert.Root>
      )}
      {done && (
        <Alert.Root status="success" variant="surface">
          <Alert.Indicator />
          <Alert.Description>{done}</Alert.Description>
        </Alert.Root>
      )}
    </Stack>
  );
}
