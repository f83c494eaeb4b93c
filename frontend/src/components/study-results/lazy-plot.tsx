import { Box, Skeleton, Text } from '@chakra-ui/react';
import type { Config, Data, Layout } from 'plotly.js-dist-min';
import { lazy, Suspense } from 'react';
import { useColorMode } from '@/components/ui/color-mode';

const loadPlotly = () => import('./plotly-chart');
const PlotlyChart = lazy(loadPlotly);

/** Starts fetching Plotly in the background, e.g. when a screen that will plot opens. */
export function preloadPlotly() {
  void loadPlotly();
}

export interface PlotClickPoint {
  customdata?: unknown;
}

export interface LazyPlotProps {
  /** Describes the plot for people who cannot see it. */
  label: string;
  data: Data[];
  layout: Partial<Layout>;
  height: number;
  onPointClick?: (point: PlotClickPoint) => void;
}

// Laboratory data stays in the app: no logo link, no cloud button, nothing fetched from Plotly's servers.
// (Plotly 4 has no showLink or showEditInChartStudio any more; showSendToCloud is on by default.)
const CONFIG: Partial<Config> = {
  displaylogo: false,
  showSendToCloud: false,
  plotlyServerURL: '',
  topojsonURL: '/topojson/',
  typesetMath: false,
  responsive: true,
  modeBarButtonsToRemove: ['lasso2d', 'select2d', 'autoScale2d', 'sendChartToCloud'],
  toImageButtonOptions: { format: 'png', scale: 2 },
};

/** A Plotly chart in Meritline's type and colours; Plotly itself loads on first use. */
export function LazyPlot({ label, data, layout, height, onPointClick }: LazyPlotProps) {
  const { colorMode } = useColorMode();
  const ink = colorMode === 'dark' ? '#dde2e8' : '#272f3a';
  const grid = colorMode === 'dark' ? 'rgba(221,226,232,0.12)' : 'rgba(39,47,58,0.1)';
  const axis = { gridcolor: grid, zerolinecolor: grid, linecolor: grid, automargin: true };
  const fullLayout: Partial<Layout> = {
    height,
    autosize: true,
    margin: { l: 64, r: 16, t: 8, b: 56 },
    paper_bgcolor: 'rgba(0,0,0,0)',
    plot_bgcolor: 'rgba(0,0,0,0)',
    font: { family: "'IBM Plex Sans', system-ui, sans-serif", size: 13, color: ink },
    // Above the plot: below it, the legend would collide with the x-axis title.
    legend: { orientation: 'h', x: 0, xanchor: 'left', y: 1.02, yanchor: 'bottom', font: { size: 12 } },
    hovermode: 'closest',
    ...layout,
    xaxis: { ...axis, ...layout.xaxis },
    yaxis: { ...axis, ...layout.yaxis },
  };
  return (
    <Box as="figure" role="group" aria-label={label} width="full" minH={`${height}px`} m="0">
      <Suspense
        fallback={
          <Skeleton height={`${height}px`} borderRadius="l2" display="grid" placeItems="center">
            <Text>Drawing the plot…</Text>
          </Skeleton>
        }
      >
        <PlotlyChart
          data={data}
          layout={fullLayout}
          config={CONFIG}
          useResizeHandler
          style={{ width: '100%', height: `${height}px` }}
          onClick={
            onPointClick
              ? (event: { points?: PlotClickPoint[] }) => {
                  const point = event.points?.[0];
                  if (point) onPointClick(point);
                }
              : undefined
          }
        />
      </Suspense>
    </Box>
  );
}
