/**
 * The retune map's cells as a canvas layer inside a Chart.js chart: before the datasets draw, each
 * cell is filled at its column and row index on the chart's linear axes (cell k spans k ± ½), the
 * cells the logs do not support are greyed and strongly hatched, the cells where they thin out are
 * lightly hatched, and the best supported cell is outlined twice (dark under light, so the outline
 * reads on both ends of the colour scale). Clipped to the plot area.
 */
import type { Chart, Plugin } from 'chart.js';
import type { ColourScale, Rgb } from './colourScale';
import { parseColour, rgbText } from './colourScale';
import { drawHatching, HATCH_DEFAULTS, LIGHT_HATCH } from './hatching';
import type { MapCell, MapCellLayout } from './mapCells';
import type { PlotLook } from './plotLook';
import type { Rect } from './raster';

/** Share of grey mixed into an unsupported cell's colour (ours: the hue stays faintly readable). */
export const GREY_OUT = 0.7;
export const OUTLINE_DEFAULTS = { darkWidthPx: 5, lightWidthPx: 2.5 } as const;

export interface MapCellLayerSpec {
  readonly layout: MapCellLayout;
  readonly scale: ColourScale;
  readonly look: PlotLook;
}

export function mix(a: Rgb, b: Rgb, t: number): Rgb {
  return [0, 1, 2].map((k) => Math.round(a[k] * (1 - t) + b[k] * t)) as unknown as Rgb;
}

/** The fill of a cell: its colour on the scale, greyed when unsupported; the palette's "no value" colour without a value. */
export function cellFill(cell: MapCell, scale: ColourScale, look: PlotLook): string {
  const colour = cell.value === null ? null : scale.colour(cell.value);
  if (colour === null || cell.shade === 'noValue') return look.palette.noValue;
  return rgbText(cell.shade === 'unsupported' ? mix(colour, parseColour(look.palette.noValue), GREY_OUT) : colour);
}

export function cellRect(chart: Chart, cell: Pick<MapCell, 'column' | 'row'>): Rect {
  const xs = chart.scales.x, ys = chart.scales.y;
  // Whole pixels, so neighbouring cells meet without a hairline seam.
  const left = Math.floor(xs.getPixelForValue(cell.column - 0.5)), right = Math.ceil(xs.getPixelForValue(cell.column + 0.5));
  const top = Math.floor(ys.getPixelForValue(cell.row + 0.5)), bottom = Math.ceil(ys.getPixelForValue(cell.row - 0.5));
  return { x: left, y: top, width: right - left, height: bottom - top };
}

/** The double outline of the best cell (also drawn on its legend key). */
export function drawOutline(ctx: CanvasRenderingContext2D, rect: Rect, look: PlotLook): void {
  const s = look.scale, inset = (OUTLINE_DEFAULTS.darkWidthPx * s) / 2;
  ctx.save();
  for (const [colour, width] of [['#000000', OUTLINE_DEFAULTS.darkWidthPx], ['#ffffff', OUTLINE_DEFAULTS.lightWidthPx]] as const) {
    ctx.strokeStyle = colour;
    ctx.lineWidth = width * s;
    ctx.strokeRect(rect.x + inset, rect.y + inset, rect.width - 2 * inset, rect.height - 2 * inset);
  }
  ctx.restore();
}

export function mapCellLayerPlugin(spec: MapCellLayerSpec): Plugin {
  return {
    id: 'setpointMapCells',
    beforeDatasetsDraw(chart) {
      const { layout, scale, look } = spec, area = chart.chartArea, ctx = chart.ctx;
      ctx.save();
      ctx.beginPath();
      ctx.rect(area.left, area.top, area.right - area.left, area.bottom - area.top);
      ctx.clip();
      const rects = layout.cells.map((cell) => cellRect(chart, cell));
      layout.cells.forEach((cell, i) => {
        ctx.fillStyle = cellFill(cell, scale, look);
        ctx.fillRect(rects[i].x, rects[i].y, rects[i].width, rects[i].height);
      });
      const of = (shade: MapCell['shade']) => rects.filter((_, i) => layout.cells[i].shade === shade);
      drawHatching(ctx, of('unsupported'), look, HATCH_DEFAULTS);
      drawHatching(ctx, of('caution'), look, LIGHT_HATCH);
      if (layout.best !== null) drawOutline(ctx, rects[layout.best], look);
      ctx.restore();
    },
  };
}
