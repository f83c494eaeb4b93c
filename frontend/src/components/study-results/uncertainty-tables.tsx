import { Stack, Text } from '@chakra-ui/react';
import {
  formatLevel,
  figureLabel,
  type TopDownLevelResult,
  type UnknownResult,
  formatNumber,
  formatPercent,
  withUnit,
} from '@meritline/shared';
import { useMemo } from 'react';
import { DataTable, dataTableColumns } from '@/components/data-table';
import { FiguresTable, type FigureRow } from './figures-table';
import { criteriaForFigure, criteriaUnder } from './judge-criteria';
import type { JudgedFiguresProps, StudyUnits } from './types';

const level = dataTableColumns<TopDownLevelResult>();

/** Each level's figure in the way U is stated there: % at and above the switch-over, concentration units below it. */
function stated(row: TopDownLevelResult, absolute: number, relative: number, unit: string | undefined) {
  return row.expressedAs === 'relative' ? formatPercent(relative, 3) : withUnit(formatNumber(absolute, 3), unit);
}

function uncertaintyColumns(units: StudyUnits, k: number) {
  return level.columns([
    level.accessor('level', { header: 'Level' }),
    level.accessor('concentration', {
      header: units.x ? `Concentration (${units.x})` : 'Concentration',
      meta: { align: 'end' },
      cell: (info) => formatNumber(info.getValue(), 4),
    }),
    level.accessor('expressedAs', {
      header: 'Stated',
      cell: (info) => (info.getValue() === 'relative' ? 'Relative (%)' : `Absolute${units.x ? ` (${units.x})` : ''}`),
    }),
    level.display({
      id: 'uRw',
      header: 'u(Rw)',
      meta: { align: 'end' },
      cell: (info) => stated(info.row.original, info.row.original.uRw, info.row.original.uRwPct, units.x),
    }),
    level.display({
      id: 'uBias',
      header: 'u(bias)',
      meta: { align: 'end' },
      cell: (info) => stated(info.row.original, info.row.original.uBias, info.row.original.uBiasPct, units.x),
    }),
    level.display({
      id: 'uc',
      header: 'uc',
      meta: { align: 'end' },
      cell: (info) => stated(info.row.original, info.row.original.uc, info.row.original.ucPct, units.x),
    }),
    level.display({
      id: 'U',
      header: `U (k = ${formatLevel(k)})`,
      meta: { align: 'end' },
      cell: (info) => (
        <Text as="span" fontWeight="600">
          {stated(info.row.original, info.row.original.U, info.row.original.UPct, units.x)}
        </Text>
      ),
    }),
  ]);
}

const sample = dataTableColumns<UnknownResult>();

function calibrationColumns(units: StudyUnits) {
  return sample.columns([
    sample.accessor('id', { header: 'Sample' }),
    sample.accessor('x0', {
      header: units.x ? `Found (${units.x})` : 'Found',
      meta: { align: 'end' },
      cell: (info) => formatNumber(info.getValue(), 4),
    }),
    sample.accessor('sX0', {
      header: 'u(x₀)',
      meta: { align: 'end' },
      cell: (info) => withUnit(formatNumber(info.getValue(), 3), units.x),
    }),
    sample.display({
      id: 'relative',
      header: 'u(x₀), relative',
      meta: { align: 'end' },
      cell: (info) => {
        const { sX0, x0 } = info.row.original;
        return sX0 !== null && x0 ? formatPercent((100 * sX0) / Math.abs(x0), 3) : '—';
      },
    }),
  ]);
}

/** Top-down uncertainty by level (u(Rw), u(bias), uc, U), with the calibration's own u(x₀) beside it for comparison. */
export function UncertaintyTables({ result, units, judged }: JudgedFiguresProps) {
  const u = result.uncertainty;
  const columns = useMemo(() => uncertaintyColumns(units, u?.coverageFactor ?? 2), [units, u?.coverageFactor]);
  const sampleColumns = useMemo(() => calibrationColumns(units), [units]);
  if (!u) return null;
  const summary: FigureRow[] = [];
  if (u.relative)
    summary.push({
      id: 'relative',
      label: figureLabel('uncertainty.relative.UPct'),
      value: formatPercent(u.relative.UPct, 3),
      detail: `uc = ${formatPercent(u.relative.ucPct, 3)}${u.relative.from !== null ? `; stated relative from ${withUnit(formatNumber(u.relative.from, 4), units.x)}` : ''}`,
      criteria: criteriaForFigure(judged, 'uncertainty.relative.UPct'),
    });
  if (u.absolute)
    summary.push({
      id: 'absolute',
      label: figureLabel('uncertainty.absolute.U'),
      value: withUnit(formatNumber(u.absolute.U, 3), units.x),
      detail: `uc = ${withUnit(formatNumber(u.absolute.uc, 3), units.x)}${u.absolute.below !== null ? `; stated absolute below ${withUnit(formatNumber(u.absolute.below, 4), units.x)}` : ''}`,
      criteria: criteriaForFigure(judged, 'uncertainty.absolute.U'),
    });
  const perLevel = criteriaUnder(judged, 'uncertainty.byLevel');
  if (perLevel.length > 0)
    summary.push({ id: 'byLevel', label: 'Figures at single levels', value: '', detail: 'See the table by level.', criteria: perLevel });
  const samples = (result.unknowns ?? []).filter((s) => s.sX0 !== null);
  return (
    <Stack gap="4">
      <DataTable label="Measurement uncertainty by level" columns={columns} data={u.byLevel} getRowId={(row) => row.level} />
      <Text fontSize="sm" color="fg.muted">
        u(Rw) is the within-laboratory reproducibility (intermediate precision), u(bias) the uncertainty of the bias, uc = √(u(Rw)² +
        u(bias)²) the combined standard uncertainty and U = k·uc the expanded uncertainty (Nordtest TR 537 approach).
      </Text>
      <FiguresTable label="Measurement uncertainty, largest values" rows={summary} />
      <Stack gap="2">
        <Text fontWeight="500">Beside it: the calibration alone</Text>
        {samples.length > 0 ? (
          <DataTable
            label="Uncertainty of the samples read off the calibration"
            columns={sampleColumns}
            data={samples}
            getRowId={(row) => row.id}
          />
        ) : (
          <Text fontSize="sm" color="fg.muted">
            No sample was read off the calibration line in this study, so there is no u(x₀) to compare with.
          </Text>
        )}
        <Text fontSize="sm" color="fg.muted">
          u(x₀) covers only the scatter about the calibration line; U above also covers day-to-day precision and bias, so it is normally the
          larger.
        </Text>
      </Stack>
    </Stack>
  );
}
