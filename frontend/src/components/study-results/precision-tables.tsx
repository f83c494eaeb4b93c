import { type EvaluationResult, formatNumber, formatPercent, formatPValue, type PrecisionSeries, withUnit } from '@meritline/shared';
import { DataTable, dataTableColumns } from '@/components/data-table';
import { FiguresTable, type FigureRow } from './figures-table';
import { criteriaForFigure, type JudgedCriterion } from './judge-criteria';
import type { JudgedFiguresProps, StudyUnits } from './types';

interface AnovaRow {
  source: string;
  ss: number | null;
  df: number | null;
  ms: number | null;
  F: number | null;
  p: number | null;
}

const anovaColumn = dataTableColumns<AnovaRow>();
const anovaColumns = anovaColumn.columns([
  anovaColumn.accessor('source', { header: 'Source of variation' }),
  anovaColumn.accessor('ss', { header: 'Sum of squares', meta: { align: 'end' }, cell: (info) => formatNumber(info.getValue(), 5) }),
  anovaColumn.accessor('df', { header: 'df', meta: { align: 'end' }, cell: (info) => info.getValue() ?? '—' }),
  anovaColumn.accessor('ms', { header: 'Mean square', meta: { align: 'end' }, cell: (info) => formatNumber(info.getValue(), 5) }),
  anovaColumn.accessor('F', { header: 'F', meta: { align: 'end' }, cell: (info) => formatNumber(info.getValue(), 4) }),
  anovaColumn.accessor('p', { header: 'p', meta: { align: 'end' }, cell: (info) => formatPValue(info.getValue()) }),
]);

const seriesColumn = dataTableColumns<PrecisionSeries>();
const seriesColumns = seriesColumn.columns([
  seriesColumn.accessor('group', { header: 'Series' }),
  seriesColumn.accessor('n', { header: 'Results', meta: { align: 'end' } }),
  seriesColumn.accessor('mean', { header: 'Mean', meta: { align: 'end' }, cell: (info) => formatNumber(info.getValue(), 5) }),
  seriesColumn.accessor('sd', { header: 'SD', meta: { align: 'end' }, cell: (info) => formatNumber(info.getValue(), 3) }),
]);

export function precisionRows(result: EvaluationResult, units: StudyUnits, judged: readonly JudgedCriterion[]): FigureRow[] {
  const p = result.precision;
  if (!p) return [];
  const at = (figure: string) => criteriaForFigure(judged, figure);
  const x = (v: number | null) => withUnit(formatNumber(v, 4), units.x);
  const rows: FigureRow[] = [
    {
      id: 'grandMean',
      label: 'Grand mean',
      value: x(p.grandMean),
      detail: `${p.N} results in ${p.k} series`,
      criteria: at('precision.grandMean'),
    },
    { id: 'sR', label: 'Repeatability SD', value: x(p.sR), criteria: at('precision.sR') },
    { id: 'rsdR', label: 'Repeatability RSD', value: formatPercent(p.rsdR, 3), criteria: at('precision.rsdR') },
    {
      id: 'sBetween',
      label: 'Between-series SD',
      value: x(p.sBetween),
      detail: p.n0 === null ? undefined : `n₀ = ${formatNumber(p.n0, 4)}`,
      criteria: at('precision.sBetween'),
    },
    { id: 'sI', label: 'Intermediate precision SD', value: x(p.sI), criteria: at('precision.sI') },
    { id: 'rsdI', label: 'Intermediate precision RSD', value: formatPercent(p.rsdI, 3), criteria: at('precision.rsdI') },
  ];
  if (p.horwitz) {
    rows.push(
      {
        id: 'predictedRsd',
        label: 'Horwitz predicted RSD',
        value: formatPercent(p.horwitz.predictedRsd, 3),
        detail: `2^(1 − 0.5 log₁₀ C) with C = ${formatNumber(p.horwitz.massFraction, 3)} (Horwitz 1980; AOAC writes 2 C^−0.15)`,
        criteria: at('precision.horwitz.predictedRsd'),
      },
      {
        id: 'horRat',
        label: 'HorRat (intermediate precision)',
        value: formatNumber(p.horwitz.horRat, 3),
        criteria: at('precision.horwitz.horRat'),
      },
      {
        id: 'horRatR',
        label: 'HorRat (repeatability)',
        value: formatNumber(p.horwitz.horRatRepeatability, 3),
        criteria: at('precision.horwitz.horRatRepeatability'),
      },
    );
  }
  return rows;
}

export function PrecisionFiguresTable({ result, units, judged }: JudgedFiguresProps) {
  return <FiguresTable label="Precision" rows={precisionRows(result, units, judged)} />;
}

export function PrecisionAnovaTable({ result }: { result: EvaluationResult }) {
  const p = result.precision;
  if (!p) return null;
  const rows: AnovaRow[] = [
    { source: 'Between series', ss: p.ssBetween, df: p.dfBetween, ms: p.msBetween, F: p.F, p: p.p },
    { source: 'Within series', ss: p.ssWithin, df: p.dfWithin, ms: p.msWithin, F: null, p: null },
  ];
  return <DataTable label="One-way analysis of variance" columns={anovaColumns} data={rows} getRowId={(row) => row.source} />;
}

export function PrecisionSeriesTable({ result }: { result: EvaluationResult }) {
  return <DataTable label="Precision series" columns={seriesColumns} data={result.precision?.series ?? []} getRowId={(row) => row.group} />;
}
