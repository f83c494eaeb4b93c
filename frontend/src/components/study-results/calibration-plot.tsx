import { type EvaluationResult, formatLevel, type StudyInput } from '@meritline/shared';
import type { Data, Layout } from 'plotly.js-dist-min';
import { LazyPlot } from './lazy-plot';
import type { StudyResultsProps, StudyUnits } from './types';

export const PLOT_COLOURS = {
  line: '#1c4f4b',
  standard: '#22635d',
  excluded: '#687586',
  confidence: 'rgba(47,122,114,0.28)',
  prediction: 'rgba(47,122,114,0.12)',
  unknown: '#b5650a',
  guide: 'rgba(181,101,10,0.55)',
};

/** Points as markers at their concentration, with the value `y` gives. */
export const markersAt = <P extends { x: number }>(name: string, points: readonly P[], y: (point: P) => number) => ({
  type: 'scatter' as const,
  mode: 'markers' as const,
  name,
  x: points.map((p) => p.x),
  y: points.map(y),
});

const axisTitle = (name: string, unit: string | undefined) => (unit ? `${name} (${unit})` : name);

function extent(values: number[], includeZero: boolean): [number, number] {
  const all = includeZero ? [0, ...values] : values;
  const low = Math.min(...all);
  const high = Math.max(...all);
  const pad = (high - low || Math.abs(high) || 1) * 0.05;
  return [low - pad, high + pad];
}

interface Curve {
  x: number[];
  fit: number[];
  confidence?: [number[], number[]];
  prediction?: [number[], number[]];
}

function fittedCurve(result: EvaluationResult): Curve | null {
  const c = result.calibration;
  if (!c) return null;
  if (c.bands && c.bands.length > 0) {
    const x = c.bands.map((b) => b.x);
    return {
      x,
      fit: c.bands.map((b) => b.fit),
      confidence: [c.bands.map((b) => b.fit - b.confidenceHalfWidth), c.bands.map((b) => b.fit + b.confidenceHalfWidth)],
      prediction: [c.bands.map((b) => b.fit - b.predictionHalfWidth), c.bands.map((b) => b.fit + b.predictionHalfWidth)],
    };
  }
  const from = c.model === 'one-point' || c.model === 'linear-through-origin' ? Math.min(0, c.xMin) : c.xMin;
  const x = Array.from({ length: 51 }, (_, i) => from + ((c.xMax - from) * i) / 50);
  const segmentAt = (at: number) => c.segments?.find((s) => at >= s.xLow && at <= s.xHigh);
  const fit = x.map((at) => {
    const segment = segmentAt(at);
    if (segment) return segment.intercept + segment.slope * at;
    return c.intercept + c.slope * at + (c.curvature ?? 0) * at * at;
  });
  return { x, fit };
}

/** Traces and layout of the calibration plot; pure, so tests and reports can use it without a browser. */
export function calibrationFigure(
  data: StudyInput,
  result: EvaluationResult,
  units: StudyUnits,
): { traces: Data[]; layout: Partial<Layout> } {
  const standards = (data.standards ?? []).map((s, index) => ({ ...s, index }));
  const used = standards.filter((s) => !s.excluded);
  const excluded = standards.filter((s) => s.excluded);
  const curve = fittedCurve(result);
  const confidencePct = `${formatLevel(result.confidence * 100)} %`;
  const unknowns = (result.unknowns ?? []).map((u) => ({ ...u, xRead: u.x0 / (u.dilution || 1) }));

  const xs = [...standards.map((s) => s.x), ...(curve?.x ?? []), ...unknowns.map((u) => u.xRead)];
  const ys = [
    ...standards.map((s) => s.y),
    ...(curve ? [...curve.fit, ...(curve.prediction?.[0] ?? []), ...(curve.prediction?.[1] ?? [])] : []),
    ...unknowns.map((u) => u.yMean),
  ];
  const xRange = extent(xs.length > 0 ? xs : [0, 1], true);
  const yRange = extent(ys.length > 0 ? ys : [0, 1], true);

  const traces: Data[] = [];
  const band = (name: string, [low, high]: [number[], number[]], fillcolor: string) => {
    traces.push(
      { type: 'scatter', mode: 'lines', x: curve!.x, y: low, line: { width: 0 }, hoverinfo: 'skip', showlegend: false, legendgroup: name },
      {
        type: 'scatter',
        mode: 'lines',
        x: curve!.x,
        y: high,
        line: { width: 0 },
        fill: 'tonexty',
        fillcolor,
        name,
        hoverinfo: 'skip',
        legendgroup: name,
      },
    );
  };
  if (curve?.prediction) band(`Prediction band, ${confidencePct}`, curve.prediction, PLOT_COLOURS.prediction);
  if (curve?.confidence) band(`Confidence band, ${confidencePct}`, curve.confidence, PLOT_COLOURS.confidence);
  if (curve) {
    traces.push({
      type: 'scatter',
      mode: 'lines',
      x: curve.x,
      y: curve.fit,
      name: 'Fitted calibration',
      line: { color: PLOT_COLOURS.line, width: 2 },
      hoverinfo: 'skip',
    });
  }
  traces.push({
    ...markersAt('Standards', used, (s) => s.y),
    customdata: used.map((s) => [s.index, s.index + 1]) as unknown as number[],
    marker: { color: PLOT_COLOURS.standard, size: 9, symbol: 'circle', line: { color: '#ffffff', width: 1 } },
    hovertemplate: 'Standard row %{customdata[1]}<br>x = %{x}<br>y = %{y}<br>Click to exclude<extra></extra>',
  });
  if (excluded.length > 0) {
    traces.push({
      ...markersAt('Excluded standards (hollow)', excluded, (s) => s.y),
      customdata: excluded.map((s) => [s.index, s.index + 1, s.excluded?.reason ?? '']) as unknown as number[],
      marker: { color: PLOT_COLOURS.excluded, size: 10, symbol: 'circle-open', line: { width: 2 } },
      hovertemplate:
        'Standard row %{customdata[1]}, excluded: %{customdata[2]}<br>x = %{x}<br>y = %{y}<br>Click to include again<extra></extra>',
    });
  }
  if (unknowns.length > 0) {
    const guideX: (number | null)[] = [];
    const guideY: (number | null)[] = [];
    for (const u of unknowns) {
      guideX.push(xRange[0], u.xRead, u.xRead, null);
      guideY.push(u.yMean, u.yMean, yRange[0], null);
    }
    traces.push(
      {
        type: 'scatter',
        mode: 'lines',
        x: guideX,
        y: guideY,
        line: { color: PLOT_COLOURS.guide, width: 1.2, dash: 'dash' },
        hoverinfo: 'skip',
        showlegend: false,
        connectgaps: false,
      },
      {
        type: 'scatter',
        mode: 'markers',
        name: 'Samples read off the line (undiluted reading)',
        x: unknowns.map((u) => u.xRead),
        y: unknowns.map((u) => u.yMean),
        text: unknowns.map((u) => u.id),
        marker: { color: PLOT_COLOURS.unknown, size: 11, symbol: 'diamond', line: { color: '#ffffff', width: 1 } },
        hovertemplate: 'Sample %{text}<br>mean response %{y}<br>read as %{x} before dilution<extra></extra>',
      },
    );
  }
  return {
    traces,
    layout: {
      xaxis: { title: { text: axisTitle('Concentration', units.x) }, range: xRange, zeroline: true },
      yaxis: { title: { text: axisTitle('Response', units.y) }, range: yRange, zeroline: true },
    },
  };
}

export interface CalibrationPlotProps extends StudyResultsProps {
  /** Called with the position of a standard in `data.standards` when its point is clicked. */
  onPointClick?: (standardIndex: number) => void;
  height?: number;
  /** A small plot without legend, for side panels (say in words what the marks mean beside it). */
  compact?: boolean;
}

/** Standards, fitted line, confidence and prediction bands, excluded points hollow, samples read off the line. */
export function CalibrationPlot({ data, result, units, onPointClick, height = 440, compact = false }: CalibrationPlotProps) {
  const { traces, layout } = calibrationFigure(data, result, units);
  const n = (data.standards ?? []).length;
  return (
    <LazyPlot
      label={`Calibration plot: ${n} standards, concentration against response, with the fitted line and its bands`}
      data={traces}
      layout={compact ? { ...layout, showlegend: false, margin: { l: 56, r: 8, t: 8, b: 48 } } : layout}
      height={height}
      onPointClick={
        onPointClick
          ? (point) => {
              const index = Array.isArray(point.customdata) ? point.customdata[0] : undefined;
              if (typeof index === 'number') onPointClick(index);
            }
          : undefined
      }
    />
  );
}
