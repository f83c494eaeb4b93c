import { type EvaluationResult, formatNumber, formatPercent, type RangeLevel, withUnit } from '@meritline/shared';
import { Stack, Text } from '@chakra-ui/react';
import { useMemo } from 'react';
import { DataTable, dataTableColumns } from '@/components/data-table';
import { CriterionMark } from './criterion-mark';
import { figureLabel } from './format';
import type { StudyUnits } from './types';

const column = dataTableColumns<RangeLevel>();

function rangeColumns(figures: readonly string[]) {
  return column.columns([
    column.accessor('x', { header: 'Level', meta: { align: 'end' }, cell: (info) => formatNumber(info.getValue(), 5) }),
    ...figures.map((figure) =>
      column.display({
        id: figure,
        header: figureLabel(figure).replace(/ at every level$/, ''),
        meta: { align: 'end' },
        cell: (info) => formatPercent(info.row.original.values[figure] ?? null, 3),
      }),
    ),
    column.accessor('pass', { header: 'Level criteria', cell: (info) => <CriterionMark pass={info.getValue()} /> }),
  ]);
}

/** The longest run of adjacent levels at which every per-level criterion holds. */
export function WorkingRange({ result, units }: { result: EvaluationResult; units: StudyUnits }) {
  const range = result.range;
  const figureKey = [...new Set((range?.levels ?? []).flatMap((l) => Object.keys(l.values)))].join('|');
  const columns = useMemo(() => rangeColumns(figureKey.split('|').filter(Boolean)), [figureKey]);
  if (!range) return null;
  return (
    <Stack gap="3">
      <Text>
        From <strong>{withUnit(formatNumber(range.low, 5), units.x)}</strong> to{' '}
        <strong>{withUnit(formatNumber(range.high, 5), units.x)}</strong>, judged on the{' '}
        {range.basis === 'standards' ? 'calibration standards' : 'recovery levels'}.
      </Text>
      <DataTable label="Working range by level" columns={columns} data={range.levels} getRowId={(row) => String(row.x)} />
    </Stack>
  );
}
