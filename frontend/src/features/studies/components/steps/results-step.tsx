import { Alert, Box, Button, Field, Grid, Heading, HStack, Stack, Text } from '@chakra-ui/react';
import { ENGINE_VERSION, MODELS, type CalibrationModel, type Weighting, formatNumber, formatPercent } from '@meritline/shared';
import { DataTable, dataTableColumns, HiddenHeader } from '@/components/data-table';
import { SelectControl } from '@/components/select-control';
import {
  CalibrationPlot,
  MODEL_LABELS,
  ResidualPlot,
  StudyFigures,
  StudyFlags,
  VerdictSummary,
  WEIGHTING_LABELS,
} from '@/components/study-results';
import type { LiveEvaluation } from '../../hooks/use-live-evaluation';
import type { StudyDraftController } from '../../hooks/use-study-draft';
import { resultDifferences } from '../../utils/compare-results';
import { usableRows } from '../../utils/study-sheets';
import type { DataStepProps } from './calibration-step';
import { useStandardExclusion } from './exclusion';

const MODEL_CHOICES = MODELS.map((m) => ({ value: m, label: MODEL_LABELS[m] ?? m }));
const WEIGHTING_CHOICES: Weighting[] = ['none', '1/x', '1/x2'];
const CONFIDENCE_CHOICES = [0.9, 0.95, 0.99].map((c) => ({ value: String(c), label: `${c * 100} %` }));
const weightable = (model: CalibrationModel) => model === 'linear' || model === 'quadratic';

interface StandardRow {
  id: string;
  number: number;
  x: string;
  y: string;
  xBack: number | null;
  rePct: number | null;
  reason: string | null;
  canToggle: boolean;
  toggle: () => void;
}

const column = dataTableColumns<StandardRow>();
const standardColumns = column.columns([
  column.accessor('number', { header: 'Row', meta: { align: 'end' } }),
  column.accessor('x', { header: 'Concentration', meta: { align: 'end' } }),
  column.accessor('y', { header: 'Response', meta: { align: 'end' } }),
  column.accessor('xBack', { header: 'Back-calculated', meta: { align: 'end' }, cell: (info) => formatNumber(info.getValue(), 5) }),
  column.accessor('rePct', { header: 'Deviation', meta: { align: 'end' }, cell: (info) => formatPercent(info.getValue(), 3) }),
  column.accessor('reason', {
    header: 'Used?',
    cell: (info) =>
      info.getValue() === null ? (
        'Used'
      ) : (
        <Text as="span" color="fg.muted">
          Excluded: {info.getValue()}
        </Text>
      ),
  }),
  column.display({
    id: 'action',
    header: () => <HiddenHeader>Action</HiddenHeader>,
    meta: { align: 'end' },
    cell: (info) =>
      info.row.original.canToggle && (
        <Button size="xs" variant="outline" onClick={info.row.original.toggle}>
          {info.row.original.reason === null ? 'Exclude…' : 'Include again'}
        </Button>
      ),
  }),
]);

function ServerCheck({ controller, live }: { controller: StudyDraftController; live: LiveEvaluation }) {
  const { state, server } = controller;
  if (state.kind === 'pending' || state.kind === 'saving' || live.isUpdating) {
    return (
      <Alert.Root status="neutral" variant="subtle" size="sm">
        <Alert.Indicator />
        <Alert.Description>Figures computed in your browser. The server checks them when the draft is saved.</Alert.Description>
      </Alert.Root>
    );
  }
  if (state.kind !== 'saved') return null;
  if (!server.result) {
    return (
      <Alert.Root status="info" variant="subtle" size="sm">
        <Alert.Indicator />
        <Alert.Description>
          The server has no result for the saved data yet
          {server.resultErrors?.length ? `: ${server.resultErrors.map((e) => e.message).join('; ')}` : '.'}
        </Alert.Description>
      </Alert.Root>
    );
  }
  const differences = resultDifferences(live.result, server.result);
  if (differences.length > 0) {
    return (
      <Alert.Root status="warning" variant="subtle" size="sm" data-testid="server-differs">
        <Alert.Indicator />
        <Alert.Description>
          The server's result for the saved data differs from the browser's in: {differences.join(', ')}. The server's result is the one on
          record (engine {server.engineVersion}; this browser runs {ENGINE_VERSION}). Reload the page to see it.
        </Alert.Description>
      </Alert.Root>
    );
  }
  return (
    <Alert.Root status="success" variant="subtle" size="sm" data-testid="server-agrees">
      <Alert.Indicator />
      <Alert.Description>The server computed the same figures for the saved data (engine {server.engineVersion}).</Alert.Description>
    </Alert.Root>
  );
}

export function ResultsStep({ controller, live, units, criteria }: DataStepProps) {
  const { draft, editable, change } = controller;
  const exclusion = useStandardExclusion(controller);
  const settings = draft.data.settings;
  const result = live.result;

  const setSettings = (next: Partial<typeof settings>) =>
    change((d) => {
      const merged = { ...d.data.settings, ...next };
      if (!weightable(merged.model)) merged.weighting = 'none';
      return { ...d, data: { ...d.data, settings: merged } };
    });

  const used = usableRows('standards', draft.data.sheets.standards);
  const backCalculated = new Map((result?.calibration?.backCalculated ?? []).map((b) => [b.index, b]));
  const standardRows: StandardRow[] = used.map((row, i) => ({
    id: row.id,
    number: i + 1,
    x: row.cells.x,
    y: row.cells.y,
    xBack: backCalculated.get(i)?.xBack ?? null,
    rePct: backCalculated.get(i)?.rePct ?? null,
    reason: row.excluded?.reason ?? null,
    canToggle: editable,
    toggle: () => exclusion.toggle(row.id),
  }));
  const onPointClick = (index: number) => {
    const row = used[index];
    if (row) exclusion.toggle(row.id);
  };

  return (
    <Stack gap="10">
      <HStack gap="4" wrap="wrap" align="flex-end" borderWidth="1px" borderColor="border" borderRadius="l3" bg="bg.panel" p="4">
        <Field.Root maxW="18rem" disabled={!editable}>
          <Field.Label>Calibration model</Field.Label>
          <SelectControl
            value={settings.model}
            onChange={(value) => setSettings({ model: value as CalibrationModel })}
            options={MODEL_CHOICES}
          />
        </Field.Root>
        <Field.Root maxW="14rem" disabled={!editable || !weightable(settings.model)}>
          <Field.Label>Weighting</Field.Label>
          <SelectControl
            value={settings.weighting}
            onChange={(value) => setSettings({ weighting: value as Weighting })}
            options={WEIGHTING_CHOICES.map((w) => ({ value: w, label: WEIGHTING_LABELS[w] }))}
          />
        </Field.Root>
        <Field.Root maxW="12rem" disabled={!editable}>
          <Field.Label>Confidence level</Field.Label>
          <SelectControl
            value={String(settings.confidence)}
            onChange={(value) => setSettings({ confidence: Number(value) })}
            options={CONFIDENCE_CHOICES}
          />
        </Field.Root>
        <Box flex="1" minW="16rem">
          <ServerCheck controller={controller} live={live} />
        </Box>
      </HStack>

      {!result ? (
        <Alert.Root status="info">
          <Alert.Indicator />
          <Alert.Content>
            <Alert.Title>No results yet</Alert.Title>
            {live.errors.map((e, i) => (
              <Alert.Description key={i}>{e.message.charAt(0).toUpperCase() + e.message.slice(1)}.</Alert.Description>
            ))}
          </Alert.Content>
        </Alert.Root>
      ) : (
        <>
          <VerdictSummary result={result} criteria={criteria} />
          <Stack gap="3">
            <Heading as="h2" size="lg">
              Points to check
            </Heading>
            <StudyFlags result={result} units={units} />
          </Stack>
          <Grid templateColumns={{ base: 'minmax(0, 1fr)', xl: 'minmax(0, 3fr) minmax(0, 2fr)' }} gap="6">
            <Stack gap="2">
              <Heading as="h2" size="lg">
                Calibration
              </Heading>
              <CalibrationPlot
                data={live.data}
                result={result}
                units={units}
                criteria={criteria}
                onPointClick={editable ? onPointClick : undefined}
              />
            </Stack>
            <Stack gap="2">
              <Heading as="h2" size="lg">
                Residuals
              </Heading>
              <ResidualPlot result={result} units={units} />
            </Stack>
          </Grid>
          <Stack gap="3">
            <Heading as="h2" size="lg">
              Standards
            </Heading>
            <Text color="fg.muted" fontSize="sm">
              Exclude a standard here or by clicking its point in the plot; a reason is required and the exclusion can be undone.
            </Text>
            <DataTable
              label="Standards and their back-calculated concentrations"
              columns={standardColumns}
              data={standardRows}
              getRowId={(row) => row.id}
              pageSize={20}
            />
          </Stack>
          <Stack gap="3">
            <Heading as="h2" size="lg">
              Figures of merit
            </Heading>
            <StudyFigures data={live.data} result={result} units={units} criteria={criteria} />
          </Stack>
        </>
      )}
      {exclusion.dialog}
    </Stack>
  );
}
