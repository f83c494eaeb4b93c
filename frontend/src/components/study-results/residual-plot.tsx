import type { Data } from 'plotly.js-dist-min';
import { markersAt, PLOT_COLOURS } from './calibration-plot';
import { LazyPlot } from './lazy-plot';
import type { StudyResultsProps } from './types';

/** Residuals of the standards used, with ±2 s(y/x) as a guide: a pattern means the model misses something. */
export function ResidualPlot({ result, units, height = 320 }: Pick<StudyResultsProps, 'result' | 'units'> & { height?: number }) {
  const c = result.calibration;
  if (!c) return null;
  const points = c.backCalculated.map((p, i) => ({ ...p, residual: c.residuals[i] ?? 0 }));
  const xs = points.map((p) => p.x);
  const low = Math.min(0, ...xs);
  const high = Math.max(...xs, 0);
  const traces: Data[] = [
    {
      type: 'scatter',
      mode: 'lines',
      x: [low, high],
      y: [0, 0],
      line: { color: PLOT_COLOURS.line, width: 1.5 },
      name: 'Zero',
      hoverinfo: 'skip',
    },
  ];
  if (c.sYX !== null && c.weighting === 'none') {
    const band = 2 * c.sYX;
    traces.push({
      type: 'scatter',
      mode: 'lines',
      x: [low, high, null, low, high],
      y: [band, band, null, -band, -band],
      line: { color: PLOT_COLOURS.excluded, width: 1, dash: 'dot' },
      name: '±2 s(y/x)',
      hoverinfo: 'skip',
      connectgaps: false,
    });
  }
  traces.push({
    ...markersAt('Residuals of the standards used', points, (p) => p.residual),
    customdata: points.map((p) => p.index + 1),
    marker: { color: PLOT_COLOURS.standard, size: 8, symbol: 'circle' },
    hovertemplate: 'Standard row %{customdata}<br>x = %{x}<br>residual = %{y}<extra></extra>',
  });
  return (
    <LazyPlot
      label={`Residual plot: the residual of each of the ${points.length} standards used against its concentration`}
      data={traces}
      layout={{
        xaxis: { title: { text: units.x ? `Concentration (${units.x})` : 'Concentration' } },
        yaxis: { title: { text: units.y ? `Residual (${units.y})` : 'Residual' }, zeroline: false },
      }}
      height={height}
    />
  );
}
