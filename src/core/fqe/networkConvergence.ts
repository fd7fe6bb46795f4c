/**
 * When the network fit may say "converged": the policy value J and Q on a fixed probe set of
 * logged (s, a) must have stopped drifting across outer iterations, by a margin that accounts for
 * how slowly value moves at this discount.
 *
 * The a-posteriori bound of a contraction (common practice; e.g. Bertsekas & Tsitsiklis,
 * "Neuro-Dynamic Programming", 1996, §2.2): if iterates x_k of a map with modulus ρ < 1 have a
 * fixed point x*, then ‖x_k − x*‖ ≤ ρ/(1 − ρ)·‖x_k − x_{k−1}‖. The Bellman operator of a fixed
 * policy contracts with ρ = γ, so a drift δ per outer iteration can still hide a remaining change
 * of γ/(1 − γ)·δ — 32·δ at γ = 0.97, 99·δ at γ = 0.99.
 *
 * The iterates of a network fit also carry minibatch noise, which the bound would amplify just as
 * much; so the drift is measured on window means, as iterates of the W-step map (modulus γ^W):
 *   J̄_k = mean(J_{k−W+1} … J_k),   δ_k = max(|J̄_k − J̄_{k−W}|, RMS_probe(Q̄_k − Q̄_{k−W})) / scale_k,
 * the change between two consecutive windows (its noise shrinks like W^{−1/2}), relative to
 * scale_k = max(|J̄_k|, RMS over the probe rows of Q̄_k − its mean), so the rule does not depend on
 * the reward's units or sign. Converged when
 *   bound_k = γ^W/(1 − γ^W)·δ_k ≤ tolerance   and   k ≥ 2W (two full windows: the minimum count);
 * γ^W/(1 − γ^W) ≈ 1/(W(1 − γ)): 6 for W = 5 at γ = 0.97, 20 at γ = 0.99.
 * With the least-squares last layer each iterate already solves the projected equation on its
 * features over the whole horizon, so the γ/(1 − γ) factor is conservative there.
 *
 * The held-out Bellman error is not used: it levels off at the noise of r + γV(s') long before J
 * stops moving, so it says "done" too early (the defect this rule replaces).
 */

export interface ConvergenceRule {
  readonly discount: number;
  /** Relative tolerance on the bound of the remaining change of J and Q. */
  readonly tolerance: number;
  /** W: iterations per window (the settings' `patience`; 0: never stop early). */
  readonly window: number;
  /** 2W: no decision before two full windows. */
  readonly minimumIterations: number;
}

export interface IterationValues {
  /** J_k over the fit's start states. */
  readonly policyValue: number;
  /** Q_k on the probe rows. */
  readonly probe: Float64Array;
}

export interface IterationChange {
  /** δ_k (relative); null before two full windows. */
  readonly relativeChange: number | null;
  /** γ^W/(1 − γ^W)·δ_k; null before two full windows. */
  readonly remainingBound: number | null;
}

export function convergenceRule(discount: number, tolerance: number, window: number): ConvergenceRule {
  return { discount, tolerance, window, minimumIterations: 2 * window };
}

/** δ_k and its bound after the newest iterate (the last entry of `iterates`). */
export function iterationChange(rule: ConvergenceRule, iterates: readonly IterationValues[]): IterationChange {
  const w = rule.window, k = iterates.length;
  if (w === 0 || k < 2 * w) return { relativeChange: null, remainingBound: null };
  const recent = windowMean(iterates.slice(k - w)), earlier = windowMean(iterates.slice(k - 2 * w, k - w));
  const n = recent.probe.length;
  let mean = 0;
  for (let i = 0; i < n; i++) mean += recent.probe[i] / n;
  let spread = 0, change = 0;
  for (let i = 0; i < n; i++) {
    spread += (recent.probe[i] - mean) ** 2 / n;
    change += (recent.probe[i] - earlier.probe[i]) ** 2 / n;
  }
  const scale = Math.max(Math.abs(recent.policyValue), Math.sqrt(spread), Number.MIN_VALUE);
  const relativeChange = Math.max(Math.abs(recent.policyValue - earlier.policyValue), Math.sqrt(change)) / scale;
  const modulus = rule.discount ** w;
  return { relativeChange, remainingBound: (modulus / (1 - modulus)) * relativeChange };
}

/** True when the newest bound meets the tolerance (bounds: one per iterate so far). */
export function hasConverged(rule: ConvergenceRule, bounds: readonly (number | null)[]): boolean {
  if (rule.window === 0 || bounds.length < rule.minimumIterations) return false;
  const last = bounds[bounds.length - 1];
  return last !== null && last <= rule.tolerance;
}

function windowMean(iterates: readonly IterationValues[]): IterationValues {
  const n = iterates[0].probe.length, probe = new Float64Array(n);
  let policyValue = 0;
  for (const it of iterates) {
    policyValue += it.policyValue / iterates.length;
    for (let i = 0; i < n; i++) probe[i] += it.probe[i] / iterates.length;
  }
  return { policyValue, probe };
}
