/**
 * The caption block under an exported plot: words wrapped greedily to the image width (each line
 * of the caption text starts a new paragraph), and its height, so the plot gets the rest.
 */
import { fontString, PLOT_FONTS, type PlotLook } from '../parts/plotLook';
import type { TextMeasure } from './svgContext';

export const CAPTION_DEFAULTS = { marginPx: 12, paddingTopPx: 6, paddingBottomPx: 10, lineHeightEm: 1.35 } as const;

export interface CaptionBlock {
  readonly lines: string[];
  readonly font: string;
  readonly lineHeightPx: number;
  readonly heightPx: number;
  readonly marginPx: number;
  readonly paddingTopPx: number;
}

export function layoutCaption(caption: string, widthPx: number, look: PlotLook, measure: TextMeasure): CaptionBlock {
  const s = look.scale, d = CAPTION_DEFAULTS, font = fontString(look, PLOT_FONTS.captionPx);
  const room = widthPx - 2 * d.marginPx * s;
  const lines = caption.split(/\r?\n/).flatMap((paragraph) => wrap(paragraph, room, (t) => measure(font, t)));
  const lineHeightPx = PLOT_FONTS.captionPx * s * d.lineHeightEm;
  return {
    lines, font, lineHeightPx, marginPx: d.marginPx * s, paddingTopPx: d.paddingTopPx * s,
    heightPx: lines.length * lineHeightPx + (d.paddingTopPx + d.paddingBottomPx) * s,
  };
}

/** Greedy word wrap; a single word longer than the line stays whole on its own line. */
export function wrap(text: string, widthPx: number, width: (text: string) => number): string[] {
  const words = text.split(/\s+/).filter(Boolean), lines: string[] = [];
  let line = '';
  for (const word of words) {
    const candidate = line ? `${line} ${word}` : word;
    if (line && width(candidate) > widthPx) {
      lines.push(line);
      line = word;
    } else line = candidate;
  }
  if (line) lines.push(line);
  return lines;
}

/** Draw the block with its top at topPx (canvas or SVG context alike). */
export function drawCaption(ctx: CanvasRenderingContext2D, block: CaptionBlock, topPx: number, look: PlotLook): void {
  ctx.save();
  ctx.fillStyle = look.palette.text;
  ctx.font = block.font;
  ctx.textAlign = 'left';
  ctx.textBaseline = 'top';
  block.lines.forEach((line, i) => ctx.fillText(line, block.marginPx, topPx + block.paddingTopPx + i * block.lineHeightPx));
  ctx.restore();
}
