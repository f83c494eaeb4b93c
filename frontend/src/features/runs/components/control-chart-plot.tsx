import { formatNumber, formatDate } from '@meritline/shared';
import type { Data, Shape } from 'plotly.js-dist-min';
import { LazyPlot } from '@/components/study-results/lazy-plot';
import type { ControlChart } from '../api/types';

const COLOURS = { point: '#1c4f4b', flagged: '#a3361a', mean: '#22635d', warning: '#b5650a', action: '#a3361a' };

/** Slope of each accepted run in order, with the mean, warning (± 2 s) and action (± 3 s) limits. */
export function ControlChartPlot({ chart }: { chart: ControlChart }) {
  const x = chart.points.map((_, i) => i + 1);
  const flagged = chart.points.map((p) => p.flags.length > 0);
  const data: Data[] = [
    {
      type: 'scatter',
      mode: 'lines+markers',
      name: 'Slope of an accepted run',
      x,
      y: chart.points.map((p) => p.slope),
      text: chart.points.map((p) => `${p.title}<br>${formatDate(p.createdAt)}`),
      line: { color: 'rgba(28,79,75,0.35)', width: 1 },
      marker: {
        size: 10,
        color: flagged.map((f) => (f ? COLOURS.flagged : COLOURS.point)),
        symbol: flagged.map((f) => (f ? 'diamond' : 'circle')),
      },
      hovertemplate: '%{text}<br>slope %{y}<extra></extra>',
    },
  ];
  const shapes: Partial<Shape>[] = [];
  const line = (y: number, color: string, dash: 'solid' | 'dash' | 'dot', name: string) => {
    shapes.push({ type: 'line', xref: 'paper', x0: 0, x1: 1, y0: y, y1: y, line: { color, width: 1.5, dash } });
    data.push({
      type: 'scatter',
      mode: 'lines',
      x: [null as unknown as number],
      y: [null as unknown as number],
      name,
      line: { color, dash },
      hoverinfo: 'skip',
    });
  };
  if (chart.mean !== null && chart.limits) {
    line(chart.mean, COLOURS.mean, 'solid', `Mean ${formatNumber(chart.mean, 5)}`);
    chart.limits.warning.forEach((y, i) => line(y, COLOURS.warning, 'dash', i === 0 ? 'Warning limits (mean ± 2 s)' : ''));
    chart.limits.action.forEach((y, i) => line(y, COLOURS.action, 'dot', i === 0 ? 'Action limits (mean ± 3 s)' : ''));
  }
  // The limit lines are drawn as shapes; only the first of each pair needs a legend entry.
  const legend = data.filter((trace) => !('name' in trace) || trace.name !== '');
  const ys = [...chart.points.map((p) => p.slope), ...(chart.limits ? [...chart.limits.action] : [])];
  const pad = (Math.max(...ys) - Math.min(...ys)) * 0.08 || Math.abs(ys[0] ?? 1) * 0.05;
  return (
    <LazyPlot
      label={`Slope control chart: ${chart.n} accepted runs with the mean and the warning and action limits`}
      data={legend}
      height={420}
      layout={{
        shapes,
        xaxis: { title: { text: 'Accepted run, oldest first' }, dtick: 1, range: [0.5, Math.max(1, chart.points.length) + 0.5] },
        yaxis: { title: { text: `Slope (${chart.slopeUnit})` }, range: [Math.min(...ys) - pad, Math.max(...ys) + pad] },
      }}
    />
  );
}
