import { formatNumber, withUnit } from '@meritline/shared';
import { Stack, Text } from '@chakra-ui/react';
import { DataTable, dataTableColumns } from '@/components/data-table';
import { CriterionMark } from './criterion-mark';
import { describeRequirement } from './format';
import type { JudgedCriterion } from './judge-criteria';

export interface FigureRow {
  id: string;
  label: string;
  value: string;
  /** Standard error, interval, test statistic: whatever qualifies the value. */
  detail?: string;
  criteria: JudgedCriterion[];
}

const column = dataTableColumns<FigureRow>();

export function CriterionCell({ criteria }: { criteria: readonly JudgedCriterion[] }) {
  if (criteria.length === 0) {
    return (
      // Positioned, so that the hidden words stay inside the table's scroll area.
      <Text as="span" color="fg.subtle" position="relative">
        —
        <Text as="span" srOnly>
          No criterion
        </Text>
      </Text>
    );
  }
  return (
    <Stack gap="1">
      {criteria.map((c, i) => (
        <Text key={i} as="span">
          {describeRequirement(c.op, c.threshold, c.unit)}
          {c.value !== null && c.figure.startsWith('range.') && (
            <Text as="span" color="fg.muted" fontSize="sm">
              {' '}
              (worst level {withUnit(formatNumber(c.value), c.unit)})
            </Text>
          )}
        </Text>
      ))}
    </Stack>
  );
}

export function OutcomeCell({ criteria }: { criteria: readonly JudgedCriterion[] }) {
  if (criteria.length === 0) return null;
  return (
    <Stack gap="1">
      {criteria.map((c, i) => (
        <CriterionMark key={i} pass={c.pass} missingValue={c.pass === false && c.value === null} />
      ))}
    </Stack>
  );
}

const figureColumns = column.columns([
  column.accessor('label', {
    header: 'Figure',
    cell: (info) => (
      <Text fontWeight="500" whiteSpace="normal" minW="10rem" maxW="18rem">
        {info.getValue()}
      </Text>
    ),
  }),
  column.accessor('value', {
    header: 'Value',
    meta: { align: 'end' },
    cell: (info) => (
      <Text as="span" whiteSpace="nowrap">
        {info.getValue()}
      </Text>
    ),
  }),
  column.accessor('detail', {
    header: 'Detail',
    cell: (info) => (
      <Text color="fg.muted" whiteSpace="normal" minW="14rem" maxW="26rem" fontSize="sm">
        {info.getValue() ?? ''}
      </Text>
    ),
  }),
  column.display({ id: 'criterion', header: 'Criterion', cell: (info) => <CriterionCell criteria={info.row.original.criteria} /> }),
  column.display({ id: 'outcome', header: 'Outcome', cell: (info) => <OutcomeCell criteria={info.row.original.criteria} /> }),
]);

export interface FiguresTableProps {
  label: string;
  rows: readonly FigureRow[];
  emptyTitle?: string;
}

/** Figures of merit, each beside its acceptance criterion and the outcome in words. */
export function FiguresTable({ label, rows, emptyTitle = 'Not computed' }: FiguresTableProps) {
  return <DataTable label={label} columns={figureColumns} data={rows} getRowId={(row) => row.id} emptyTitle={emptyTitle} />;
}
