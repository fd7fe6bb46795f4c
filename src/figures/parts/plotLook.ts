/**
 * How a plot is drawn: the palette, and one scale factor for every size in CSS px (fonts, line
 * widths, gaps). On screen the factor is 1 and the browser's zoom does the rest (Chart.js redraws
 * at the new device pixel ratio); an exported image at d dpi uses d/96, so a 12 px label prints at
 * the same physical size as on a 96 dpi screen (CSS 2.1 §4.3.2: 1 in = 96 px).
 */
import { plotPalette, type PlotPalette, type Theme } from './plotTheme';

export interface PlotLook {
  readonly palette: PlotPalette;
  /** Multiplier applied to every default size below. */
  readonly scale: number;
  /** False for off-screen renders (exports): no tooltip, no hover, no animation. */
  readonly interactive: boolean;
  /** Font family; default PLOT_FONTS.family (exports and the report use the metric-compatible family). */
  readonly fontFamily?: string;
}

/** Default type sizes in CSS px at scale 1 (readable at 100 % and still balanced at 125 % zoom). */
export const PLOT_FONTS = {
  family: "system-ui, 'Segoe UI', Roboto, 'Helvetica Neue', Arial, sans-serif",
  titlePx: 15,
  subtitlePx: 12,
  axisTitlePx: 13,
  tickPx: 12,
  legendPx: 12,
  tooltipPx: 12,
  captionPx: 11,
} as const;

/** Default on-screen plot height in CSS px (the width follows the container). */
export const PLOT_HEIGHT_PX = 380;

export function screenLook(theme: Theme): PlotLook {
  return { palette: plotPalette(theme), scale: 1, interactive: true };
}

export function font(look: PlotLook, sizePx: number, weight: 'normal' | 'bold' = 'normal') {
  return { family: look.fontFamily ?? PLOT_FONTS.family, size: sizePx * look.scale, weight };
}

/** CSS font shorthand, for text drawn by our own plugins. */
export function fontString(look: PlotLook, sizePx: number, weight: 'normal' | 'bold' = 'normal'): string {
  return `${weight === 'bold' ? 'bold ' : ''}${sizePx * look.scale}px ${look.fontFamily ?? PLOT_FONTS.family}`;
}
