import { Box, HStack, Stack, Text } from '@chakra-ui/react';
import { formatNumber, withUnit } from '@meritline/shared';
import { DataTable, dataTableColumns } from '@/components/data-table';
import { CriterionMark, CriterionName } from './criterion-mark';
import { describeRequirement } from './format';
import { FailsIcon, MeetsIcon, NotJudgedIcon } from './icons';
import { judgeCriteria, type JudgedCriterion } from './judge-criteria';
import type { StudyResultsProps } from './types';

const column = dataTableColumns<JudgedCriterion & { id: string }>();
const columns = column.columns([
  column.accessor('name', {
    header: 'Criterion',
    cell: (info) => <CriterionName name={info.getValue()} figure={info.row.original.figure} />,
  }),
  column.display({
    id: 'required',
    header: 'Required',
    cell: (info) => describeRequirement(info.row.original.op, info.row.original.threshold, info.row.original.unit),
  }),
  column.accessor('value', {
    header: 'Found',
    meta: { align: 'end' },
    cell: (info) => withUnit(formatNumber(info.getValue(), 5), info.row.original.unit),
  }),
  column.accessor('pass', {
    header: 'Outcome',
    cell: (info) => <CriterionMark pass={info.getValue()} missingValue={info.getValue() === false && info.row.original.value === null} />,
  }),
]);

export function verdictHeadline(judged: readonly JudgedCriterion[], pass: boolean | null): string {
  if (judged.length === 0 || pass === null) return 'No verdict: the method version states no acceptance criteria';
  const failed = judged.filter((j) => j.pass !== true).length;
  if (pass) return `Meets all ${judged.length} acceptance criteria`;
  return `Does not meet ${failed} of ${judged.length} acceptance criteria`;
}

/** The overall verdict and every criterion with what was required and what was found. */
export function VerdictSummary({ result, criteria }: Pick<StudyResultsProps, 'result' | 'criteria'>) {
  const judged = judgeCriteria(criteria, result);
  const pass = judged.length === 0 ? null : judged.every((j) => j.pass === true);
  const [Icon, color, bg] =
    pass === true
      ? [MeetsIcon, 'green.fg', 'green.subtle']
      : pass === false
        ? [FailsIcon, 'red.fg', 'red.subtle']
        : [NotJudgedIcon, 'fg.muted', 'bg.muted'];
  return (
    <Stack gap="4" data-testid="verdict-summary">
      <HStack gap="3" p="4" borderRadius="l3" bg={bg} color={color} borderWidth="1px" borderColor="border" role="status">
        <Box fontSize="2xl" flexShrink={0}>
          <Icon />
        </Box>
        <Stack gap="0">
          <Text textStyle="sectionLabel">Verdict</Text>
          <Text fontSize="lg" fontWeight="600" color="fg">
            {verdictHeadline(judged, pass)}
          </Text>
        </Stack>
      </HStack>
      {judged.length > 0 && (
        <DataTable
          label="Acceptance criteria"
          columns={columns}
          data={judged.map((j, i) => ({ ...j, id: `${i}` }))}
          getRowId={(row) => row.id}
        />
      )}
    </Stack>
  );
}
