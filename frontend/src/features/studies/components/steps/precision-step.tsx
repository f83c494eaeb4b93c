import { formatNumber, formatPercent } from '@meritline/shared';
import { Field, Input, Stack, Text } from '@chakra-ui/react';
import { parseDecimal } from '../../utils/parse-number';
import type { DataStepProps } from './calibration-step';
import { useRowExclusion } from './exclusion';
import { FigureLine, LivePanel } from './live-panel';
import { SheetEditor } from './sheet-editor';
import { DataStepLayout, StepSection } from './step-layout';

export function PrecisionStep({ controller, live, units }: DataStepProps) {
  const { draft, editable, change } = controller;
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
    <DataStepLayout>
      <Stack gap="6">
        <StepSection
          title="Precision"
          intro="Results of the same sample measured repeatedly, grouped in series (days, analysts or instruments). Repeatability comes from the scatter within a series, intermediate precision adds the scatter between series."
        >
          <SheetEditor
            controller={controller}
            section="precision"
            sectionName="precision results"
            units={units}
            rowActions={exclusion.rowActions}
          />
        </StepSection>
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
    </DataStepLayout>
  );
}
