/**
 * Checks the export options and works out the look and layout shared by PNG and SVG: the scale
 * (dpi/96, so type keeps its printed size), the palette (a white background always gets the light
 * palette, so text never comes out white on white; a transparent one keeps the plot's theme), and
 * the caption block under the plot.
 *
 * A small picture at a high dpi (3.25 × 2.5 in at 300 dpi) would leave the plot only 312 × 180 px
 * of room at full-size type: titles, tick labels and legends would collide. So the scale is capped
 * where the plot would have less than MIN_LAYOUT of room in type-size units (the smallest layout
 * our figures are checked at without overlaps, test/e2e/plots.test.ts); the type then prints
 * smaller than on screen, and the plan says by how much (typeScale < 1).
 */
import { plotPalette } from '../parts/plotTheme';
import type { PlotLook } from '../parts/plotLook';
import { METRIC_FONT_FAMILY } from './fontMetrics';
import { layoutCaption, type CaptionBlock } from './captionLayout';
import { withCaution } from './exportCaption';
import type { ExportOptions, PlotSpec } from './plotSpec';
import type { TextMeasure } from './svgContext';

export class ExportOptionsError extends Error {
  constructor(message: string) {
    super(message);
    this.name = 'ExportOptionsError';
  }
}

/** Limits: Chromium canvases stop at 32 767 px a side; 16 384 keeps memory sane (a choice). */
export const EXPORT_LIMITS = { minSidePx: 64, maxSidePx: 16384, minDpi: 36, maxDpi: 2400, minPlotHeightPx: 120 } as const;

/** The room a plot needs, in CSS px of type at scale 1, for its text not to collide (a choice, checked by test). */
export const MIN_LAYOUT = { widthPx: 540, heightPx: 300 } as const;

export interface ExportPlan {
  readonly look: PlotLook;
  readonly widthPx: number;
  readonly heightPx: number;
  readonly plotHeightPx: number;
  readonly caption: CaptionBlock;
  /** Printed type size relative to the screen's at this dpi: 1, or less where the picture is too small for full-size type. */
  readonly typeScale: number;
}

/** The largest scale up to dpi/96 at which the plot keeps MIN_LAYOUT of room under its caption. */
function fittingScale(spec: PlotSpec, options: ExportOptions, measure: TextMeasure): { look: PlotLook; caption: CaptionBlock } {
  const { widthPx, heightPx, dpi, background } = options;
  const palette = plotPalette(background === 'white' ? 'light' : spec.props.theme);
  const lookAt = (scale: number): PlotLook => ({ palette, scale, interactive: false, fontFamily: METRIC_FONT_FAMILY });
  let scale = Math.min(dpi / 96, widthPx / MIN_LAYOUT.widthPx);
  let caption = layoutCaption(withCaution(options.caption ?? '', options.caution), widthPx, lookAt(scale), measure);
  // The caption grows with the scale (and wraps into more lines as it shrinks): a few rounds settle it.
  for (let round = 0; round < 4 && (heightPx - caption.heightPx) / scale < MIN_LAYOUT.heightPx; round++) {
    const lineUnits = caption.heightPx / scale;
    scale = Math.max(dpi / 96 / 8, Math.min(scale, heightPx / (MIN_LAYOUT.heightPx + lineUnits)));
    caption = layoutCaption(withCaution(options.caption ?? '', options.caution), widthPx, lookAt(scale), measure);
  }
  return { look: lookAt(scale), caption };
}

export function exportPlan(spec: PlotSpec, options: ExportOptions, measure: TextMeasure): ExportPlan {
  const { widthPx, heightPx, dpi, background } = options, l = EXPORT_LIMITS;
  for (const [name, v] of [['widthPx', widthPx], ['heightPx', heightPx]] as const) {
    if (!Number.isInteger(v) || v < l.minSidePx || v > l.maxSidePx) {
      throw new ExportOptionsError(`${name}: expected a whole number of pixels from ${l.minSidePx} to ${l.maxSidePx}, got ${v}`);
    }
  }
  if (!Number.isFinite(dpi) || dpi < l.minDpi || dpi > l.maxDpi) throw new ExportOptionsError(`dpi: expected ${l.minDpi} to ${l.maxDpi}, got ${dpi}`);
  if (background !== 'white' && background !== 'transparent') throw new ExportOptionsError(`background: expected "white" or "transparent", got "${String(background)}"`);
  const { look, caption } = fittingScale(spec, options, measure), scale = look.scale;
  const plotHeightPx = Math.floor(heightPx - caption.heightPx);
  const needed = Math.ceil(caption.heightPx + l.minPlotHeightPx * scale);
  if (plotHeightPx < l.minPlotHeightPx * scale) {
    throw new ExportOptionsError(`heightPx: ${heightPx} px leaves too little room for the plot above its ${caption.lines.length}-line caption at ${dpi} dpi; use at least ${needed} px`);
  }
  return { look, widthPx, heightPx, plotHeightPx, caption, typeScale: scale / (dpi / 96) };
}
