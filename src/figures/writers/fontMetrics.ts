/**
 * Advance widths of the Helvetica family, the metrics Arial and Liberation Sans share by design,
 * in thousandths of an em for the printable ASCII characters 32–126 (Adobe's Core 14 font metric
 * files for Helvetica and Helvetica-Bold; values written from memory, then checked against the
 * browser's own measurement of Liberation Sans in test/e2e/figureText.test.ts). Where no canvas
 * can measure (the report written by the command line), figures lay out text with these and name
 * that family first in the SVG, so the text drawn has the width that was laid out.
 */
import type { TextMeasure } from './svgContext';
import { parseFont } from './svgMarkup';

/** The font family exports and the report name: metric-compatible faces first (common practice). */
export const METRIC_FONT_FAMILY = "Arial, 'Liberation Sans', Helvetica, sans-serif";

// Characters 32–126 in order.
const REGULAR = [
  278, 278, 355, 556, 556, 889, 667, 191, 333, 333, 389, 584, 278, 333, 278, 278, 556, 556, 556, 556, 556, 556, 556, 556, 556, 556,
  278, 278, 584, 584, 584, 556, 1015, 667, 667, 722, 722, 667, 611, 778, 722, 278, 500, 667, 556, 833, 722, 778, 667, 778, 722, 667,
  611, 722, 667, 944, 667, 667, 611, 278, 278, 278, 469, 556, 333, 556, 556, 500, 556, 556, 278, 556, 556, 222, 222, 500, 222, 833,
  556, 556, 556, 556, 333, 500, 278, 556, 500, 722, 500, 500, 500, 334, 260, 334, 584,
];
const BOLD = [
  278, 333, 474, 556, 556, 889, 722, 238, 333, 333, 389, 584, 278, 333, 278, 278, 556, 556, 556, 556, 556, 556, 556, 556, 556, 556,
  333, 333, 584, 584, 584, 611, 975, 722, 722, 722, 722, 667, 611, 778, 722, 278, 556, 722, 611, 833, 722, 778, 667, 778, 722, 667,
  611, 722, 667, 944, 667, 667, 611, 333, 278, 333, 584, 556, 333, 556, 611, 556, 611, 556, 333, 611, 611, 278, 278, 556, 278, 889,
  611, 611, 611, 611, 389, 556, 333, 611, 556, 778, 556, 556, 500, 389, 280, 389, 584,
];
/** A few non-ASCII characters the figures use (minus, ±, ×, ·, °, superscript digits, Greek). */
const EXTRA: Record<string, number> = {
  '−': 584, '±': 584, '×': 584, '·': 278, '°': 400, '²': 333, '³': 333, '⁻': 333, '⁰': 333, '¹': 333,
  '⁴': 333, '⁵': 333, '⁶': 333, '⁷': 333, '⁸': 333, '⁹': 333, 'π': 600, 'γ': 520, 'μ': 576, 'σ': 600, '≤': 584, '≥': 584, '–': 556, '—': 1000, '…': 1000,
};
/** Anything else: a wide guess, so text is laid out with room to spare. */
const OTHER = 650;

export function advanceEm(ch: string, bold: boolean): number {
  const code = ch.codePointAt(0) ?? 0;
  if (code >= 32 && code <= 126) return (bold ? BOLD : REGULAR)[code - 32] / 1000;
  return (EXTRA[ch] ?? OTHER) / 1000;
}

/** Width of text in px from the Helvetica metrics, at the font's size and weight. */
export const metricTextMeasure: TextMeasure = (font, text) => {
  const { sizePx, weight } = parseFont(font);
  const bold = weight === 'bold' || Number(weight) >= 600;
  let em = 0;
  for (const ch of text) em += advanceEm(ch, bold);
  return em * sizePx;
};
