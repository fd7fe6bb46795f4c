/**
 * Diagonal hatching over a set of rectangles (the never-visited cells, and the legend swatch).
 * Lines run at 45° with a fixed perpendicular spacing, anchored to the canvas origin so that
 * neighbouring cells' lines join up. Each line is drawn twice — a wide dark stroke under a narrow
 * light one — so it reads on both ends of the colour scale.
 */
import type { PlotLook } from './plotLook';
import type { Rect } from './raster';

/** Defaults in CSS px, times look.scale. */
export const HATCH_DEFAULTS = { spacingPx: 7, darkWidthPx: 2.2, lightWidthPx: 1 } as const;

export interface HatchStyle {
  readonly spacingPx: number;
  readonly darkWidthPx: number;
  readonly lightWidthPx: number;
}

/**
 * A sparser hatch for a milder warning (the retune map's "caution" cells); ours. Its dark edge on
 * each side of the light line, (dark − light) / 2 = 0.6 px, is the strong hatch's, so it reads on
 * both ends of the colour scale and in both themes; it differs by its wider spacing and finer light line.
 */
export const LIGHT_HATCH: HatchStyle = { spacingPx: 9.5, darkWidthPx: 2, lightWidthPx: 0.8 };

/** Fewest hatch lines across a legend swatch, so a small key still shows the pattern it stands for; ours. */
export const MIN_SWATCH_LINES = 3;

/**
 * The hatch of a legend swatch of w × h CSS px: the cells' own style, its spacing narrowed only where
 * fewer than MIN_SWATCH_LINES lines would cross the swatch (lines x + y = c cross it for c in a
 * range of length w + h, one every spacing·√2).
 */
export function swatchHatch(style: HatchStyle, widthPx: number, heightPx: number): HatchStyle {
  const fits = (widthPx + heightPx) / (style.spacingPx * Math.SQRT2);
  if (fits >= MIN_SWATCH_LINES) return style;
  return { ...style, spacingPx: (widthPx + heightPx) / (MIN_SWATCH_LINES * Math.SQRT2) };
}

export function drawHatching(ctx: CanvasRenderingContext2D, rects: readonly Rect[], look: PlotLook, style: HatchStyle = HATCH_DEFAULTS): void {
  if (rects.length === 0) return;
  const bounds = boundingBox(rects);
  ctx.save();
  ctx.beginPath();
  for (const r of rects) ctx.rect(r.x, r.y, r.width, r.height);
  ctx.clip();
  ctx.beginPath();
  // Lines x + y = c, c on a lattice of spacing·√2 so the perpendicular gap is `spacing`.
  const step = style.spacingPx * look.scale * Math.SQRT2;
  const c0 = Math.floor((bounds.x + bounds.y) / step) * step;
  const c1 = bounds.x + bounds.width + bounds.y + bounds.height;
  for (let c = c0; c <= c1 + step; c += step) {
    ctx.moveTo(bounds.x - 1, c - bounds.x + 1);
    ctx.lineTo(c - bounds.y + 1, bounds.y - 1);
  }
  ctx.lineCap = 'butt';
  ctx.strokeStyle = look.palette.hatchDark;
  ctx.lineWidth = style.darkWidthPx * look.scale;
  ctx.stroke();
  ctx.strokeStyle = look.palette.hatchLight;
  ctx.lineWidth = style.lightWidthPx * look.scale;
  ctx.stroke();
  ctx.restore();
}

function boundingBox(rects: readonly Rect[]): Rect {
  let x0 = Infinity, y0 = Infinity, x1 = -Infinity, y1 = -Infinity;
  for (const r of rects) {
    x0 = Math.min(x0, r.x);
    y0 = Math.min(y0, r.y);
    x1 = Math.max(x1, r.x + r.width);
    y1 = Math.max(y1, r.y + r.height);
  }
  return { x: x0, y: y0, width: x1 - x0, height: y1 - y0 };
}
