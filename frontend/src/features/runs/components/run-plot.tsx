import { type EvaluationResult, formatNumber, type StudyInput, type RunData, type RunResult } from '@meritline/shared';
import type { Data } from 'plotly.js-dist-min';
import { calibrationFigure } from '@/components/study-results';
import { PLOT_COLOURS } from '@/components/study-results/calibration-plot';
import { LazyPlot } from '@/components/study-results/lazy-plot';

function responseAt(result: RunResult, x: number): number {
  const c = result.calibration!;
  const segment = c.segments?.find((s) => x <= s.xHigh) ?? c.segments?.at(-1);
  if (segment) return segment.intercept + segment.slope * x;
  return c.intercept + c.slope * x + (c.curvature ?? 0) * x * x;
}

const span = (from: number, to: number, steps = 40) => Array.from({ length: steps + 1 }, (_, i) => from + ((to - from) * i) / steps);

/**
 * The run's standards and calibration with each sample projected onto the line and down to the
 * concentration axis, so the graphical reading matches the number in the table. A one-point run
 * also shows the validation's line through the same standard: the gap between them is the bias.
 */
export function RunPlot({
  data,
  result,
  units,
  height = 420,
}: {
  data: RunData;
  result: RunResult;
  units: { x?: string; y?: string };
  height?: number;
}) {
  const { traces, layout } = calibrationFigure(data as unknown as StudyInput, result as unknown as EvaluationResult, units);
  const calibration = result.calibration;
  const extra: Data[] = [];
  const xTop = (layout.xaxis?.range as [number, number] | undefined)?.[1] ?? calibration?.xMax ?? 1;
  const highestRead = Math.max(...result.unknowns.map((u) => u.x0Undiluted));
  if (calibration && highestRead > calibration.xMax) {
    const x = span(calibration.xMax, highestRead);
    extra.push({
      type: 'scatter',
      mode: 'lines',
      x,
      y: x.map((at) => responseAt(result, at)),
      name: 'Line beyond the top standard (extrapolated)',
      line: { color: PLOT_COLOURS.line, width: 2, dash: 'dot' },
      hoverinfo: 'skip',
    });
  }
  const reference = result.onePointBias?.referenceLine;
  if (reference) {
    const x = [0, xTop];
    extra.push({
      type: 'scatter',
      mode: 'lines',
      x,
      y: x.map((at) => reference.intercept + reference.slope * at),
      name: 'Validation line through the same standard',
      line: { color: PLOT_COLOURS.unknown, width: 2, dash: 'dash' },
      hovertemplate: `Validation line: y = ${formatNumber(reference.intercept, 4)} + ${formatNumber(reference.slope, 5)}·x<extra></extra>`,
    });
  }
  // The run's points cannot be excluded by clicking, unlike a study's.
  const plain = traces.map((trace) => {
    const name = 'name' in trace ? trace.name : undefined;
    if (name === 'Standards') return { ...trace, hovertemplate: 'Standard<br>x = %{x}<br>y = %{y}<extra></extra>' };
    if (name?.startsWith('Excluded standards'))
      return { ...trace, name: 'Standards not used (hollow)', hovertemplate: 'Standard not used<br>x = %{x}<br>y = %{y}<extra></extra>' };
    return trace;
  });
  const samples = result.unknowns.length;
  return (
    <LazyPlot
      label={`Run calibration: ${data.standards.length} standards and ${samples} sample${samples === 1 ? '' : 's'} projected onto the line and down to the concentration axis`}
      data={[...plain, ...extra]}
      layout={layout}
      height={height}
    />
  );
}
