/**
 * The colour bar's tick count comes from the height it is drawn at. Chart.js sizes a side layout box
 * before the boxes above and below it (title, subtitle, legend, the x axis) take their height
 * (chart.js core.layouts fitBoxes: side boxes are updated first, with the chart area's height at
 * that moment), so the height offered to the box's update() is taller than the bar it draws; ticks
 * chosen there ran about one per 40 px of a bar that was not drawn (colourBar.ts: about one tick per
 * tickSpacingPx of bar height, between 2 and 11 — ours). Drawn in Node on our SVG context with the
 * writers' estimated text measure, at the app's export sizes; the surface is invented drawing data.
 */
import type { Chart } from 'chart.js';
import { describe, expect, it } from 'vitest';
import { colourBarTicks } from '../../src/figures/parts/colourBar';
import { createColourScale } from '../../src/figures/parts/colourScale';
import { screenLook } from '../../src/figures/parts/plotLook';
import { drawChartOnce } from '../../src/figures/writers/drawChart';
import { SvgContext } from '../../src/figures/writers/svgContext';
import { withRecordingPath2D } from '../../src/figures/writers/svgPath2D';
import { estimatedTextMeasure } from '../../src/figures/writers/textMeasure';
import { syntheticSpec } from './syntheticSpecs';
import type { TickSet } from '../../src/figures/parts/niceTicks';

interface DrawnBar { top: number; bottom: number; drawnTicks: TickSet | null }

function drawnBar(widthPx: number, heightPx: number): DrawnBar {
  const ctx = new SvgContext(widthPx, heightPx, estimatedTextMeasure), look = screenLook('light');
  let bar: DrawnBar | undefined;
  withRecordingPath2D(() => {
    const chart: Chart = drawChartOnce(ctx.canvas, syntheticSpec('surface', 'light'), look);
    bar = (chart as unknown as { boxes: object[] }).boxes.find((b) => 'drawnTicks' in b) as DrawnBar;
    bar = { top: bar.top, bottom: bar.bottom, drawnTicks: bar.drawnTicks };
    chart.destroy();
  });
  return bar!;
}

describe('the colour bar’s ticks', () => {
  it.each([[640, 300], [800, 480], [960, 640], [1950, 1200]])('at %i × %i px: as many as the drawn bar’s height asks for', (width, height) => {
    const bar = drawnBar(width, height), look = screenLook('light');
    const drawnHeight = bar.bottom - bar.top;
    expect(drawnHeight).toBeLessThan(height);
    expect(bar.drawnTicks).not.toBeNull();
    // The same ticks colourBarTicks gives for the drawn height: nice ticks (Heckbert 1990) for the bar's target count.
    const scale = createColourScale((syntheticSpec('surface', 'light').props as { surface: { values: Float64Array } }).surface.values);
    expect(bar.drawnTicks!.values).toEqual(colourBarTicks(scale, drawnHeight, look).values);
  });
});
