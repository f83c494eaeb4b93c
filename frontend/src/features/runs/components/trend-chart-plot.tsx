import { formatNumber, type QcTrendsDto } from '@meritline/shared';
import type { Data, Shape } from 'plotly.js-dist-min';
import { LazyPlot } from '@/components/study-results/lazy-plot';

const COLOURS = { baseline: '#8a9a98', point: '#1c4f4b', flagged: '#a3361a', mean: '#22635d', warning: '#b5650a', action: '#a3361a' };

/** The series in run order: baseline values in grey, later values judged against the mean and the ± 2 s and ± 3 s limits. */
export function TrendChartPlot({ chart }: { chart: QcTrendsDto }) {
  const x = chart.points.map((_, i) => i + 1);
  const label = (p: QcTrendsDto['points'][number]) =>
    `${p.runTitle}${p.item ? `<br>${p.item}` : ''}<br>${new Date(p.createdAt).toLocaleDateString()}${p.signals.length ? `<br>${p.signals.join('<br>')}` : ''}`;
  const trace = (
    name: string,
    keep: (p: QcTrendsDto['points'][number]) => boolean,
    color: string,
    symbol: 'circle' | 'circle-open' | 'diamond',
  ): Data => {
    const idx = chart.points.map((p, i) => (keep(p) ? i : -1)).filter((i) => i >= 0);
    return {
      type: 'scatter',
      mode: 'markers',
      name,
      x: idx.map((i) => x[i]),
      y: idx.map((i) => chart.points[i].value),
      text: idx.map((i) => label(chart.points[i])),
      marker: { size: 10, color, symbol },
      hovertemplate: '%{text}<br>%{y}<extra></extra>',
    };
  };
  const data: Data[] = [
    {
      type: 'scatter',
      mode: 'lines',
      x,
      y: chart.points.map((p) => p.value),
      line: { color: 'rgba(28,79,75,0.3)', width: 1 },
      hoverinfo: 'skip',
      showlegend: false,
    },
    trace('Baseline (sets the limits)', (p) => p.baseline, COLOURS.baseline, 'circle-open'),
    trace('Judged by the run rules', (p) => !p.baseline && p.signals.length === 0, COLOURS.point, 'circle'),
    trace('Signal', (p) => p.signals.length > 0, COLOURS.flagged, 'diamond'),
  ];
  const shapes: Partial<Shape>[] = [];
  const line = (y: number, color: string, dash: 'solid' | 'dash' | 'dot', name: string) => {
    shapes.push({ type: 'line', xref: 'paper', x0: 0, x1: 1, y0: y, y1: y, line: { color, width: 1.5, dash } });
    if (name)
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
  const { limits } = chart;
  if (limits) {
    line(limits.mean, COLOURS.mean, 'solid', `Baseline mean ${formatNumber(limits.mean, 5)}`);
    limits.warning.forEach((y, i) => line(y, COLOURS.warning, 'dash', i === 0 ? 'Warning limits (mean ± 2 s)' : ''));
    limits.action.forEach((y, i) => line(y, COLOURS.action, 'dot', i === 0 ? 'Action limits (mean ± 3 s)' : ''));
  }
  const ys = [...chart.points.map((p) => p.value), ...(limits ? limits.action : [])];
  const pad = (Math.max(...ys) - Math.min(...ys)) * 0.08 || Math.abs(ys[0] ?? 1) * 0.05 || 1;
  return (
    <LazyPlot
      label={`${chart.seriesLabel} control chart: ${chart.points.length} values with the baseline mean and the warning and action limits`}
      data={data}
      height={420}
      layout={{
        shapes,
        xaxis: {
          title: { text: 'Value, oldest run first' },
          dtick: chart.points.length > 30 ? undefined : 1,
          range: [0.5, Math.max(1, chart.points.length) + 0.5],
        },
        yaxis: { title: { text: `${chart.seriesLabel} (${chart.unit})` }, range: [Math.min(...ys) - pad, Math.max(...ys) + pad] },
      }}
    />
  );
}
