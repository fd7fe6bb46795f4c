import { layouts, type Chart, type LayoutItem, type Plugin } from 'chart.js';

/**
 * The geometry every Chart.js layout box carries: Chart.js's layout engine reads and writes these
 * fields. Our boxes (colour bar, unvisited-region legend, room for value labels) extend this and
 * add their position, weight, sizing and drawing.
 */
export abstract class LayoutBoxGeometry {
  readonly fullSize: boolean = false;
  /** Chart.js reads stack options from every layout box. */
  readonly options = {};
  width = 0;
  height = 0;
  left = 0;
  top = 0;
  right = 0;
  bottom = 0;
}

/**
 * The start/stop hooks of a per-chart plugin that adds one layout box while the chart lives and
 * removes it when the chart stops; spread them into the plugin object.
 */
export function layoutBoxHooks(create: (chart: Chart) => LayoutItem): Pick<Plugin, 'start' | 'stop'> {
  let box: LayoutItem | null = null;
  return {
    start(chart) {
      box = create(chart);
      layouts.addBox(chart, box);
    },
    stop(chart) {
      if (box) layouts.removeBox(chart, box);
      box = null;
    },
  };
}
