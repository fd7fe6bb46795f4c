/**
 * A short label drawn over a plot on a backing of the plot's background, so a line passing under it
 * cannot hide it (the action slice's limit labels, the trend's band names).
 */
import type { PlotLook } from './plotLook';

export const BACKED_TEXT_DEFAULTS = { paddingPx: 3, backingAlpha: 0.85 } as const;

/** A text's box in canvas pixels: its top-left corner and its size. */
export interface LabelBox { left: number; top: number; width: number; height: number }

/** Text on a backing of the plot's background, top-left at (left, top); the caller sets the font. */
export function drawBackedText(ctx: CanvasRenderingContext2D, text: string, box: LabelBox, colour: string, look: PlotLook): void {
  const pad = BACKED_TEXT_DEFAULTS.paddingPx * look.scale;
  ctx.save();
  ctx.fillStyle = look.palette.background;
  ctx.globalAlpha = BACKED_TEXT_DEFAULTS.backingAlpha;
  ctx.fillRect(box.left - pad, box.top - pad / 2, box.width + 2 * pad, box.height + pad);
  ctx.globalAlpha = 1;
  ctx.fillStyle = colour;
  ctx.textAlign = 'left';
  ctx.textBaseline = 'top';
  ctx.fillText(text, box.left, box.top);
  ctx.restore();
}

