/**
 * Axes for the report's SVG figures: linear scales, "nice" tick values (1, 2 or 5 × 10^k steps;
 * Heckbert, "Nice numbers for graph labels", Graphics Gems, 1990) and the axis marks as SVG text.
 */
import { escapeHtml, formatNumber } from './htmlText';

export interface LinearScale {
  (value: number): number;
  readonly domain: readonly [number, number];
}

/** Map [d0, d1] onto [r0, r1]; a zero-width domain is widened so the scale stays finite. */
export function linearScale(d0: number, d1: number, r0: number, r1: number): LinearScale {
  let lo = d0, hi = d1;
  if (!(hi > lo)) {
    const half = lo === 0 ? 0.5 : Math.abs(lo) * 0.05;
    lo -= half;
    hi += half;
  }
  const scale = ((v: number) => r0 + ((v - lo) / (hi - lo)) * (r1 - r0)) as LinearScale;
  Object.defineProperty(scale, 'domain', { value: [lo, hi] as const });
  return scale;
}

/** About `count` ticks covering [lo, hi] at a 1-2-5 step. */
export function niceTicks(lo: number, hi: number, count = 5): number[] {
  if (!(hi > lo)) return [lo];
  const rough = (hi - lo) / Math.max(1, count);
  const power = 10 ** Math.floor(Math.log10(rough));
  const step = [1, 2, 5, 10].map((f) => f * power).find((s) => s >= rough) ?? 10 * power;
  const ticks: number[] = [];
  for (let v = Math.ceil(lo / step) * step; v <= hi + step * 1e-9; v += step) ticks.push(Math.abs(v) < step * 1e-9 ? 0 : v);
  return ticks;
}

/** Extent of the finite values, or [0, 1] when there are none. */
export function extent(values: Iterable<number | null>): [number, number] {
  let lo = Infinity, hi = -Infinity;
  for (const v of values) {
    if (v === null || !Number.isFinite(v)) continue;
    lo = Math.min(lo, v);
    hi = Math.max(hi, v);
  }
  return lo === Infinity ? [0, 1] : [lo, hi];
}

/** Horizontal axis at y = baseline, with ticks and a label under it. */
export function bottomAxis(scale: LinearScale, baseline: number, label: string, integers = false): string {
  const [lo, hi] = scale.domain, [x0, x1] = [scale(lo), scale(hi)];
  const values = niceTicks(lo, hi, 5);
  const ticks = (integers ? values.filter(Number.isInteger) : values).map((t) => {
    const x = scale(t).toFixed(1);
    return `<line x1="${x}" x2="${x}" y1="${baseline}" y2="${baseline + 4}" class="tick"/><text x="${x}" y="${baseline + 15}" text-anchor="middle">${escapeHtml(formatNumber(t, 4))}</text>`;
  });
  return `<g class="axis"><line x1="${x0.toFixed(1)}" x2="${x1.toFixed(1)}" y1="${baseline}" y2="${baseline}"/>${ticks.join('')}` +
    `<text x="${((x0 + x1) / 2).toFixed(1)}" y="${baseline + 32}" text-anchor="middle" class="axis-label">${escapeHtml(label)}</text></g>`;
}

/** Vertical axis at x = left, with ticks and a rotated label beside it. */
export function leftAxis(scale: LinearScale, left: number, label: string): string {
  const [lo, hi] = scale.domain, [y0, y1] = [scale(lo), scale(hi)];
  const ticks = niceTicks(lo, hi, 5).map((t) => {
    const y = scale(t).toFixed(1);
    return `<line x1="${left - 4}" x2="${left}" y1="${y}" y2="${y}" class="tick"/><text x="${left - 7}" y="${y}" dy="0.32em" text-anchor="end">${escapeHtml(formatNumber(t, 4))}</text>`;
  });
  const middle = ((y0 + y1) / 2).toFixed(1);
  return `<g class="axis"><line x1="${left}" x2="${left}" y1="${y0.toFixed(1)}" y2="${y1.toFixed(1)}"/>${ticks.join('')}` +
    `<text transform="translate(${left - 48} ${middle}) rotate(-90)" text-anchor="middle" class="axis-label">${escapeHtml(label)}</text></g>`;
}
