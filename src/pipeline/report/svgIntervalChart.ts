/**
 * Estimates with their intervals as an SVG interval chart (a "forest plot", common practice for
 * comparing estimates): one row per estimate, a dot at the value and a bar over the interval,
 * and optionally a vertical reference line (e.g. the logged behaviour's value).
 */
import { escapeHtml, formatNumber } from './htmlText';
import { bottomAxis, extent, linearScale } from './svgAxes';
import { seriesColour } from './svgPalette';

export interface IntervalRow {
  label: string;
  value: number;
  interval: readonly [number, number] | null;
  /** Colour group (index into the palette). */
  group: number;
}

const ROW = 26, LEFT_LABEL = 250, TOP = 10;

export function svgIntervalChart(rows: IntervalRow[], axisLabel: string, reference?: { value: number; label: string }, width = 640): string {
  const right = width - 70, bottom = TOP + rows.length * ROW + 6;
  const values = rows.flatMap((r) => [r.value, ...(r.interval ?? [])]).concat(reference ? [reference.value] : []);
  const [lo, hi] = extent(values), pad = (hi - lo) * 0.08 || 1;
  const xs = linearScale(lo - pad, hi + pad, LEFT_LABEL, right);
  const marks = rows.map((r, i) => {
    const y = TOP + i * ROW + ROW / 2, colour = seriesColour(r.group);
    const bar = r.interval
      ? `<line x1="${xs(r.interval[0]).toFixed(1)}" x2="${xs(r.interval[1]).toFixed(1)}" y1="${y}" y2="${y}" stroke="${colour}" stroke-width="3"/>` +
        [0, 1].map((e) => `<line x1="${xs(r.interval![e]).toFixed(1)}" x2="${xs(r.interval![e]).toFixed(1)}" y1="${y - 6}" y2="${y + 6}" stroke="${colour}" stroke-width="2"/>`).join('')
      : '';
    return `<text x="${LEFT_LABEL - 10}" y="${y}" dy="0.32em" text-anchor="end">${escapeHtml(r.label)}</text>${bar}` +
      `<circle cx="${xs(r.value).toFixed(1)}" cy="${y}" r="4.5" fill="#fff" stroke="${colour}" stroke-width="2"/>` +
      `<text x="${right + 6}" y="${y}" dy="0.32em" class="value">${escapeHtml(formatNumber(r.value, 4))}</text>`;
  });
  const ref = reference
    ? `<line x1="${xs(reference.value).toFixed(1)}" x2="${xs(reference.value).toFixed(1)}" y1="${TOP}" y2="${bottom}" stroke="#555" stroke-dasharray="4 3"><title>${escapeHtml(reference.label)}</title></line>`
    : '';
  const height = bottom + 40;
  return `<svg xmlns="http://www.w3.org/2000/svg" viewBox="0 0 ${width} ${height}" width="${width}" height="${height}" role="img" aria-label="${escapeHtml(axisLabel)}">` +
    ref + marks.join('') + bottomAxis(xs, bottom, axisLabel) + '</svg>';
}
