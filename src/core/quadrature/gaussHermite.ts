/**
 * Gauss–Hermite quadrature, n = 1..64.
 *
 * Physicists' form (Abramowitz & Stegun, "Handbook of Mathematical Functions", 25.4.46 and
 * Table 25.10): ∫ e^{−x²} f(x) dx ≈ Σ w_i f(x_i). Orthonormal Hermite polynomials satisfy the
 * recurrence with a_k = 0, b_k = k/2, μ0 = √π (Szegő, "Orthogonal Polynomials", §5.5).
 *
 * Probabilists' (standard-normal) form: E[f(Z)] ≈ Σ w_i f(z_i) for Z ~ N(0, 1), weights summing
 * to 1; its recurrence has a_k = 0, b_k = k, μ0 = 1 (the He_k polynomials). It equals the
 * physicists' rule with z = √2·x and w/√π, but is built from its own recurrence so no rescaling
 * rounding enters the nodes the engine uses.
 *
 * Rules are built once per n by Golub–Welsch plus Newton polishing (see tridiagonalEigen) and
 * memoised; callers receive fresh copies, so the memo can never be altered from outside.
 */
import { MAX_GAUSS_HERMITE_NODES } from '../limits';
import { gaussRuleFromRecurrence, type GaussRule } from './tridiagonalEigen';

export { MAX_GAUSS_HERMITE_NODES };

const physicistsMemo = new Map<number, GaussRule>();
const standardNormalMemo = new Map<number, GaussRule>();

/** Nodes ascending and weights for ∫ e^{−x²} f(x) dx (A&S Table 25.10). */
export function gaussHermiteRule(n: number): GaussRule {
  return copyRule(memoised(physicistsMemo, n, { a: () => 0, b: (k) => k / 2, mu0: Math.sqrt(Math.PI), symmetric: true }));
}

/** Nodes ascending and weights (sum 1) for E[f(Z)], Z ~ N(0, 1). */
export function standardNormalRule(n: number): GaussRule {
  return copyRule(memoised(standardNormalMemo, n, { a: () => 0, b: (k) => k, mu0: 1, symmetric: true }));
}

function memoised(memo: Map<number, GaussRule>, n: number, recurrence: Parameters<typeof gaussRuleFromRecurrence>[0]): GaussRule {
  checkNodeCount(n);
  let rule = memo.get(n);
  if (!rule) {
    rule = gaussRuleFromRecurrence(recurrence, n);
    memo.set(n, rule);
  }
  return rule;
}

function checkNodeCount(n: number): void {
  if (!Number.isInteger(n) || n < 1 || n > MAX_GAUSS_HERMITE_NODES) {
    throw new RangeError(`Gauss–Hermite: the number of nodes must be an integer from 1 to ${MAX_GAUSS_HERMITE_NODES}, got ${n}`);
  }
}

function copyRule(rule: GaussRule): GaussRule {
  return { nodes: rule.nodes.slice(), weights: rule.weights.slice() };
}
