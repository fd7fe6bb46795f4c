/**
 * Text widths for the SVG exporter and caption wrapping. In the app the browser's own canvas
 * measures (so the SVG's layout matches what the same fonts render); where no canvas exists (unit
 * tests in Node) an estimate of 0.55 em per character (0.6 em bold) stands in — common practice for
 * a proportional sans-serif average, good enough for layout tests.
 */
import type { TextMeasure } from './svgContext';
import { parseFont } from './svgMarkup';

export const estimatedTextMeasure: TextMeasure = (font, text) => {
  const { sizePx, weight } = parseFont(font);
  return text.length * sizePx * (weight === 'bold' || Number(weight) >= 600 ? 0.6 : 0.55);
};

export function canvasTextMeasure(): TextMeasure | null {
  const ctx = typeof OffscreenCanvas !== 'undefined'
    ? new OffscreenCanvas(1, 1).getContext('2d')
    : typeof document !== 'undefined' ? document.createElement('canvas').getContext('2d') : null;
  if (!ctx) return null;
  return (font, text) => {
    ctx.font = font;
    return ctx.measureText(text).width;
  };
}

export function defaultTextMeasure(): TextMeasure {
  return canvasTextMeasure() ?? estimatedTextMeasure;
}
