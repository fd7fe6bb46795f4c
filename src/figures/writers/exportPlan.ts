/**
 * Checks the export options and works out the look and layout shared by PNG and SVG: the scale
 * (dpi/96, so type keeps its printed size), the palette (a white background always gets the light
 * palette, so text never comes out white on white; a transparent one keeps the plot's theme), and
 * the caption block under the plot.
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

export interface ExportPlan {
  readonly look: PlotLook;
  readonly widthPx: number;
  readonly heightPx: number;
  readonly plotHeightPx: number;
  readonly caption: CaptionBlock;
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
  const scale = dpi / 96;
  const look: PlotLook = { palette: plotPalette(background === 'white' ? 'light' : spec.props.theme), scale, interactive: false, fontFamily: METRIC_FONT_FAMILY };
  const caption = layoutCaption(withCaution(options.caption ?? '', options.caution), widthPx, look, measure);
  const plotHeightPx = Math.floor(heightPx - caption.heightPx);
  const needed = Math.ceil(caption.heightPx + l.minPlotHeightPx * scale);
  if (plotHeightPx < l.minPlotHeightPx * scale) {
    throw new ExportOptionsError(`heightPx: ${heightPx} px leaves too little room for the plot above its ${caption.lines.length}-line caption at ${dpi} dpi; use at least ${needed} px`);
  }
  return { look, widthPx, heightPx, plotHeightPx, caption };
}
