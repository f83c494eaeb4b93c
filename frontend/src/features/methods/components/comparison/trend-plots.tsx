import { SimpleGrid, Stack, Text } from '@chakra-ui/react';
import {
  DETECTION_APPROACH_LABELS,
  TREND_FIGURE_LABELS,
  type DetectionApproach,
  type MethodTrendResponse,
  formatDateTime,
} from '@meritline/shared';
import type { Data } from 'plotly.js-dist-min';
import { LazyPlot } from '@/components/study-results';

type Point = MethodTrendResponse['points'][number];

const INK = '#22635d';
const SECOND = '#b5650a';

function series(
  points: Point[],
  value: (p: Point) => number | null,
  name: string,
  colour: string,
  ci?: (p: Point) => [number, number] | null,
): Data {
  const shown = points.filter((p) => value(p) !== null);
  return {
    type: 'scatter',
    mode: 'lines+markers',
    name,
    x: shown.map((p) => `v${p.number}`),
    y: shown.map((p) => value(p) as number),
    text: shown.map((p) => (p.approvedAt ? `approved ${formatDateTime(p.approvedAt)}` : 'no approved study')),
    hovertemplate: '%{x}: %{y}<br>%{text}<extra></extra>',
    marker: { color: colour, size: 9 },
    line: { color: colour, width: 2 },
    ...(ci
      ? {
          error_y: {
            type: 'data',
            symmetric: false,
            array: shown.map((p) => (ci(p) ? (ci(p) as [number, number])[1] - (value(p) as number) : 0)),
            arrayminus: shown.map((p) => (ci(p) ? (value(p) as number) - (ci(p) as [number, number])[0] : 0)),
            color: colour,
          },
        }
      : {}),
  } as Data;
}

function TrendPlot({ title, label, data, yTitle }: { title: string; label: string; data: Data[]; yTitle: string }) {
  return (
    <Stack gap="1">
      <Text fontWeight="600">{title}</Text>
      <LazyPlot
        label={label}
        data={data}
        height={240}
        layout={{ xaxis: { title: { text: 'Version' }, type: 'category' }, yaxis: { title: { text: yTitle } } }}
      />
    </Stack>
  );
}

export function TrendPlots({ trend }: { trend: MethodTrendResponse }) {
  const { points, method } = trend;
  const basis = points.find((p) => p.loqBasis)?.loqBasis as DetectionApproach | undefined;
  return (
    <SimpleGrid columns={{ base: 1, lg: 2 }} gap="6">
      <TrendPlot
        title={`${TREND_FIGURE_LABELS.slope}, with its confidence interval`}
        label="Slope of every version with its confidence interval"
        yTitle={`${method.yUnit} per ${method.xUnit}`}
        data={[
          series(
            points,
            (p) => p.slope,
            TREND_FIGURE_LABELS.slope,
            INK,
            (p) => p.slopeCi,
          ),
        ]}
      />
      <TrendPlot
        title={`${TREND_FIGURE_LABELS.loq}${basis ? `, ${DETECTION_APPROACH_LABELS[basis].charAt(0).toLowerCase()}${DETECTION_APPROACH_LABELS[basis].slice(1)}` : ''}`}
        label="Limit of quantitation of every version"
        yTitle={method.xUnit}
        data={[series(points, (p) => p.loq, TREND_FIGURE_LABELS.loq, INK)]}
      />
      <TrendPlot
        title="Precision"
        label="Repeatability and intermediate precision RSD of every version"
        yTitle="RSD, %"
        data={[
          series(points, (p) => p.rsdR, TREND_FIGURE_LABELS.rsdR, INK),
          series(points, (p) => p.rsdI, TREND_FIGURE_LABELS.rsdI, SECOND),
        ]}
      />
      <TrendPlot
        title={`${TREND_FIGURE_LABELS.meanRecovery}, with its confidence interval`}
        label="Mean recovery of every version with its confidence interval"
        yTitle="%"
        data={[
          series(
            points,
            (p) => p.meanRecoveryPct,
            TREND_FIGURE_LABELS.meanRecovery,
            INK,
            (p) => p.meanRecoveryCi,
          ),
        ]}
      />
    </SimpleGrid>
  );
}
