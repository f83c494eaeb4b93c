import { Stack } from '@chakra-ui/react';
import { AccuracyProfilePlot, AccuracyProfileTables, TruenessSummary } from './accuracy-profile';
import { CalibrationTable, LevelsTable, LinearityTable } from './calibration-figures';
import { DetectionExclusions, DetectionTable } from './detection-table';
import { FigureSection } from './figure-section';
import { judgeCriteria } from './judge-criteria';
import { OutliersTable } from './outliers-table';
import { PrecisionAnovaTable, PrecisionFiguresTable, PrecisionSeriesTable } from './precision-tables';
import { RecoveryItemsTable, RecoveryTable } from './recovery-table';
import type { StudyResultsProps } from './types';
import { UncertaintyTables } from './uncertainty-tables';
import { UnknownsTable } from './unknowns-table';
import { WorkingRange } from './working-range';

/** Every figure of merit the engine computed, each beside its criterion and outcome. Read-only. */
export function StudyFigures({ data, result, units, criteria }: StudyResultsProps) {
  const judged = judgeCriteria(criteria, result);
  const hasLinearityTests = Boolean(
    result.lackOfFit || result.mandel || result.interceptTest || result.throughOrigin || result.homoscedasticity,
  );
  return (
    <Stack gap="10">
      <FigureSection
        id="fig-calibration"
        title="Calibration line"
        sections={['calibration']}
        result={result}
        available={Boolean(result.calibration)}
      >
        <CalibrationTable result={result} units={units} judged={judged} />
      </FigureSection>
      <FigureSection
        id="fig-levels"
        title="Standard levels and back-calculation"
        description="Each level's replicate scatter, and the concentration the line gives back for it."
        sections={[]}
        result={result}
        available={Boolean(result.calibration)}
      >
        <LevelsTable result={result} units={units} />
      </FigureSection>
      <FigureSection
        id="fig-linearity"
        title="Linearity, intercept and variance tests"
        sections={['lackOfFit', 'mandel', 'interceptTest', 'throughOrigin', 'homoscedasticity']}
        result={result}
        available={hasLinearityTests}
      >
        <LinearityTable result={result} units={units} judged={judged} />
      </FigureSection>
      <FigureSection
        id="fig-detection"
        title="Detection and quantitation limits"
        description={`All approaches the data allow, side by side, in concentration units${units.x ? ` (${units.x})` : ''}.`}
        sections={['detection']}
        result={result}
        available={Boolean(result.detection)}
      >
        <DetectionTable result={result} units={units} judged={judged} />
        <DetectionExclusions result={result} units={units} />
      </FigureSection>
      {result.unknowns && (
        <FigureSection id="fig-unknowns" title="Samples read off the calibration" sections={['unknowns']} result={result} available>
          <UnknownsTable result={result} unit={units.x} />
        </FigureSection>
      )}
      <FigureSection id="fig-recovery" title="Recovery" sections={['recovery']} result={result} available={Boolean(result.recovery)}>
        <RecoveryTable result={result} judged={judged} />
        <RecoveryItemsTable result={result} />
      </FigureSection>
      <FigureSection id="fig-precision" title="Precision" sections={['precision']} result={result} available={Boolean(result.precision)}>
        <PrecisionFiguresTable result={result} units={units} judged={judged} />
        <PrecisionAnovaTable result={result} />
        <PrecisionSeriesTable result={result} />
      </FigureSection>
      {(data.accuracy || result.accuracyProfile) && (
        <FigureSection
          id="fig-accuracy-profile"
          title="Accuracy profile"
          description="Total error at each level: the relative bias and the β-expectation tolerance limits, judged against the acceptance limits."
          sections={['accuracyProfile']}
          result={result}
          available={Boolean(result.accuracyProfile)}
        >
          <AccuracyProfilePlot result={result} units={units} />
          <AccuracyProfileTables result={result} units={units} judged={judged} />
        </FigureSection>
      )}
      {(data.referenceMaterial || result.trueness) && (
        <FigureSection
          id="fig-trueness"
          title="Trueness against the reference material"
          sections={['trueness']}
          result={result}
          available={Boolean(result.trueness)}
        >
          <TruenessSummary result={result} units={units} judged={judged} />
        </FigureSection>
      )}
      {(data.uncertainty || data.accuracy || result.uncertainty) && (
        <FigureSection
          id="fig-uncertainty"
          title="Measurement uncertainty"
          description="Top-down, from the validation data: within-laboratory reproducibility and the uncertainty of the bias."
          sections={['uncertainty']}
          result={result}
          available={Boolean(result.uncertainty)}
        >
          <UncertaintyTables result={result} units={units} judged={judged} />
        </FigureSection>
      )}
      <FigureSection
        id="fig-outliers"
        title="Outlier tests"
        description="The tests flag values only; nothing is removed."
        sections={['outliers']}
        result={result}
        available={Boolean(result.outliers && result.outliers.length > 0)}
      >
        <OutliersTable result={result} />
      </FigureSection>
      <FigureSection id="fig-range" title="Working range" sections={['range']} result={result} available={Boolean(result.range)}>
        <WorkingRange result={result} units={units} />
      </FigureSection>
    </Stack>
  );
}
