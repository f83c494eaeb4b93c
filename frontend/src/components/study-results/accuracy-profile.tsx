import { Stack, Text } from '@chakra-ui/react';
import {
  formatLevel,
  figureLabel,
  type AccuracyProfileLevel,
  type AccuracyProfileResult,
  type EvaluationResult,
  type TruenessResult,
  formatNumber,
  formatPercent,
  withUnit,
} from '@meritline/shared';
import type { Data, Layout } from 'plotly.js-dist-min';
import { useMemo } from 'react';
import { DataTable, dataTableColumns } from '@/components/data-table';
import { PLOT_COLOURS } from './calibration-plot';
import { FiguresTable, type FigureRow } from './figures-table';
import { criteriaForFigure, criteriaUnder } from './judge-criteria';
import { LazyPlot } from './lazy-plot';
import type { JudgedFiguresProps, StudyUnits } from './types';

const betaWords = (beta: number) => `${formatLevel(beta * 100)} %`;

/** "from 1.2 to 10 mg/L", or why there is none. */
export function validityWords(profile: AccuracyProfileResult, unit: string | undefined): string {
  if (profile.validFrom === null || profile.validTo === null)
    return `at no level do the tolerance limits stay inside ±${formatLevel(profile.lambda)} %`;
  return `from ${formatNumber(profile.validFrom, 4)} to ${withUnit(formatNumber(profile.validTo, 4), unit)}`;
}

/**
 * Relative bias and β-expectation tolerance limits at each level against the ±λ acceptance limits;
 * the validity domain (where the limits stay inside) is shaded.
 */
export function AccuracyProfilePlot({ result, units, height = 340 }: { result: EvaluationResult; units: StudyUnits; height?: number }) {
  const profile = result.accuracyProfile;
  const plot = useMemo(() => {
    if (!profile) return null;
    const xs = profile.levels.map((l) => l.nominal);
    const low = Math.min(...xs);
    const high = Math.max(...xs);
    const pad = (high - low) * 0.05 || low * 0.1 || 1;
    const limitLine = (y: number, name: string, showlegend: boolean): Data => ({
      type: 'scatter',
      mode: 'lines',
      x: [low - pad, high + pad],
      y: [y, y],
      name,
      showlegend,
      legendgroup: 'lambda',
      line: { color: PLOT_COLOURS.unknown, width: 1.5, dash: 'dash' },
      hoverinfo: 'skip',
    });
    const limit = (key: 'lowerPct' | 'upperPct', name: string, showlegend: boolean): Data => ({
      type: 'scatter',
      mode: 'lines+markers',
      x: xs,
      y: profile.levels.map((l) => l[key]),
      name,
      showlegend,
      legendgroup: 'tolerance',
      line: { color: PLOT_COLOURS.line, width: 1.5, dash: 'dot' },
      marker: { size: 6, symbol: key === 'lowerPct' ? 'triangle-up' : 'triangle-down', color: PLOT_COLOURS.line },
      hovertemplate: `%{x}: %{y:.2f} %<extra>${name}</extra>`,
    });
    const data: Data[] = [
      limitLine(profile.lambda, `Acceptance limits ±${formatLevel(profile.lambda)} %`, true),
      limitLine(-profile.lambda, '', false),
      limit('upperPct', `Tolerance limits (β = ${betaWords(profile.beta)})`, true),
      limit('lowerPct', 'Lower tolerance limit', false),
      {
        type: 'scatter',
        mode: 'lines+markers',
        x: xs,
        y: profile.levels.map((l) => l.biasPct),
        name: 'Relative bias',
        line: { color: PLOT_COLOURS.standard, width: 2 },
        marker: { size: 8, color: PLOT_COLOURS.standard },
        hovertemplate: '%{x}: %{y:.2f} %<extra>Relative bias</extra>',
      },
    ];
    const shapes: Layout['shapes'] =
      profile.validFrom !== null && profile.validTo !== null
        ? [
            {
              type: 'rect',
              xref: 'x',
              yref: 'paper',
              x0: profile.validFrom,
              x1: profile.validTo,
              y0: 0,
              y1: 1,
              fillcolor: 'rgba(47,122,114,0.12)',
              line: { width: 0 },
              layer: 'below',
            },
          ]
        : [];
    const reach = Math.max(
      profile.lambda * 1.3,
      ...profile.levels.flatMap((l) => [Math.abs(l.lowerPct), Math.abs(l.upperPct)]).map((v) => v * 1.1),
    );
    return { data, shapes, reach };
  }, [profile]);
  if (!profile || !plot) return null;
  return (
    <Stack gap="1">
      <LazyPlot
        label={`Accuracy profile: relative bias and ${betaWords(profile.beta)} β-expectation tolerance limits at ${profile.levels.length} levels against acceptance limits of ±${formatLevel(profile.lambda)} %; valid ${validityWords(profile, units.x)}`}
        data={plot.data}
        layout={{
          shapes: plot.shapes,
          xaxis: { title: { text: units.x ? `Nominal concentration (${units.x})` : 'Nominal concentration' } },
          yaxis: { title: { text: 'Relative bias (%)' }, range: [-plot.reach, plot.reach], zeroline: true },
        }}
        height={height}
      />
      <Text fontSize="sm" color="fg.muted">
        Shaded: the validity domain, where both tolerance limits stay inside the acceptance limits.
      </Text>
    </Stack>
  );
}

const column = dataTableColumns<AccuracyProfileLevel>();

function profileColumns(units: StudyUnits) {
  const pct = (v: number) => formatPercent(v, 3);
  return column.columns([
    column.accessor('level', { header: 'Level' }),
    column.accessor('nominal', {
      header: units.x ? `Nominal (${units.x})` : 'Nominal',
      meta: { align: 'end' },
      cell: (i) => formatNumber(i.getValue(), 4),
    }),
    column.display({
      id: 'design',
      header: 'Series × replicates',
      meta: { align: 'end' },
      cell: (i) => `${i.row.original.series} × ${i.row.original.replicates}`,
    }),
    column.accessor('mean', {
      header: units.x ? `Mean found (${units.x})` : 'Mean found',
      meta: { align: 'end' },
      cell: (i) => formatNumber(i.getValue(), 4),
    }),
    column.accessor('biasPct', { header: 'Relative bias', meta: { align: 'end' }, cell: (i) => pct(i.getValue()) }),
    column.accessor('rsdRPct', { header: 'Repeatability RSD', meta: { align: 'end' }, cell: (i) => pct(i.getValue()) }),
    column.accessor('rsdIPct', { header: 'Intermediate precision RSD', meta: { align: 'end' }, cell: (i) => pct(i.getValue()) }),
    column.accessor('lowerPct', { header: 'Lower tolerance limit', meta: { align: 'end' }, cell: (i) => pct(i.getValue()) }),
    column.accessor('upperPct', { header: 'Upper tolerance limit', meta: { align: 'end' }, cell: (i) => pct(i.getValue()) }),
    column.accessor('within', { header: 'Inside ±λ', cell: (i) => (i.getValue() ? 'Yes' : 'No') }),
  ]);
}

export function AccuracyProfileTables({ result, units, judged }: JudgedFiguresProps) {
  const columns = useMemo(() => profileColumns(units), [units]);
  const profile = result.accuracyProfile;
  if (!profile) return null;
  const rows: FigureRow[] = [
    {
      id: 'validFrom',
      label: figureLabel('accuracyProfile.validFrom'),
      value: profile.validFrom === null ? '—' : withUnit(formatNumber(profile.validFrom, 4), units.x),
      detail: 'Where the profile enters the acceptance limits; between levels it is read off a straight line.',
      criteria: criteriaForFigure(judged, 'accuracyProfile.validFrom'),
    },
    {
      id: 'validTo',
      label: figureLabel('accuracyProfile.validTo'),
      value: profile.validTo === null ? '—' : withUnit(formatNumber(profile.validTo, 4), units.x),
      criteria: criteriaForFigure(judged, 'accuracyProfile.validTo'),
    },
  ];
  const perLevel = criteriaUnder(judged, 'accuracyProfile.levels');
  if (perLevel.length > 0)
    rows.push({ id: 'levels', label: 'Figures at single levels', value: '', detail: 'See the table by level.', criteria: perLevel });
  return (
    <Stack gap="4">
      <Text>
        With β = {betaWords(profile.beta)} and acceptance limits of ±{formatLevel(profile.lambda)} %, the method is valid{' '}
        <Text as="strong">{validityWords(profile, units.x)}</Text>: on average, {betaWords(profile.beta)} of future results in that range
        are expected within ±{formatLevel(profile.lambda)} % of the true value.
      </Text>
      <FiguresTable label="Validity domain of the accuracy profile" rows={rows} />
      <DataTable label="Accuracy profile by level" columns={columns} data={profile.levels} getRowId={(row) => row.level} />
    </Stack>
  );
}

/** The comparison with the certified value in a sentence anyone can read, then its figures. */
export function truenessSentence(t: TruenessResult, unit: string | undefined): string {
  const direction = t.difference >= 0 ? 'above' : 'below';
  const verdict = t.significant
    ? 'larger than the expanded uncertainty of the difference, so the method shows a bias on this material'
    : 'within the expanded uncertainty of the difference, so no bias is shown on this material';
  return (
    `The mean of ${t.n} results on the reference material is ${withUnit(formatNumber(t.mean, 4), unit)}, ` +
    `${withUnit(formatNumber(Math.abs(t.difference), 3), unit)} (${formatPercent(Math.abs(t.differencePct), 3)}) ${direction} the certified ` +
    `${withUnit(formatLevel(t.certified), unit)}. That difference is ${verdict} (${withUnit(formatNumber(t.UDifference, 3), unit)}, k = 2).`
  );
}

export function TruenessSummary({ result, units, judged }: JudgedFiguresProps) {
  const t = result.trueness;
  if (!t) return null;
  const x = (v: number, digits = 4) => withUnit(formatNumber(v, digits), units.x);
  const row = (figure: string, value: string, detail?: string): FigureRow => ({
    id: figure,
    label: figureLabel(figure),
    value,
    detail,
    criteria: criteriaForFigure(judged, figure),
  });
  const rows = [
    row('trueness.certified', x(t.certified), `standard uncertainty ${x(t.uCertified, 3)}`),
    row('trueness.mean', x(t.mean), `${t.n} results, SD ${x(t.sd, 3)}`),
    row('trueness.difference', x(t.difference, 3)),
    row('trueness.differencePct', formatPercent(t.differencePct, 3)),
    row('trueness.UDifference', x(t.UDifference, 3), `2 × √(s²/n + u(certified)²)`),
  ];
  return (
    <Stack gap="3">
      <Text data-testid="trueness-words">{truenessSentence(t, units.x)}</Text>
      <FiguresTable label="Trueness against the reference material" rows={rows} />
    </Stack>
  );
}
