/**
 * A chart drawn once, off screen, onto a canvas or our SVG context: Chart.js's BasicPlatform (no
 * DOM events, no resize observer, no animation) at device pixel ratio 1, so the canvas pixel size is
 * exactly the size asked for. Chart.js draws synchronously in its constructor under these options.
 */
import { BasicPlatform, Chart, type ChartConfiguration } from 'chart.js';
import { registerChartParts } from '../parts/chartParts';
import type { PlotLook } from '../parts/plotLook';
import { plotChartConfig, type PlotSpec } from './plotSpec';

/** Anything with a 2D context and a size: an HTMLCanvasElement, or SvgContext's stand-in canvas. */
export interface ChartSurface {
  width: number;
  height: number;
  getContext(kind: '2d'): unknown;
}

/** Draws the plot and returns the chart; the caller destroys it after reading the pixels. */
export function drawChartOnce(surface: ChartSurface, spec: PlotSpec, look: PlotLook): Chart {
  return drawConfigOnce(surface, plotChartConfig(spec, look));
}

/** Draws a ready configuration the same way. */
export function drawConfigOnce(surface: ChartSurface, config: ChartConfiguration): Chart {
  registerChartParts();
  return new Chart(surface as unknown as HTMLCanvasElement, {
    ...config,
    platform: BasicPlatform,
    options: { ...config.options, responsive: false, animation: false, devicePixelRatio: 1, events: [] },
  });
}
