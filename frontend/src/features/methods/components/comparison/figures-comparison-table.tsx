import { Stack, Text } from '@chakra-ui/react';
import { useMemo } from 'react';
import { describeRequirement, figureUnit, type CriterionOutcome, type FigureComparison, type Units, formatNumber } from '@meritline/shared';
import { DataTable, dataTableColumns } from '@/components/data-table';
import { CriterionMark } from '@/components/study-results';

const column = dataTableColumns<FigureComparison>();

function requirement(row: FigureComparison, units: Units): string | null {
  const criterion: CriterionOutcome | null = row.criterionTo ?? row.criterionFrom;
  return criterion ? describeRequirement(criterion.op, criterion.threshold, figureUnit(row.figure, units)) : null;
}

export function figureColumns(fromLabel: string, toLabel: string, units: Units) {
  const withUnit = (row: FigureComparison, value: number | null, difference = false) => {
    const unit = difference && figureUnit(row.figure, units) === '%' ? 'percentage points' : figureUnit(row.figure, units);
    const text = formatNumber(value);
    return unit && text !== '—' ? `${text} ${unit}` : text;
  };
  return column.columns([
    column.accessor('label', {
      header: 'Figure',
      cell: (info) => (
        <Text whiteSpace="normal" minW="12rem">
          {info.getValue()}
        </Text>
      ),
    }),
    column.accessor('from', { header: fromLabel, meta: { align: 'end' }, cell: (info) => withUnit(info.row.original, info.getValue()) }),
    column.accessor('to', { header: toLabel, meta: { align: 'end' }, cell: (info) => withUnit(info.row.original, info.getValue()) }),
    column.accessor('difference', {
      header: 'Difference (later − earlier)',
      meta: { align: 'end' },
      cell: (info) => withUnit(info.row.original, info.getValue(), true),
    }),
    column.accessor('ratio', {
      header: 'Ratio (later / earlier)',
      meta: { align: 'end' },
      cell: (info) => formatNumber(info.getValue(), 3),
    }),
    column.display({
      id: 'criterion',
      header: 'Acceptance criterion',
      cell: (info) => {
        const row = info.row.original;
        const text = requirement(row, units);
        if (!text) return <Text color="fg.muted">None</Text>;
        return (
          <Stack gap="1" minW="11rem">
            <Text whiteSpace="normal">{text}</Text>
            <Text fontSize="sm" color="fg.muted" as="div">
              Earlier: <CriterionMark pass={row.criterionFrom?.pass ?? null} />
            </Text>
            <Text fontSize="sm" color="fg.muted" as="div">
              Later: <CriterionMark pass={row.criterionTo?.pass ?? null} />
            </Text>
          </Stack>
        );
      },
    }),
  ]);
}

export function FiguresComparisonTable(props: { rows: FigureComparison[]; fromLabel: string; toLabel: string; units: Units }) {
  const { fromLabel, toLabel, units } = props;
  const columns = useMemo(() => figureColumns(fromLabel, toLabel, units), [fromLabel, toLabel, units]);
  return <DataTable label="Figures of both versions" columns={columns} data={props.rows} getRowId={(row) => row.figure} />;
}
