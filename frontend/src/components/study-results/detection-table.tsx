import {
  type DetectionApproach,
  type EvaluationResult,
  EXCLUDED_DETECTION_ROW_WORDS,
  formatLevel,
  formatNumber,
  NOT_DETECTED_WORDS,
  withUnit,
} from '@meritline/shared';
import { Stack, Text } from '@chakra-ui/react';
import { DataTable, dataTableColumns } from '@/components/data-table';
import { CriterionCell, OutcomeCell } from './figures-table';
import { criteriaUnder, type JudgedCriterion } from './judge-criteria';
import type { JudgedFiguresProps, StudyUnits } from './types';

interface DetectionRow {
  approach: DetectionApproach;
  name: string;
  critical: string;
  detection: string;
  quantitation: string;
  basis: string;
  flagBasis: boolean;
  criteria: JudgedCriterion[];
}

const column = dataTableColumns<DetectionRow>();
const columns = column.columns([
  column.accessor('name', {
    header: 'Approach',
    cell: (info) => (
      <Text fontWeight="500" whiteSpace="normal" minW="10rem" maxW="16rem">
        {info.getValue()}
        {info.row.original.flagBasis && (
          <Text as="span" display="block" fontSize="xs" color="fg.muted" fontWeight="400">
            Used for the sample flags
          </Text>
        )}
      </Text>
    ),
  }),
  column.accessor('critical', { header: 'Critical value', meta: { align: 'end' } }),
  column.accessor('detection', { header: 'Detection limit', meta: { align: 'end' } }),
  column.accessor('quantitation', { header: 'Quantitation limit', meta: { align: 'end' } }),
  column.accessor('basis', {
    header: 'Basis',
    cell: (info) => (
      <Text color="fg.muted" fontSize="sm" whiteSpace="normal" minW="16rem" maxW="28rem">
        {info.getValue()}
      </Text>
    ),
  }),
  column.display({ id: 'criterion', header: 'Criterion', cell: (info) => <CriterionCell criteria={info.row.original.criteria} /> }),
  column.display({ id: 'outcome', header: 'Outcome', cell: (info) => <OutcomeCell criteria={info.row.original.criteria} /> }),
]);

const moreExcluded = (rows: readonly unknown[] | undefined) => (rows?.length ? ` (${rows.length} more excluded)` : '');

export function detectionRows(result: EvaluationResult, units: StudyUnits, judged: readonly JudgedCriterion[]): DetectionRow[] {
  const d = result.detection;
  if (!d) return [];
  const x = (value: number | null | undefined, digits = 4) => withUnit(formatNumber(value, digits), units.x);
  const y = (value: number | null | undefined) => withUnit(formatNumber(value, 4), units.y);
  const rows: DetectionRow[] = [];
  const add = (approach: DetectionApproach, row: Omit<DetectionRow, 'approach' | 'criteria' | 'flagBasis'>) =>
    rows.push({ approach, ...row, flagBasis: d.flagBasis === approach, criteria: criteriaUnder(judged, `detection.${approach}`) });

  if (d.sdResidual) {
    add('sdResidual', {
      name: 'ICH Q2(R2), SD of the residuals',
      critical: '—',
      detection: x(d.sdResidual.lod),
      quantitation: x(d.sdResidual.loq),
      basis: `3.3σ/S and 10σ/S with σ = s(y/x) = ${formatNumber(d.sdResidual.sigma, 3)}`,
    });
  }
  if (d.sdIntercept) {
    add('sdIntercept', {
      name: 'ICH Q2(R2), SD of the intercept',
      critical: '—',
      detection: x(d.sdIntercept.lod),
      quantitation: x(d.sdIntercept.loq),
      basis: `3.3σ/S and 10σ/S with σ = SE of the intercept = ${formatNumber(d.sdIntercept.sigma, 3)}`,
    });
  }
  if (d.blankSd) {
    add('blankSd', {
      name: 'ICH Q2(R2), SD of the blanks',
      critical: '—',
      detection: x(d.blankSd.lod),
      quantitation: x(d.blankSd.loq),
      basis: `${d.blankSd.n} blanks, mean ${y(d.blankSd.mean)}, σ = ${formatNumber(d.blankSd.sigma, 3)}; mean + 3 SD and mean + 10 SD of the blanks read off the line: ${x(
        d.blankSd.responseLodX,
      )} and ${x(d.blankSd.responseLoqX)}`,
    });
  }
  if (d.iso11843) {
    add('iso11843', {
      name: 'ISO 11843-2, from the calibration',
      critical: x(d.iso11843.criticalX),
      detection: x(d.iso11843.detectableX),
      quantitation: '—',
      basis: `Critical response ${y(d.iso11843.criticalResponse)}; ${d.iso11843.K} reading per sample, ${d.iso11843.df} df, δ = ${formatNumber(d.iso11843.delta, 4)}`,
    });
  }
  if (d.hubauxVos) {
    add('hubauxVos', {
      name: 'Hubaux and Vos, prediction band',
      critical: x(d.hubauxVos.criticalX),
      detection: x(d.hubauxVos.detectableX),
      quantitation: '—',
      basis: `Critical response ${y(d.hubauxVos.criticalResponse)}; ${d.hubauxVos.df} df`,
    });
  }
  if (d.epaMdl) {
    const m = d.epaMdl;
    add('epaMdl', {
      name: 'Method detection limit, 40 CFR 136 App. B',
      critical: '—',
      detection: x(m.mdl),
      quantitation: '—',
      basis: `From ${m.nSpiked} low-level spikes${moreExcluded(d.excludedSpikes)}: ${x(m.mdlSpiked)}; from ${m.nBlanks} method blanks${moreExcluded(d.excludedMdlBlanks)}: ${
        m.mdlBlank === null ? 'none' : x(m.mdlBlank)
      }; the higher (${m.governing === 'spiked' ? 'spikes' : 'blanks'}) governs`,
    });
  }
  return rows;
}

/** Every detection approach the data allows, side by side, in concentration units. */
export function DetectionTable({ result, units, judged }: JudgedFiguresProps) {
  return (
    <DataTable
      label="Detection and quantitation limits"
      columns={columns}
      data={detectionRows(result, units, judged)}
      getRowId={(row) => row.approach}
      emptyTitle="No detection limit could be computed"
    />
  );
}

interface ExcludedDetectionRow {
  id: string;
  what: string;
  value: string;
  reason: string;
}

const excludedColumn = dataTableColumns<ExcludedDetectionRow>();
const excludedColumns = excludedColumn.columns([
  excludedColumn.accessor('what', { header: 'Result left out' }),
  excludedColumn.accessor('value', { header: 'Value', meta: { align: 'end' } }),
  excludedColumn.accessor('reason', {
    header: 'Reason given',
    cell: (info) => (
      <Text whiteSpace="normal" minW="14rem" maxW="28rem">
        {info.getValue()}
      </Text>
    ),
  }),
]);

/** The blanks, low-level spikes and MDL blanks the analyst excluded from the limits, with the reasons given. */
export function DetectionExclusions({ result, units }: Pick<JudgedFiguresProps, 'result' | 'units'>) {
  const d = result.detection;
  // Entered values, printed as entered.
  const value = (v: number | null, unit: string | undefined) => (v === null ? NOT_DETECTED_WORDS : withUnit(formatLevel(v), unit));
  const rows: ExcludedDetectionRow[] = [
    ...(d?.excludedBlanks ?? []).map((row) => ({
      id: `b${row.index}`,
      what: `${EXCLUDED_DETECTION_ROW_WORDS.blanks}, row ${row.index + 1}`,
      value: value(row.value, units.y),
      reason: row.reason,
    })),
    ...(d?.excludedSpikes ?? []).map((row) => ({
      id: `s${row.index}`,
      what: `${EXCLUDED_DETECTION_ROW_WORDS['lowSpikes.spiked']}, row ${row.index + 1}`,
      value: value(row.value, units.x),
      reason: row.reason,
    })),
    ...(d?.excludedMdlBlanks ?? []).map((row) => ({
      id: `m${row.index}`,
      what: `${EXCLUDED_DETECTION_ROW_WORDS['lowSpikes.blanks']}, row ${row.index + 1}`,
      value: value(row.value, units.x),
      reason: row.reason,
    })),
  ];
  if (rows.length === 0) return null;
  return (
    <Stack gap="2">
      <Text fontWeight="600" fontSize="sm">
        Excluded from the limits
      </Text>
      <DataTable label="Results excluded from the detection limits" columns={excludedColumns} data={rows} getRowId={(row) => row.id} />
    </Stack>
  );
}
