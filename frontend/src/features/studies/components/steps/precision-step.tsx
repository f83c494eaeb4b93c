import { formatNumber, formatPercent } from '@meritline/shared';
import { Field, Grid, Heading, Input, Stack, Text } from '@chakra-ui/react';
import { parseDecimal } from '../../utils/parse-number';
import { SectionEditor } from '../grid/section-editor';
import type { DataStepProps } from './calibration-step';
import { setSheet, useRowExclusion } from './exclusion';
import { FigureLine, LivePanel } from './live-panel';

export function PrecisionStep({ controller, live, units }: DataStepProps) {
  const { draft, server, editable, prepareImport, adopt, change } = controller;
  const exclusion = useRowExclusion(controller, 'precision');
  const p = live.result?.precision;
  const massFraction = draft.data.settings.massFraction;
  const parsed = parseDecimal(massFraction);
  const massFractionProblem =
    massFraction.trim() === ''
      ? null
      : parsed === null
        ? 'Not a number'
        : parsed <= 0 || parsed > 1
          ? 'A mass fraction lies above 0 and at most 1'
          : null;

  return (
    <Grid templateColumns={{ base: 'minmax(0, 1fr)', xl: 'minmax(0, 3fr) minmax(20rem, 2fr)' }} gap="8" alignItems="start">
      <Stack gap="6">
        <Stack gap="3">
          <Heading as="h2" size="lg">
            Precision
          </Heading>
          <Text color="fg.muted">
            Results of the same sample measured repeatedly, grouped in series (days, analysts or instruments). Repeatability comes from the
            scatter within a series, intermediate precision adds the scatter between series.
          </Text>
          <SectionEditor
            studyId={server.id}
            section="precision"
            sectionName="precision results"
            units={units}
            rows={draft.data.sheets.precision}
            onRowsChange={(rows) => setSheet(controller, 'precision', rows)}
            readOnly={!editable}
            prepareImport={prepareImport}
            onImported={adopt}
            rowActions={exclusion.rowActions}
          />
        </Stack>
        <Field.Root invalid={Boolean(massFractionProblem)} maxW="md" readOnly={!editable}>
          <Field.Label>Analyte mass fraction, for the Horwitz comparison (optional)</Field.Label>
          <Input
            value={massFraction}
            inputMode="decimal"
            placeholder="e.g. 5e-6 for 5 mg/kg"
            onChange={(e) => change((d) => ({ ...d, data: { ...d.data, settings: { ...d.data.settings, massFraction: e.target.value } } }))}
          />
          {massFractionProblem ? (
            <Field.ErrorText>{massFractionProblem}</Field.ErrorText>
          ) : (
            <Field.HelperText>As a fraction: 1 mg/kg = 1e-6 (about 1 mg/L in water); 1 % = 0.01.</Field.HelperText>
          )}
        </Field.Root>
      </Stack>
      <LivePanel title="Precision as you type" live={live}>
        {p ? (
          <Stack gap="0">
            <FigureLine
              label="Series / results used"
              value={`${p.k} / ${p.N}${p.excluded?.length ? ` (${p.excluded.length} excluded)` : ''}`}
            />
            <FigureLine label="Grand mean" value={`${formatNumber(p.grandMean, 5)} ${units.x}`} />
            <FigureLine label="Repeatability SD (RSD)" value={`${formatNumber(p.sR, 4)} (${formatPercent(p.rsdR, 3)})`} />
            <FigureLine label="Intermediate precision SD (RSD)" value={`${formatNumber(p.sI, 4)} (${formatPercent(p.rsdI, 3)})`} />
            {p.horwitz && <FigureLine label="HorRat" value={formatNumber(p.horwitz.horRat, 3)} />}
          </Stack>
        ) : (
          <Text fontSize="sm" color="fg.muted">
            Precision needs at least two series, one of them with replicate results.
          </Text>
        )}
      </LivePanel>
      {exclusion.dialog}
    </Grid>
  );
}
