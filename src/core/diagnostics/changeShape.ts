/**
 * Where did a per-run series change, and was it a step or a steady drift? The run-order check
 * (runOrder.ts) says that a coefficient of the present controller's law or of the plant model moved
 * with run order; what the engineer does next depends on its shape. A step (a retune, a replaced part)
 * is fixed by evaluating the runs since it; a drift (a pump tube wearing) has no such point, and only
 * the latest runs describe the plant a retune will meet.
 *
 * Two fits to the series y_1..y_n at run positions x_1 < … < x_n:
 *   STEP — one mean shift, the split k (1 ≤ k < n) minimising the pooled within-segment sum of squares:
 *     RSS(k) = Σ y² − (Σ_{i≤k} y)²/k − (Σ_{i>k} y)²/(n − k), the classical single change-point estimate
 *     (D. V. Hinkley, "Inference about the change-point in a sequence of random variables", Biometrika
 *     57, 1970; E. S. Page's CUSUM, Biometrika 41, 1954 — from memory), O(n) by running sums;
 *   LINE — least squares of y on x.
 * It is a STEP when the step's residual sum of squares is below the line's, else a DRIFT. Why that
 * comparison (closed form, no noise, equally spaced runs): a step at fraction f of the runs leaves a line
 * R² = 3f(1 − f) ≤ 0.75, and a straight line leaves the best single step R² = 0.75 — symmetric, and
 * noise adds the same σ² per run to both. Rule and its measurement: /work/notes/change38-rule.md,
 * test/battery/README.md, "Where the log changed".
 *
 * The caller passes ranks (runOrder.ts: the ranks Spearman's ρ reads), so a few wild per-run fits move
 * a rank to an end rather than pulling either fit.
 */

import { CLEAR_STEP_SHARE } from '../limits';

export type ChangeKind = 'step' | 'drift';

export interface ChangeShape {
  readonly kind: ChangeKind;
  /** A step whose RSS is at most CLEAR_STEP_SHARE of the line's (core/limits.ts): clear enough to cut the log at. */
  readonly clear: boolean;
  /** Index into the series of the first value after the best step's split (1 ≤ after < n). */
  readonly after: number;
  readonly stepRss: number;
  readonly lineRss: number;
}

/** The best single mean shift: the first index after the split, and its residual sum of squares. */
export function bestStep(y: ArrayLike<number>): { after: number; rss: number } {
  const n = y.length;
  let total = 0, squares = 0;
  for (let i = 0; i < n; i++) { total += y[i]; squares += y[i] * y[i]; }
  let best = { after: 1, rss: Infinity }, left = 0;
  for (let k = 1; k < n; k++) {
    left += y[k - 1];
    const right = total - left, rss = Math.max(0, squares - (left * left) / k - (right * right) / (n - k));
    if (rss < best.rss) best = { after: k, rss };
  }
  return best;
}

/** Least squares of y on [1, x]: intercept, slope and residual sum of squares (slope 0 where x is constant). */
export function lineFit(x: ArrayLike<number>, y: ArrayLike<number>): { intercept: number; slope: number; rss: number } {
  const n = y.length;
  let mx = 0, my = 0;
  for (let i = 0; i < n; i++) { mx += x[i] / n; my += y[i] / n; }
  let sxx = 0, sxy = 0;
  for (let i = 0; i < n; i++) { sxx += (x[i] - mx) ** 2; sxy += (x[i] - mx) * (y[i] - my); }
  const slope = sxx > 0 ? sxy / sxx : 0, intercept = my - slope * mx;
  let rss = 0;
  for (let i = 0; i < n; i++) rss += (y[i] - intercept - slope * x[i]) ** 2;
  return { intercept, slope, rss };
}

/** The series' shape by the rule above; null with fewer than three values (no split leaves a line to compare). */
export function changeShape(positions: ArrayLike<number>, series: ArrayLike<number>): ChangeShape | null {
  if (series.length < 3 || positions.length !== series.length) return null;
  const step = bestStep(series), line = lineFit(positions, series);
  const kind: ChangeKind = step.rss < line.rss ? 'step' : 'drift';
  return { kind, clear: kind === 'step' && step.rss <= CLEAR_STEP_SHARE * line.rss, after: step.after, stepRss: step.rss, lineRss: line.rss };
}
