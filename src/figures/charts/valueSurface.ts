/**
 * The value surface V^π(s) over two state axes as a Chart.js chart: the heat-map layer under
 * linear axes for the two states (y increasing upward), our colour bar on the right, hatching
 * and its legend where the logs never went, and a tooltip (x, y, V, visits) on hover.
 */
import type { ChartConfiguration, TooltipItem } from 'chart.js';
import type { SurfaceData as ValueSurface } from './figureData';
import { colourBarPlugin } from '../parts/colourBar';
import { createColourScale, parseColour, rgbText, type ColourScheme } from '../parts/colourScale';
import { axisTitles, sharedOptions, valueAxis } from '../parts/chartStyle';
import { heatmapLayerPlugin } from '../parts/heatmapLayer';
import type { PlotLook } from '../parts/plotLook';
import type { Theme } from '../parts/plotTheme';
import { surfaceGeometry, unvisitedCount, unvisitedRuns } from '../parts/surfaceCells';
import { surfaceRaster } from '../parts/surfaceRaster';
import { formatValue } from '../parts/tickFormat';
import { plainText } from '../parts/richText';
import { unvisitedLegendPlugin } from '../parts/unvisitedLegend';

export const VALUE_SURFACE_DEFAULTS = {
  colourScheme: 'viridis' as ColourScheme,
  /** On-screen height in CSS px. */
  heightPx: 440,
} as const;

export interface ValueSurfacePlotProps {
  surface: ValueSurface;
  xLabel: string;
  yLabel: string;
  /** What V is, with units, e.g. "V^π (cost, kWh)". */
  valueLabel: string;
  title: string;
  theme: Theme;
  /** Optional line under the title, e.g. the values the other states are held at. */
  heldLabel?: string;
  colourScheme?: ColourScheme;
}

type CellPoint = { x: number; y: number };

export function valueSurfaceChart(props: ValueSurfacePlotProps, look: PlotLook): ChartConfiguration<'scatter', CellPoint[]> {
  const { surface } = props;
  const geometry = surfaceGeometry(surface);
  const scale = createColourScale(surface.values, props.colourScheme ?? VALUE_SURFACE_DEFAULTS.colourScheme);
  const raster = surfaceRaster(surface.values, geometry.nx, geometry.ny, scale, parseColour(look.palette.noValue));
  const runs = unvisitedRuns(surface.visits, geometry.nx, geometry.ny);
  const shared = sharedOptions(look, props.title, props.heldLabel ?? null);
  const plugins = [
    heatmapLayerPlugin({ raster, geometry, unvisited: runs, look }),
    colourBarPlugin({ scale, label: props.valueLabel, look }),
  ];
  plugins.push(...axisTitles(look, [{ scaleId: 'x', position: 'bottom', text: props.xLabel }, { scaleId: 'y', position: 'left', text: props.yLabel }]));
  if (runs.length > 0) {
    const empty = unvisitedCount(surface.visits);
    plugins.push(unvisitedLegendPlugin({
      text: `no logged state nearest these cells (${empty.toLocaleString('en-US')} of ${surface.visits.length.toLocaleString('en-US')} cells): V there is extrapolated`,
      swatchFill: rgbText(scale.colourAt(0.5)), look,
    }));
  }
  return {
    type: 'scatter',
    data: { datasets: look.interactive ? [hoverCells(surface)] : [] },
    plugins,
    options: {
      ...shared,
      parsing: false,
      normalized: true,
      interaction: { mode: 'nearest', intersect: false },
      scales: {
        x: { type: 'linear', min: geometry.xExtent[0], max: geometry.xExtent[1], ...valueAxis(look, 'bottom', false) },
        y: { type: 'linear', min: geometry.yExtent[0], max: geometry.yExtent[1], ...valueAxis(look, 'left', false) },
      },
      plugins: {
        ...shared.plugins,
        legend: { display: false },
        tooltip: { ...shared.plugins?.tooltip, displayColors: false, callbacks: { title: () => '', label: (item) => cellTooltip(props, item) } },
      },
    },
  };
}

/** Invisible points at the cell centres, in values order (index iy·nx + ix), for the tooltip. */
function hoverCells(surface: ValueSurface) {
  const nx = surface.x.length, ny = surface.y.length, data: CellPoint[] = [];
  for (let iy = 0; iy < ny; iy++) for (let ix = 0; ix < nx; ix++) data.push({ x: surface.x[ix], y: surface.y[iy] });
  return { label: 'cells', data, pointRadius: 0, pointHoverRadius: 0, pointHitRadius: 0 };
}

function cellTooltip(props: ValueSurfacePlotProps, item: TooltipItem<'scatter'>): string[] {
  const { surface } = props, i = item.dataIndex, nx = surface.x.length;
  const visits = surface.visits[i];
  return [
    `${props.xLabel}: ${formatValue(surface.x[i % nx])}`,
    `${props.yLabel}: ${formatValue(surface.y[Math.floor(i / nx)])}`,
    `${plainText(props.valueLabel)}: ${formatValue(surface.values[i])}`,
    visits === 0 ? 'never visited by the logs (extrapolated)' : `${visits} logged state${visits === 1 ? '' : 's'} nearest this cell`,
  ];
}

/** Text alternative for screen readers and the figure's description. */
export function valueSurfaceSummary(props: ValueSurfacePlotProps): string {
  const { surface, xLabel, yLabel, valueLabel } = props, nx = surface.x.length, ny = surface.y.length;
  let lo = -1, hi = -1;
  for (let i = 0; i < surface.values.length; i++) {
    const v = surface.values[i];
    if (!Number.isFinite(v)) continue;
    if (lo < 0 || v < surface.values[lo]) lo = i;
    if (hi < 0 || v > surface.values[hi]) hi = i;
  }
  const at = (i: number) => `${xLabel} ${formatValue(surface.x[i % nx])}, ${yLabel} ${formatValue(surface.y[Math.floor(i / nx)])}`;
  const span = (a: Float64Array) => `${formatValue(a[0])} to ${formatValue(a[a.length - 1])}`;
  const unvisited = unvisitedCount(surface.visits);
  const extremes = lo < 0 ? 'No cell has a finite value.'
    : `Lowest ${formatValue(surface.values[lo])} at ${at(lo)}; highest ${formatValue(surface.values[hi])} at ${at(hi)}.`;
  return `Heat map of ${plainText(valueLabel)} over ${xLabel} (${span(surface.x)}) and ${yLabel} (${span(surface.y)}) on a ${nx}×${ny} grid. ${extremes} `
    + `${unvisited} of ${nx * ny} cells were never visited by the logs and are hatched.`;
}
