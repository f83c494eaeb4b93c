import {
  type CalibrationLevel,
  type EvaluationResult,
  formatInterval,
  formatLevel,
  formatNumber,
  formatPercent,
  pText,
  withUnit,
} from '@meritline/shared';
import { Text } from '@chakra-ui/react';
import { DataTable, dataTableColumns } from '@/components/data-table';
import { CriterionMark } from './criterion-mark';
import { FiguresTable, type FigureRow } from './figures-table';
import { MODEL_LABELS, slopeUnit, WEIGHTING_LABELS } from './format';
import { criteriaForFigure, type JudgedCriterion } from './judge-criteria';
import type { JudgedFiguresProps, StudyUnits } from './types';

const pct = (confidence: number) => `${formatLevel(confidence * 100)} %`;

export function calibrationRows(result: EvaluationResult, units: StudyUnits, judged: readonly JudgedCriterion[]): FigureRow[] {
  const c = result.calibration;
  if (!c) return [];
  const at = (figure: string) => criteriaForFigure(judged, figure);
  const ci = `${pct(result.confidence)} CI`;
  const rows: FigureRow[] = [
    {
      id: 'model',
      label: 'Model and weighting',
      value: MODEL_LABELS[c.model] ?? c.model,
      detail: `Weighting ${WEIGHTING_LABELS[c.weighting] ?? c.weighting}`,
      criteria: [],
    },
    {
      id: 'n',
      label: 'Standards used',
      value: String(c.n),
      detail: c.excluded.length > 0 ? `${c.excluded.length} excluded with a reason` : 'none excluded',
      criteria: at('calibration.n'),
    },
    {
      id: 'slope',
      label: 'Slope',
      value: withUnit(formatNumber(c.slope, 5), slopeUnit(units)),
      detail: c.seSlope === null ? undefined : `SE ${formatNumber(c.seSlope, 3)} · ${ci} ${formatInterval(c.ciSlope, 5)}`,
      criteria: at('calibration.slope'),
    },
    {
      id: 'intercept',
      label: 'Intercept',
      value: withUnit(formatNumber(c.intercept, 4), units.y),
      detail: c.seIntercept === null ? undefined : `SE ${formatNumber(c.seIntercept, 3)} · ${ci} ${formatInterval(c.ciIntercept, 4)}`,
      criteria: at('calibration.intercept'),
    },
  ];
  if (c.curvature !== null) {
    rows.push({
      id: 'curvature',
      label: 'Curvature (x² coefficient)',
      value: formatNumber(c.curvature, 4),
      detail: c.seCurvature === null ? undefined : `SE ${formatNumber(c.seCurvature, 3)} · ${ci} ${formatInterval(c.ciCurvature, 4)}`,
      criteria: at('calibration.curvature'),
    });
  }
  rows.push(
    { id: 'r', label: 'Correlation coefficient r', value: formatNumber(c.r, 6), criteria: at('calibration.r') },
    { id: 'r2', label: 'Coefficient of determination R²', value: formatNumber(c.r2, 6), criteria: at('calibration.r2') },
    { id: 'adjR2', label: 'Adjusted R²', value: formatNumber(c.adjR2, 6), criteria: at('calibration.adjR2') },
    {
      id: 'sYX',
      label: 'Residual standard deviation s(y/x)',
      value: withUnit(formatNumber(c.sYX, 4), units.y),
      detail: c.df === null ? undefined : `${c.df} degrees of freedom`,
      criteria: at('calibration.sYX'),
    },
  );
  return rows;
}

const significance = (significant: boolean, yes: string, no: string) => (significant ? yes : no);

export function linearityRows(result: EvaluationResult, units: StudyUnits, judged: readonly JudgedCriterion[]): FigureRow[] {
  const rows: FigureRow[] = [];
  const at = (...figures: string[]) => figures.flatMap((f) => criteriaForFigure(judged, f));
  const { lackOfFit, mandel, interceptTest, throughOrigin, homoscedasticity } = result;
  if (lackOfFit) {
    rows.push({
      id: 'lackOfFit',
      label: 'Lack-of-fit test',
      value: pText(lackOfFit.p),
      detail: `F = ${formatNumber(lackOfFit.F, 4)} (critical ${formatNumber(lackOfFit.critical, 4)}; df ${lackOfFit.dfLackOfFit}, ${lackOfFit.dfPureError}) · ${significance(
        lackOfFit.significant,
        'significant: the line misses the level means by more than the replicates scatter',
        'not significant',
      )}`,
      criteria: at('lackOfFit.p', 'lackOfFit.F', 'lackOfFit.significant'),
    });
  }
  if (mandel) {
    rows.push({
      id: 'mandel',
      label: 'Mandel test, straight line against quadratic',
      value: pText(mandel.p),
      detail: `F = ${formatNumber(mandel.F, 4)} (critical at 99 %: ${formatNumber(mandel.critical, 4)}; df ${mandel.df[0]}, ${mandel.df[1]}) · ${significance(
        mandel.significant,
        'significant: the quadratic fits better',
        'not significant',
      )}`,
      criteria: at('mandel.p', 'mandel.F', 'mandel.significant'),
    });
  }
  if (interceptTest) {
    rows.push(
      {
        id: 'interceptTest',
        label: 'Intercept test, is the intercept zero?',
        value: pText(interceptTest.p),
        detail: `t = ${formatNumber(interceptTest.t, 4)}, df ${interceptTest.df} · ${significance(
          interceptTest.significant,
          'the intercept differs from zero',
          'consistent with zero',
        )}`,
        criteria: at('interceptTest.p', 'interceptTest.t', 'interceptTest.significant'),
      },
      {
        id: 'interceptPct',
        label: 'Intercept as % of the top response',
        value: formatPercent(interceptTest.interceptPctOfTopResponse, 3),
        criteria: at('interceptTest.interceptPctOfTopResponse'),
      },
    );
  }
  if (throughOrigin) {
    rows.push({
      id: 'throughOrigin',
      label: 'Line through the origin, slope',
      value: withUnit(formatNumber(throughOrigin.slope, 5), slopeUnit(units)),
      detail: `SE ${formatNumber(throughOrigin.seSlope, 3)} · uncentred R² ${formatNumber(throughOrigin.r2, 6)}`,
      criteria: at('throughOrigin.slope', 'throughOrigin.r2'),
    });
  }
  if (homoscedasticity) {
    const sums = homoscedasticity.sumAbsRePct;
    rows.push(
      {
        id: 'homoscedasticity',
        label: `Variance check, level ${formatNumber(homoscedasticity.xHigh)} against ${formatNumber(homoscedasticity.xLow)}`,
        value: pText(homoscedasticity.p),
        detail: `F = ${formatNumber(homoscedasticity.F, 4)} (critical at 99 %: ${formatNumber(homoscedasticity.critical, 4)}) · ${significance(
          homoscedasticity.significant,
          'the variances differ',
          'no evidence that the variances differ',
        )}`,
        criteria: at('homoscedasticity.p', 'homoscedasticity.F', 'homoscedasticity.significant'),
      },
      {
        id: 'recommendedWeighting',
        label: 'Recommended weighting',
        value: WEIGHTING_LABELS[homoscedasticity.recommendedWeighting] ?? homoscedasticity.recommendedWeighting,
        detail: `Sum of |back-calculated deviation|: ${Object.entries(sums)
          .filter(([, v]) => v !== null && v !== undefined)
          .map(([w, v]) => `${WEIGHTING_LABELS[w] ?? w} ${formatNumber(v, 3)} %`)
          .join(', ')}`,
        criteria: [],
      },
    );
  }
  return rows;
}

export function CalibrationTable({ result, units, judged }: JudgedFiguresProps) {
  return <FiguresTable label="Calibration line" rows={calibrationRows(result, units, judged)} />;
}

export function LinearityTable({ result, units, judged }: JudgedFiguresProps) {
  return (
    <FiguresTable
      label="Linearity and intercept tests"
      rows={linearityRows(result, units, judged)}
      emptyTitle="No test applies to this model and data"
    />
  );
}

interface LevelRow extends CalibrationLevel {
  inRange: boolean | null;
}

const levelColumn = dataTableColumns<LevelRow>();
const levelFigureColumns = [
  levelColumn.accessor('x', { header: 'Level', meta: { align: 'end' }, cell: (info) => formatNumber(info.getValue(), 5) }),
  levelColumn.accessor('n', { header: 'Replicates', meta: { align: 'end' } }),
  levelColumn.accessor('yMean', { header: 'Mean response', meta: { align: 'end' }, cell: (info) => formatNumber(info.getValue(), 5) }),
  levelColumn.accessor('ySd', { header: 'SD of response', meta: { align: 'end' }, cell: (info) => formatNumber(info.getValue(), 3) }),
  levelColumn.accessor('xBackMean', {
    header: 'Back-calculated',
    meta: { align: 'end' },
    cell: (info) => formatNumber(info.getValue(), 5),
  }),
  levelColumn.accessor('rePct', { header: 'Deviation', meta: { align: 'end' }, cell: (info) => formatPercent(info.getValue(), 3) }),
  levelColumn.accessor('rsdPct', { header: 'RSD', meta: { align: 'end' }, cell: (info) => formatPercent(info.getValue(), 3) }),
];
const levelColumns = levelColumn.columns(levelFigureColumns);
/** With criteria that apply level by level, each level's outcome too. */
const levelColumnsWithCriteria = levelColumn.columns([
  ...levelFigureColumns,
  levelColumn.accessor('inRange', {
    header: 'Level criteria',
    cell: (info) => (info.getValue() === null ? <Text color="fg.subtle">—</Text> : <CriterionMark pass={info.getValue()} />),
  }),
]);

/** Each standard level: replicate scatter and how well the line gives its concentration back. */
export function LevelsTable({ result, units }: { result: EvaluationResult; units: StudyUnits }) {
  const levels = result.calibration?.levels ?? [];
  const rangeLevels = result.range?.basis === 'standards' ? result.range.levels : [];
  const rows: LevelRow[] = levels.map((level) => ({ ...level, inRange: rangeLevels.find((r) => r.x === level.x)?.pass ?? null }));
  return (
    <DataTable
      label={`Standard levels${units.x ? ` (${units.x})` : ''}`}
      columns={rangeLevels.length > 0 ? levelColumnsWithCriteria : levelColumns}
      data={rows}
      getRowId={(row) => String(row.x)}
      emptyTitle="No standard levels"
    />
  );
}
