import {
  type EvaluationResult,
  formatInterval,
  formatNumber,
  formatPercent,
  pText,
  type RecoveryGroup,
  type RecoveryItemResult,
} from '@meritline/shared';
import { Text } from '@chakra-ui/react';
import { DataTable, dataTableColumns } from '@/components/data-table';
import { CriterionCell, OutcomeCell } from './figures-table';
import { criteriaForFigure, type JudgedCriterion } from './judge-criteria';

interface RecoveryRow extends RecoveryGroup {
  id: string;
  name: string;
  criteria: JudgedCriterion[];
}

const column = dataTableColumns<RecoveryRow>();
const columns = column.columns([
  column.accessor('name', { header: 'Level', cell: (info) => <Text fontWeight="500">{info.getValue()}</Text> }),
  column.accessor('n', { header: 'Spikes', meta: { align: 'end' } }),
  column.accessor('meanPct', { header: 'Mean recovery', meta: { align: 'end' }, cell: (info) => formatPercent(info.getValue(), 4) }),
  column.accessor('rsdPct', { header: 'RSD', meta: { align: 'end' }, cell: (info) => formatPercent(info.getValue(), 3) }),
  column.accessor('ci', {
    header: 'Confidence interval',
    cell: (info) => (info.getValue() ? `${formatInterval(info.getValue(), 4)} %` : '—'),
  }),
  column.display({
    id: 'bias',
    header: 'Differs from 100 %?',
    cell: (info) => {
      const g = info.row.original;
      if (g.significant === null) return <Text color="fg.subtle">—</Text>;
      return (
        <Text>
          {g.significant ? 'Yes' : 'No'}
          <Text as="span" color="fg.muted" fontSize="sm">
            {' '}
            (t = {formatNumber(g.t, 3)}, {pText(g.p)})
          </Text>
        </Text>
      );
    },
  }),
  column.display({ id: 'criterion', header: 'Criterion', cell: (info) => <CriterionCell criteria={info.row.original.criteria} /> }),
  column.display({ id: 'outcome', header: 'Outcome', cell: (info) => <OutcomeCell criteria={info.row.original.criteria} /> }),
]);

const itemColumn = dataTableColumns<RecoveryItemResult>();
const itemColumns = itemColumn.columns([
  itemColumn.accessor('id', { header: 'Spike' }),
  itemColumn.accessor('level', { header: 'Level', cell: (info) => info.getValue() ?? '—' }),
  itemColumn.accessor('pct', { header: 'Recovery', meta: { align: 'end' }, cell: (info) => formatPercent(info.getValue(), 4) }),
]);

export function recoveryRows(result: EvaluationResult, judged: readonly JudgedCriterion[]): RecoveryRow[] {
  const r = result.recovery;
  if (!r) return [];
  const criteriaAt = (prefix: string) =>
    ['meanPct', 'rsdPct', 'sdPct'].flatMap((figure) => criteriaForFigure(judged, `${prefix}.${figure}`));
  const rows: RecoveryRow[] = r.byLevel.map((group, i) => ({
    ...group,
    id: `level-${i}`,
    name: group.level ?? 'No level given',
    criteria: group.level === null ? [] : criteriaAt(`recovery.byLevel.${group.level}`),
  }));
  const rangeCriteria = criteriaForFigure(judged, 'range.recoveryPct');
  rows.push({ ...r.overall, id: 'overall', name: 'All levels', criteria: [...criteriaAt('recovery.overall'), ...rangeCriteria] });
  return rows;
}

export function RecoveryTable({ result, judged }: { result: EvaluationResult; judged: readonly JudgedCriterion[] }) {
  return <DataTable label="Recovery by level" columns={columns} data={recoveryRows(result, judged)} getRowId={(row) => row.id} />;
}

export function RecoveryItemsTable({ result }: { result: EvaluationResult }) {
  return <DataTable label="Recovery of each spike" columns={itemColumns} data={result.recovery?.items ?? []} pageSize={10} />;
}
