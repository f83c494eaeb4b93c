import type { PdfComposer } from './pdf-composer.js';
import { colors, sizes } from './theme.js';
import { niceTicks, type AxisTicks } from './ticks.js';

export interface PlotPoint {
  x: number;
  y: number;
}

export type PlotLayer =
  | {
      type: 'band';
      label?: string;
      points: { x: number; low: number; high: number }[];
      color?: string;
      opacity?: number;
      outline?: boolean;
    }
  | { type: 'line'; label?: string; points: PlotPoint[]; color?: string; width?: number; dashed?: boolean }
  | { type: 'points'; label?: string; points: PlotPoint[]; color?: string; hollow?: boolean; radius?: number }
  | { type: 'hline'; label?: string; y: number; color?: string; dashed?: boolean };

export interface PlotAxis {
  label: string;
  min?: number;
  max?: number;
  /** Stretch the axis to include zero (e.g. concentration from a zero standard). */
  includeZero?: boolean;
}

export interface PlotSpec {
  x: PlotAxis;
  y: PlotAxis;
  layers: PlotLayer[];
  /** Height of the whole figure in points (axes, labels and legend included); width is the content width. */
  height?: number;
  width?: number;
  caption?: string;
}

const TICK_FONT = 7;
const LABEL_FONT = 8;

function extent(spec: PlotSpec, axis: 'x' | 'y'): [number, number] {
  const values: number[] = [];
  for (const layer of spec.layers) {
    if (layer.type === 'hline') {
      if (axis === 'y') values.push(layer.y);
    } else if (layer.type === 'band') {
      for (const p of layer.points) values.push(...(axis === 'x' ? [p.x] : [p.low, p.high]));
    } else {
      for (const p of layer.points) values.push(p[axis]);
    }
  }
  const finite = values.filter(Number.isFinite);
  const settings = spec[axis];
  let lo = settings.min ?? (finite.length ? Math.min(...finite) : 0);
  let hi = settings.max ?? (finite.length ? Math.max(...finite) : 1);
  if (settings.includeZero) [lo, hi] = [Math.min(lo, 0), Math.max(hi, 0)];
  return [lo, hi];
}

function tickLabel(value: number, ticks: AxisTicks): string {
  const text = value.toFixed(ticks.decimals);
  return /^-0(\.0*)?$/.test(text) ? text.slice(1) : text;
}

interface LegendItem {
  layer: PlotLayer;
  x: number;
  row: number;
  labelWidth: number;
}

/** Legend entries flow left to right and wrap to a new row when the next one would not fit. */
function legendLayout(pdf: PdfComposer, layers: PlotLayer[], width: number): LegendItem[] {
  const items: LegendItem[] = [];
  let x = 0;
  let row = 0;
  for (const layer of layers) {
    if (!layer.label) continue;
    const labelWidth = pdf.widthOf(layer.label, { size: TICK_FONT }) + 2;
    const itemWidth = 18 + labelWidth;
    if (x > 0 && x + itemWidth > width) {
      x = 0;
      row++;
    }
    items.push({ layer, x, row, labelWidth });
    x += itemWidth + 14;
  }
  return items;
}

/** An x–y plot in vectors: shaded bands, lines, filled or hollow markers, nice ticks, axis titles and a legend. */
export function drawPlot(pdf: PdfComposer, spec: PlotSpec): void {
  const doc = pdf.doc;
  const width = spec.width ?? pdf.width;
  const height = spec.height ?? 240;
  const captionHeight = spec.caption ? pdf.heightOf(spec.caption, width, { size: sizes.heading3, weight: 'semibold' }) + 4 : 0;
  pdf.ensureSpace(height + captionHeight + 8);
  if (spec.caption) pdf.paragraph(spec.caption, { size: sizes.heading3, weight: 'semibold', gap: 4 });

  const xt = niceTicks(...extent(spec, 'x'), 7);
  const yt = niceTicks(...extent(spec, 'y'), 6);
  const xMin = spec.x.min ?? xt.min;
  const xMax = spec.x.max ?? xt.max;
  const yMin = spec.y.min ?? yt.min;
  const yMax = spec.y.max ?? yt.max;

  const tick = { size: TICK_FONT, color: colors.muted };
  const legend = legendLayout(pdf, spec.layers, width - 20);
  const legendHeight = legend.length ? 4 + 12 * (legend.at(-1)!.row + 1) : 0;
  const yLabelWidth = Math.max(...yt.values.map((v) => pdf.widthOf(tickLabel(v, yt), { size: TICK_FONT })));
  const top = pdf.y + 4;
  const left = pdf.left + 14 + yLabelWidth + 5;
  const right = pdf.left + width - 6;
  const bottom = top + height - 4 - 30 - legendHeight;
  const w = right - left;
  const h = bottom - top;
  const px = (x: number) => left + ((x - xMin) / (xMax - xMin || 1)) * w;
  const py = (y: number) => bottom - ((y - yMin) / (yMax - yMin || 1)) * h;

  doc.save();
  doc.lineWidth(0.35).strokeColor(colors.rule);
  for (const v of yt.values) if (v >= yMin && v <= yMax) doc.moveTo(left, py(v)).lineTo(right, py(v)).stroke();
  for (const v of xt.values) if (v >= xMin && v <= xMax) doc.moveTo(px(v), top).lineTo(px(v), bottom).stroke();
  doc.restore();

  doc.save();
  doc.rect(left, top, w, h).clip();
  for (const layer of spec.layers.filter((l) => l.type !== 'points')) {
    const color = layer.color ?? colors.spruce;
    if (layer.type === 'band' && layer.points.length > 1) {
      const upper = layer.points.map((p) => [px(p.x), py(p.high)] as [number, number]);
      const lower = layer.points.map((p) => [px(p.x), py(p.low)] as [number, number]).reverse();
      doc.save().fillOpacity(layer.opacity ?? 0.25);
      doc.polygon(...upper, ...lower).fill(color);
      doc.restore();
      if (layer.outline) {
        for (const edge of [upper, lower]) {
          doc.save().lineWidth(0.5).dash(2, { space: 2 }).strokeColor(color);
          doc.moveTo(...edge[0]);
          edge.slice(1).forEach((p) => doc.lineTo(...p));
          doc.stroke().undash().restore();
        }
      }
    } else if (layer.type === 'line' && layer.points.length > 1) {
      doc
        .save()
        .lineWidth(layer.width ?? 1.1)
        .strokeColor(color);
      if (layer.dashed) doc.dash(3, { space: 2.5 });
      doc.moveTo(px(layer.points[0].x), py(layer.points[0].y));
      layer.points.slice(1).forEach((p) => doc.lineTo(px(p.x), py(p.y)));
      doc.stroke().undash().restore();
    } else if (layer.type === 'hline') {
      doc.save().lineWidth(0.7).strokeColor(color);
      if (layer.dashed) doc.dash(3, { space: 2.5 });
      doc.moveTo(left, py(layer.y)).lineTo(right, py(layer.y)).stroke().undash().restore();
    }
  }
  doc.restore();

  // Markers on the frame stay whole: they are clipped only a little outside the plot area.
  doc.save();
  doc.rect(left - 5, top - 5, w + 10, h + 10).clip();
  for (const layer of spec.layers) {
    if (layer.type !== 'points') continue;
    const color = layer.color ?? colors.spruce;
    const r = layer.radius ?? 2.4;
    for (const p of layer.points) {
      if (layer.hollow) doc.lineWidth(1).circle(px(p.x), py(p.y), r).fillAndStroke('#ffffff', color);
      else doc.circle(px(p.x), py(p.y), r).fill(color);
    }
  }
  doc.restore();

  doc.save().lineWidth(0.7).strokeColor(colors.ruleStrong);
  doc.moveTo(left, top).lineTo(left, bottom).lineTo(right, bottom).stroke();
  doc.restore();

  for (const v of yt.values) {
    if (v < yMin || v > yMax) continue;
    pdf.textAt(tickLabel(v, yt), left - yLabelWidth - 5, py(v) - 3.5, yLabelWidth, { ...tick, align: 'right' }, false);
  }
  for (const v of xt.values) {
    if (v < xMin || v > xMax) continue;
    pdf.textAt(tickLabel(v, xt), px(v) - 30, bottom + 4, 60, { ...tick, align: 'center' }, false);
  }
  pdf.textAt(spec.x.label, left, bottom + 15, w, { size: LABEL_FONT, align: 'center', color: colors.text }, false);
  doc.save();
  const middle = top + h / 2;
  doc.rotate(-90, { origin: [pdf.left + 4, middle] });
  pdf.textAt(spec.y.label, pdf.left + 4 - h / 2, middle - 5, h, { size: LABEL_FONT, align: 'center', color: colors.text }, false);
  doc.restore();

  for (const item of legend) {
    const layer = item.layer;
    const x = left + item.x;
    const y = bottom + 30 + 12 * item.row;
    const color = layer.color ?? colors.spruce;
    doc.save();
    if (layer.type === 'band')
      doc
        .fillOpacity(layer.opacity ?? 0.25)
        .rect(x, y + 1, 14, 7)
        .fill(color);
    else if (layer.type === 'points' && layer.hollow)
      doc
        .lineWidth(1)
        .circle(x + 7, y + 4.5, 2.4)
        .fillAndStroke('#ffffff', color);
    else if (layer.type === 'points') doc.circle(x + 7, y + 4.5, 2.4).fill(color);
    else {
      doc.lineWidth(1.1).strokeColor(color);
      if (layer.dashed) doc.dash(3, { space: 2 });
      doc
        .moveTo(x, y + 4.5)
        .lineTo(x + 14, y + 4.5)
        .stroke()
        .undash();
    }
    doc.restore();
    pdf.textAt(layer.label!, x + 18, y + 1, item.labelWidth, tick, false);
  }
  doc.x = pdf.left;
  pdf.y = top + height + 6;
}
