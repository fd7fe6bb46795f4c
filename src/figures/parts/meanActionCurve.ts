/**
 * A candidate's mean applied action along one state axis, the other states held: for an affine
 * policy μ(s) = offset + gain·s with dither σ, the mean of N(μ(s), σ²) after its actuator limits
 * (src/core/boundedNormalMean.ts: clipped or truncated, as the policy meets them). Without limits
 * it is μ(s) itself, a straight line; with them it bends toward each limit and never passes it
 * (a line running to 150 % of a 0–100 % valve is not what the policy does).
 */
import { boundedNormalMean, type LimitMode } from '../../core/boundedNormalMean';

/** The shape of a candidate these curves need (the project's candidate has it). */
export interface AffineCandidate {
  readonly offset: readonly number[]; // m
  readonly gain: readonly (readonly number[])[]; // m×ds
  readonly std: readonly number[]; // m
  readonly bounds?: { readonly lo: readonly (number | null)[]; readonly hi: readonly (number | null)[]; readonly mode: LimitMode };
}

export interface Curve {
  x: Float64Array;
  y: Float64Array;
}

/** Points per curve: enough for the bend near a limit to look smooth at any plot width (a choice). */
export const CURVE_POINTS = 121;

/** The limits on one action, ±Infinity where open; null when the candidate has none. */
export function actionLimits(candidate: AffineCandidate, action: number): { lo: number; hi: number; mode: LimitMode } | null {
  const b = candidate.bounds;
  if (!b) return null;
  const lo = b.lo[action] ?? null, hi = b.hi[action] ?? null;
  if (lo === null && hi === null) return null;
  return { lo: lo ?? -Infinity, hi: hi ?? Infinity, mode: b.mode };
}

/** The mean applied action over range on state `axis`, others at held; null when the shapes do not fit. */
export function meanActionCurve(candidate: AffineCandidate, axis: number, action: number, range: readonly [number, number], held: readonly number[], points = CURVE_POINTS): Curve | null {
  const row = candidate.gain[action], offset = candidate.offset[action], std = candidate.std[action];
  if (row === undefined || offset === undefined || std === undefined || row.length !== held.length) return null;
  return meanCurve((s) => row.reduce((sum, g, j) => sum + g * (j === axis ? s : held[j]), offset), std, actionLimits(candidate, action), range, points);
}

/**
 * The same for any mean along the axis (a PI loop or a schedule compiled to the engine's policy):
 * meanAt(s) is μ at axis value s with the other states held.
 */
export function meanCurve(
  meanAt: (s: number) => number, std: number, limits: { lo: number; hi: number; mode: LimitMode } | null, range: readonly [number, number], points = CURVE_POINTS,
): Curve | null {
  if (!(range[1] >= range[0]) || !(std >= 0)) return null;
  const x = new Float64Array(points), y = new Float64Array(points);
  for (let k = 0; k < points; k++) {
    const s = range[0] + ((range[1] - range[0]) * k) / (points - 1);
    const mean = meanAt(s);
    x[k] = s;
    y[k] = limits ? boundedNormalMean(mean, std, limits.lo, limits.hi, limits.mode) : mean;
  }
  return { x, y };
}
