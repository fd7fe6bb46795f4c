/**
 * Text widths for the SVG exporter and caption wrapping. In the app the browser's own canvas
 * measures (so the SVG's layout matches what the same fonts render); where no canvas exists (the
 * command line, unit tests in Node) the Helvetica metrics of fontMetrics.ts stand in. The plain
 * estimate of 0.55 em per character (0.6 em bold; common practice for a sans-serif average) stays
 * for layout tests that want round numbers.
 */
import type { TextMeasure } from './svgContext';
import { metricTextMeasure } from './fontMetrics';
import { parseFont } from './svgMarkup';

export const estimatedTextMeasure: TextMeasure = (font, text) => {
  const { sizePx, weight } = parseFont(font);
  return text.length * sizePx * (weight === 'bold' || Number(weight) >= 600 ? 0.6 : 0.55);
};

export function canvasTextMeasure(): TextMeasure | null {
  const ctx = typeof OffscreenCanvas !== 'undefined' ? new OffscreenCanvas(1, 1).getContext('2d') : null;
  if (!ctx) return null;
  return (font, text) => {
    ctx.font = font;
    return ctx.measureText(text).width;
  };
}

export function defaultTextMeasure(): TextMeasure {
  return canvasTextMeasure() ?? metricTextMeasure;
}
