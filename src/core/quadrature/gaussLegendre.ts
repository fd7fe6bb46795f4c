/**
 * Gauss–Legendre quadrature, n = 1..64: ∫_{−1}^{1} f(t) dt ≈ Σ w_i f(t_i) (Abramowitz & Stegun,
 * "Handbook of Mathematical Functions", 25.4.29 and Table 25.4), exact for degree ≤ 2n−1.
 * Orthonormal Legendre polynomials satisfy the three-term recurrence with a_k = 0,
 * b_k = k²/(4k²−1) and μ0 = 2 (Szegő, "Orthogonal Polynomials", §4.5; Golub & Welsch 1969).
 * Built by Golub–Welsch plus Newton polishing (see tridiagonalEigen), memoised per n; callers
 * receive fresh copies.
 */
import { gaussRuleFromRecurrence, type GaussRule } from './tridiagonalEigen';

export const MAX_GAUSS_LEGENDRE_NODES = 64;

const memo = new Map<number, GaussRule>();

/** Nodes ascending in (−1, 1) and weights summing to 2. */
export function gaussLegendreRule(n: number): GaussRule {
  const rule = legendreMemoised(n);
  return { nodes: rule.nodes.slice(), weights: rule.weights.slice() };
}

/**
 * The n-point rule for ∫_a^b f(x) dx by the affine map x = (a+b)/2 + (b−a)/2·t, w·(b−a)/2
 * (A&S 25.4.30). a < b finite.
 */
export function gaussLegendreOnInterval(n: number, a: number, b: number): GaussRule {
  if (!(Number.isFinite(a) && Number.isFinite(b) && a < b)) {
    throw new RangeError(`Gauss–Legendre: interval must be finite with a < b, got [${a}, ${b}]`);
  }
  const rule = legendreMemoised(n);
  const centre = 0.5 * (a + b), halfWidth = 0.5 * (b - a);
  const nodes = new Float64Array(n), weights = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    nodes[i] = centre + halfWidth * rule.nodes[i];
    weights[i] = halfWidth * rule.weights[i];
  }
  return { nodes, weights };
}

function legendreMemoised(n: number): GaussRule {
  if (!Number.isInteger(n) || n < 1 || n > MAX_GAUSS_LEGENDRE_NODES) {
    throw new RangeError(`Gauss–Legendre: the number of nodes must be an integer from 1 to ${MAX_GAUSS_LEGENDRE_NODES}, got ${n}`);
  }
  let rule = memo.get(n);
  if (!rule) {
    rule = gaussRuleFromRecurrence({ a: () => 0, b: (k) => (k * k) / (4 * k * k - 1), mu0: 2, symmetric: true }, n);
    memo.set(n, rule);
  }
  return rule;
}
