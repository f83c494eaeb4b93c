import { Box, Stack, Text } from '@chakra-ui/react';
import { useMemo } from 'react';
import { DETECTION_APPROACH_LABELS, type DetectionComparison, type VersionComparisonResponse, formatNumber } from '@meritline/shared';
import { DataTable, dataTableColumns } from '@/components/data-table';
import { CriterionMark } from '@/components/study-results';
import { sentence } from './sentence';

const column = dataTableColumns<DetectionComparison>();

function detectionColumns(unit: string) {
  const value = (v: number | null) => (v === null ? '—' : `${formatNumber(v)} ${unit}`);
  return column.columns([
    column.accessor('approach', { header: 'Approach', cell: (info) => DETECTION_APPROACH_LABELS[info.getValue()] }),
    column.accessor('lodFrom', { header: 'LOD, earlier', meta: { align: 'end' }, cell: (info) => value(info.getValue()) }),
    column.accessor('lodTo', { header: 'LOD, later', meta: { align: 'end' }, cell: (info) => value(info.getValue()) }),
    column.accessor('lodRatio', { header: 'LOD ratio', meta: { align: 'end' }, cell: (info) => formatNumber(info.getValue(), 3) }),
    column.accessor('loqFrom', { header: 'LOQ, earlier', meta: { align: 'end' }, cell: (info) => value(info.getValue()) }),
    column.accessor('loqTo', { header: 'LOQ, later', meta: { align: 'end' }, cell: (info) => value(info.getValue()) }),
    column.accessor('loqRatio', { header: 'LOQ ratio', meta: { align: 'end' }, cell: (info) => formatNumber(info.getValue(), 3) }),
    column.accessor('loqCriterionTo', {
      header: 'LOQ criterion, later',
      cell: (info) => <CriterionMark pass={info.getValue()} />,
    }),
  ]);
}

export function DetectionComparisonTable({ rows, unit }: { rows: DetectionComparison[]; unit: string }) {
  const columns = useMemo(() => detectionColumns(unit), [unit]);
  if (rows.length === 0) return <Text color="fg.muted">Neither study gives detection or quantitation limits.</Text>;
  return <DataTable label="Detection and quantitation limits of both versions" columns={columns} data={rows} />;
}

export function RangeComparisonText({ range, unit }: { range: VersionComparisonResponse['range']; unit: string }) {
  if (!range.available) return <Text color="fg.muted">{sentence(range.reason)}</Text>;
  const list = (levels: number[]) => (levels.length ? levels.map((x) => `${formatNumber(x)} ${unit}`).join(', ') : 'none');
  return (
    <Box borderWidth="1px" borderColor="border" borderRadius="l3" bg="bg.panel" p="5">
      <Stack gap="2">
        <Text>
          Earlier: {formatNumber(range.from.low)} to {formatNumber(range.from.high)} {unit}; later: {formatNumber(range.to.low)} to{' '}
          {formatNumber(range.to.high)} {unit}.
        </Text>
        <Text>Levels gained: {list(range.levelsGained)}.</Text>
        <Text>Levels lost: {list(range.levelsLost)}.</Text>
      </Stack>
    </Box>
  );
}
