import { Badge, Stack, Text } from '@chakra-ui/react';
import { roundToInterval, formatNumber, type RunUnknown } from '@meritline/shared';
import { useMemo } from 'react';
import { DataTable, dataTableColumns } from '@/components/data-table';
import { headerWithUnit } from './column-header';

const column = dataTableColumns<RunUnknown>();

function columnsFor(xUnit: string, yUnit: string, confidencePct: number) {
  return column.columns([
    column.accessor('id', { header: 'Sample', cell: (info) => <Text fontWeight="500">{info.getValue()}</Text> }),
    column.accessor('reported', {
      header: 'Reported',
      cell: (info) => (
        <Stack gap="1" align="flex-start">
          <Text fontWeight="600" whiteSpace="nowrap" textDecoration={info.row.original.reportable ? undefined : 'line-through'}>
            {info.getValue()}
          </Text>
          {info.row.original.dilution !== 1 && (
            <Text fontSize="xs" color="fg.muted" whiteSpace="nowrap">
              dilution factor {formatNumber(info.row.original.dilution, 4)} included
            </Text>
          )}
          {!info.row.original.reportable && (
            <Badge colorPalette="red" variant="subtle">
              Not reportable
            </Badge>
          )}
        </Stack>
      ),
    }),
    column.accessor('x0Undiluted', {
      header: headerWithUnit('Read off the line, undiluted', xUnit),
      meta: { align: 'end' },
      cell: (info) => <Text whiteSpace="nowrap">{formatNumber(info.getValue(), 4)}</Text>,
    }),
    column.accessor('x0', {
      header: headerWithUnit('Result, dilution corrected', xUnit),
      meta: { align: 'end' },
      cell: (info) => {
        const expanded = info.row.original.uncertainty?.value;
        const ci = info.row.original.ci;
        const halfWidth = expanded ? expanded.U : ci ? (ci[1] - ci[0]) / 2 : null;
        const rounded = halfWidth !== null ? roundToInterval(info.getValue(), halfWidth) : null;
        return (
          <Stack gap="0" align="flex-end">
            <Text whiteSpace="nowrap">{rounded ? `${rounded.value} ± ${rounded.halfWidth}` : formatNumber(info.getValue(), 3)}</Text>
            <Text fontSize="xs" color="fg.muted" whiteSpace="nowrap">
              {expanded
                ? `expanded uncertainty U, k = ${expanded.coverageFactor}`
                : rounded
                  ? `calibration confidence interval, ${confidencePct} %`
                  : 'no interval'}
            </Text>
          </Stack>
        );
      },
    }),
    column.accessor('yMean', {
      header: headerWithUnit('Mean response', yUnit),
      meta: { align: 'end' },
      cell: (info) => (
        <Stack gap="0" align="flex-end">
          <Text whiteSpace="nowrap">{formatNumber(info.getValue(), 5)}</Text>
          <Text fontSize="xs" color="fg.muted" whiteSpace="nowrap">
            {info.row.original.m === 1 ? '1 reading' : `${info.row.original.m} readings`}
          </Text>
        </Stack>
      ),
    }),
    column.accessor('remarks', {
      header: 'Remarks',
      cell: (info) =>
        info.getValue().length ? (
          <Stack gap="1" minW="40" maxW="xs" fontSize="sm" whiteSpace="normal">
            {info.getValue().map((remark) => (
              <Text key={remark}>{remark}</Text>
            ))}
          </Stack>
        ) : (
          <Text color="fg.muted">—</Text>
        ),
    }),
  ]);
}

export function ResultsTable({
  unknowns,
  xUnit,
  yUnit,
  confidence,
}: {
  unknowns: RunUnknown[];
  xUnit: string;
  yUnit: string;
  confidence: number;
}) {
  const columns = useMemo(() => columnsFor(xUnit, yUnit, Math.round(confidence * 100)), [xUnit, yUnit, confidence]);
  return <DataTable label="Sample results" columns={columns} data={unknowns} getRowId={(u) => u.id} />;
}
