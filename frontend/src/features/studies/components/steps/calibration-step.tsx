import { formatNumber } from '@meritline/shared';
import { Badge, HStack, Stack, Text } from '@chakra-ui/react';
import { useQuery } from '@tanstack/react-query';
import { CalibrationPlot, MODEL_LABELS, type CriterionDefinition } from '@/components/study-results';
import { preparationChoicesQueries } from '../../api/preparation-choices-queries';
import type { LiveEvaluation } from '../../hooks/use-live-evaluation';
import type { StudyDraftController } from '../../hooks/use-study-draft';
import { isBlankRow, sectionColumns, type GridRow } from '../../utils/grid-sections';
import { dropRetypedPreparations } from '../../utils/preparation-standards';
import { usableRows } from '../../utils/study-sheets';
import { setSheet, useStandardExclusion } from './exclusion';
import { FigureLine, LivePanel } from './live-panel';
import { SheetEditor } from './sheet-editor';
import { DataStepLayout, StepSection } from './step-layout';
import { PreparationDialog } from './preparation-dialog';

export interface DataStepProps {
  controller: StudyDraftController;
  live: LiveEvaluation;
  units: { x: string; y: string };
  criteria: readonly CriterionDefinition[];
}

export function CalibrationStep({ controller, live, units, criteria }: DataStepProps) {
  const { draft, editable } = controller;
  const exclusion = useStandardExclusion(controller);
  const c = live.result?.calibration;
  const onPointClick = (index: number) => {
    const row = usableRows('standards', draft.data.sheets.standards)[index];
    if (row) exclusion.toggle(row.id);
  };
  const standards = draft.data.sheets.standards;
  const filledStandards = standards.filter((row) => !isBlankRow(row, sectionColumns('standards', units)));
  const fromPreparation = standards.some((row) => row.preparationId);
  const preparations = useQuery({ ...preparationChoicesQueries.list(), enabled: fromPreparation });
  const preparationName = (id: string) => preparations.data?.find((p) => p.id === id)?.name ?? 'a saved preparation';
  const standardActions = (row: GridRow) => (
    <>
      {row.preparationId && (
        <Badge
          size="sm"
          colorPalette="blue"
          variant="subtle"
          maxW="10rem"
          title={`Concentration taken from the standard preparation ${preparationName(row.preparationId)}`}
        >
          <Text as="span" truncate>
            From {preparationName(row.preparationId)}
          </Text>
        </Badge>
      )}
      {exclusion.rowActions(row)}
    </>
  );

  return (
    <DataStepLayout>
      <Stack gap="10">
        <StepSection
          title="Calibration standards"
          intro="One row per measured standard: its concentration and the instrument response. Enter replicates as separate rows with the same concentration."
        >
          <HStack>
            <PreparationDialog
              xUnit={units.x}
              filledRows={filledStandards.length}
              disabled={!editable}
              onFill={(rows, mode) => setSheet(controller, 'standards', mode === 'append' ? [...filledStandards, ...rows] : rows)}
            />
          </HStack>
          <SheetEditor
            controller={controller}
            section="standards"
            sectionName="calibration standards"
            units={units}
            keep={(rows) => dropRetypedPreparations(standards, rows)}
            rowActions={standardActions}
          />
        </StepSection>
        <StepSection
          title="Samples read off the line (optional)"
          size="md"
          intro="One row per reading; rows with the same sample name are replicates of that sample. The dilution factor multiplies the result."
        >
          <SheetEditor controller={controller} section="unknowns" sectionName="samples" units={units} />
        </StepSection>
      </Stack>
      <LivePanel title="Calibration as you type" live={live}>
        {live.result && c && (
          <>
            <CalibrationPlot
              data={live.data}
              result={live.result}
              units={units}
              criteria={criteria}
              height={300}
              compact
              onPointClick={editable ? onPointClick : undefined}
            />
            <Stack gap="0">
              <FigureLine label="Model" value={MODEL_LABELS[c.model] ?? c.model} />
              <FigureLine label="Standards used" value={`${c.n}${c.excluded.length ? ` (${c.excluded.length} excluded)` : ''}`} />
              <FigureLine label="Slope" value={formatNumber(c.slope, 5)} />
              <FigureLine label="Intercept" value={formatNumber(c.intercept, 4)} />
              <FigureLine label="R²" value={formatNumber(c.r2, 6)} />
              <FigureLine label="s(y/x)" value={formatNumber(c.sYX, 4)} />
            </Stack>
            <Text fontSize="xs" color="fg.muted">
              Filled circles: standards used; hollow: excluded; diamonds: samples. Click a point to exclude it, with a reason, or to include
              it again. All figures and the verdict are on the Results step.
            </Text>
          </>
        )}
      </LivePanel>
      {exclusion.dialog}
    </DataStepLayout>
  );
}
