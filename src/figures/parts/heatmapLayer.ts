/**
 * The heat map as a canvas layer inside a Chart.js chart: before the datasets draw, paint the grid
 * bitmap over the cells' extent (mapped through the chart's own linear axes, so it lines up with
 * the ticks), then hatch the never-visited cells on top. Clipped to the plot area.
 */
import type { Chart, Plugin } from 'chart.js';
import { drawHatching } from './hatching';
import type { PlotLook } from './plotLook';
import { paintRaster, type Raster, type Rect } from './raster';
import type { CellRun, SurfaceGeometry } from './surfaceCells';

export interface HeatmapLayerSpec {
  readonly raster: Raster;
  readonly geometry: SurfaceGeometry;
  readonly unvisited: readonly CellRun[];
  readonly look: PlotLook;
}

/** Pixel rectangle of the value box [x0, x1] × [y0, y1] on the chart's x and y scales. */
function pixelRect(chart: Chart, x0: number, x1: number, y0: number, y1: number): Rect {
  const xs = chart.scales.x, ys = chart.scales.y;
  const left = xs.getPixelForValue(x0), right = xs.getPixelForValue(x1);
  const top = ys.getPixelForValue(y1), bottom = ys.getPixelForValue(y0);
  return { x: left, y: top, width: right - left, height: bottom - top };
}

export function unvisitedRects(chart: Chart, geometry: SurfaceGeometry, runs: readonly CellRun[]): Rect[] {
  const [x0] = geometry.xExtent, [y0] = geometry.yExtent, { dx, dy } = geometry;
  return runs.map((run) => pixelRect(chart, x0 + run.ixStart * dx, x0 + (run.ixEnd + 1) * dx, y0 + run.iy * dy, y0 + (run.iy + 1) * dy));
}

export function heatmapLayerPlugin(spec: HeatmapLayerSpec): Plugin {
  return {
    id: 'setpointHeatmapLayer',
    beforeDatasetsDraw(chart) {
      const { geometry } = spec, area = chart.chartArea, ctx = chart.ctx;
      ctx.save();
      ctx.beginPath();
      ctx.rect(area.left, area.top, area.right - area.left, area.bottom - area.top);
      ctx.clip();
      paintRaster(ctx, spec.raster, pixelRect(chart, geometry.xExtent[0], geometry.xExtent[1], geometry.yExtent[0], geometry.yExtent[1]), false);
      drawHatching(ctx, unvisitedRects(chart, geometry, spec.unvisited), spec.look);
      ctx.restore();
    },
  };
}
