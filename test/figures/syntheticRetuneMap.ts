/**
 * Invented retune maps for the figure tests, the export tests and the e2e plot page (not data,
 * not any plant's result): J of a made-up PI loop as a bowl over proportional gain × integral time,
 * with support falling off towards short integral times and high gains, and one point without a
 * solution. Every number here is made up to exercise the drawing.
 */
import type { MapSupport, RetuneMapData } from '../../src/figures/charts/figureData';

export const GAINS = [10, 20, 30, 40, 50, 60];
/** Geometric: 300 · 2^k s. */
export const TIMES = [300, 600, 1200, 2400, 4800];

/** Support by an invented "distance" from the logged tuning at gain 30, 2400 s. */
function supportAt(g: number, t: number): MapSupport {
  const far = Math.abs(g - 30) / 10 + Math.abs(Math.log2(t / 2400));
  if (far <= 1.5) return null;
  if (far <= 2.5) return 'caution';
  return far > 4.5 ? 'unknown' : 'serious';
}

/** 6 gains × 5 times, row-major (time fastest); the best supported point is gain 40, 2400 s (J 5.2). */
interface Point { coordinates: number[]; value: number | null; interval: [number, number] | null; status: string; support: MapSupport }

export function syntheticRetuneMap(): RetuneMapData & { points: Point[] } {
  const points = GAINS.flatMap((g) => TIMES.map((t): Point => {
    const value = 5 + 0.004 * (g - 42) ** 2 + 0.6 * Math.log2(t / 2400) ** 2 + (g === 40 && t === 2400 ? 0 : 0.01);
    return { coordinates: [g, t], value, interval: [value - 0.8, value + 0.9], status: 'converged', support: supportAt(g, t) };
  }));
  points[GAINS.length * TIMES.length - 1] = { ...points[GAINS.length * TIMES.length - 1], value: null, interval: null, status: 'diverged' };
  const best = points.reduce((b, p, i) => (p.value !== null && p.support === null && (b < 0 || p.value < (points[b].value as number)) ? i : b), -1);
  return {
    axes: [{ label: 'proportional gain K_{c} (%/°C)', values: GAINS }, { label: 'integral time T_{i} (s)', values: TIMES, unit: 's' }],
    points, best: { index: best, value: points[best].value as number }, presentController: 6.1,
  };
}

/** The same loop along the integral time alone at gain 40: a one-axis map. */
export function syntheticRetuneLine(): RetuneMapData {
  const map = syntheticRetuneMap(), column = GAINS.indexOf(40);
  const points = TIMES.map((t, k) => ({ ...map.points[column * TIMES.length + k], coordinates: [t] }));
  return { axes: [map.axes[1]], points, best: { index: 3, value: points[3].value as number }, presentController: 6.1 };
}
