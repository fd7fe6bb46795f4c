/**
 * Quadrature for one action dimension a ~ N(μ, σ²) limited to [lo, hi] (lo, hi may be ±∞), with
 * α = (lo−μ)/σ, β = (hi−μ)/σ, φ/Φ the standard normal density/distribution:
 *   clipped:   E f(A) = Φ(α) f(lo) + (1−Φ(β)) f(hi) + ∫_α^β f(μ+σz) φ(z) dz
 *   truncated: E f(A) = ∫_α^β f(μ+σz) φ(z) dz / (Φ(β) − Φ(α))
 * (censored and truncated normal: Johnson, Kotz & Balakrishnan, "Continuous Univariate
 * Distributions", Vol. 1, 2nd ed., §10.1; Greene, "Econometric Analysis", censored regression).
 *
 * The interior integral uses the n-point Gauss rule of the weight φ restricted to [α, β] itself,
 * not Gauss–Hermite across the kink and not a long composite rule: its n nodes are exact for
 * f∘(μ+σz) polynomial of degree ≤ 2n−1, as Gauss–Hermite is for the unbounded policy, so the
 * tensor grids of actionQuadrature stay at (n+2)^m points. Its recurrence coefficients come
 * from the discretized Stieltjes procedure (Gautschi, "Orthogonal Polynomials: Computation and
 * Approximation", 2004, §2.2.3): the weight is first discretised by composite Gauss–Legendre on
 * [α, β] ∩ {z : φ(z) ≥ e^{−40}·max φ on [α, β]} (the cut loses a relative 4e−18 of mass), then the
 * Jacobi matrix is diagonalised (Golub & Welsch 1969). The density is taken relative to its peak
 * on the interval, so a mean 40σ outside the bounds still gives a proper truncated rule.
 *
 * Negligible pieces (a choice): with clipping, a bound point mass or the interior carrying less
 * than 1e−15 of probability is left out, changing E f by at most 1e−15·max|f|; truncation instead
 * cuts the density where it is below e^{−40} of its peak. When both tails beyond the bounds carry
 * less than 1e−15, either mode uses the plain Gauss–Hermite rule; the bounded rule differs from it
 * there by about that mass times f, so there is no visible jump at the switch.
 *
 * Work per call is O(n·N) with N ≤ 5(n+12) discretisation points plus an n×n QL, all in buffers
 * allocated once by createBoundedNormalQuadrature.
 */
import { MAX_BOUNDED_NORMAL_NODES } from '../limits';
import type { BoundMode } from '../policy';
import { normalCdf, normalIntervalProbability, normalSurvival } from '../normalDistribution';
import { standardNormalRule } from './gaussHermite';
import { gaussLegendreRule } from './gaussLegendre';
import { tridiagonalEigenInPlace, type GaussRule } from './tridiagonalEigen';

export { MAX_BOUNDED_NORMAL_NODES };
/** Probability below which a tail, bound mass or clipped interior is ignored. */
export const NEGLIGIBLE_MASS = 1e-15;
/** Density cut-off below the interval's peak, as a log ratio: e^{−40} ≈ 4e−18. */
const DENSITY_CUTOFF_LOG = 40;
const EXTRA_NODES_PER_PANEL = 12;
const MAX_PANELS = 5;

export interface BoundedNormalQuadrature {
  readonly nodesPerDimension: number; // n interior nodes
  readonly maxPoints: number; // n + 2 (the two bound masses of clipping)
  /**
   * Fill nodes (actions, ascending) and weights (sum 1) for N(mean, std²) limited to [lo, hi];
   * returns the number of points used (≤ maxPoints).
   */
  fill(mean: number, std: number, lo: number, hi: number, mode: BoundMode, nodes: Float64Array, weights: Float64Array): number;
}

export function createBoundedNormalQuadrature(nodesPerDimension: number): BoundedNormalQuadrature {
  const n = nodesPerDimension;
  if (!Number.isInteger(n) || n < 1 || n > MAX_BOUNDED_NORMAL_NODES) {
    throw new RangeError(`bounded normal quadrature: nodes per dimension must be an integer from 1 to ${MAX_BOUNDED_NORMAL_NODES}, got ${n}`);
  }
  const hermite = standardNormalRule(n);
  const interior = createTruncatedWeightRule(n);
  return {
    nodesPerDimension: n,
    maxPoints: n + 2,
    fill(mean, std, lo, hi, mode, nodes, weights) {
      checkArguments(mean, std, lo, hi, mode, nodes, weights, n + 2);
      const alpha = (lo - mean) / std, beta = (hi - mean) / std;
      const massLo = normalCdf(alpha), massHi = normalSurvival(beta);
      if (massLo < NEGLIGIBLE_MASS && massHi < NEGLIGIBLE_MASS) {
        for (let i = 0; i < n; i++) {
          nodes[i] = mean + std * hermite.nodes[i];
          weights[i] = hermite.weights[i];
        }
        return n;
      }
      if (mode === 'truncate') {
        interior.fill(alpha, beta);
        return interior.write(mean, std, lo, hi, 1, nodes, weights, 0);
      }
      return fillClipped(interior, mean, std, lo, hi, alpha, beta, massLo, massHi, nodes, weights);
    },
  };
}

/** Clipping: [lo with Φ(α)], interior nodes with total mass Φ(β) − Φ(α), [hi with 1 − Φ(β)]. */
function fillClipped(
  interior: TruncatedWeightRule, mean: number, std: number, lo: number, hi: number,
  alpha: number, beta: number, massLo: number, massHi: number, nodes: Float64Array, weights: Float64Array,
): number {
  let count = 0;
  if (massLo >= NEGLIGIBLE_MASS) {
    nodes[count] = lo;
    weights[count++] = massLo;
  }
  const massInside = normalIntervalProbability(alpha, beta);
  if (massInside >= NEGLIGIBLE_MASS) {
    interior.fill(alpha, beta);
    count = interior.write(mean, std, lo, hi, massInside, nodes, weights, count);
  }
  if (massHi >= NEGLIGIBLE_MASS) {
    nodes[count] = hi;
    weights[count++] = massHi;
  }
  return count;
}

/** The n-point Gauss rule of φ on [α, β], in reusable buffers. */
interface TruncatedWeightRule {
  /** Compute the rule for φ restricted to [α, β] (α < β, either may be infinite). */
  fill(alpha: number, beta: number): void;
  /** Write actions μ + σ z_i (kept inside [lo, hi]) and mass·λ_i from index `from`; returns the next index. */
  write(mean: number, std: number, lo: number, hi: number, mass: number, nodes: Float64Array, weights: Float64Array, from: number): number;
}

function createTruncatedWeightRule(n: number): TruncatedWeightRule {
  const legendre = gaussLegendreRule(n + EXTRA_NODES_PER_PANEL);
  const capacity = MAX_PANELS * legendre.nodes.length;
  const t = new Float64Array(capacity), w = new Float64Array(capacity); // discretised measure in t ∈ [−1, 1]
  const q = new Float64Array(capacity), qPrev = new Float64Array(capacity);
  const diagonal = new Float64Array(n), offDiagonal = new Float64Array(n), firstRow = new Float64Array(n);
  let centre = 0, halfWidth = 1;
  return {
    fill(alpha, beta) {
      const zPeak = Math.min(Math.max(0, alpha), beta);
      const reach = Math.sqrt(zPeak * zPeak + 2 * DENSITY_CUTOFF_LOG);
      const a = Math.max(alpha, -reach), b = Math.min(beta, reach);
      centre = 0.5 * (a + b);
      halfWidth = 0.5 * (b - a);
      const size = discretise(legendre, a, b, zPeak, t, w);
      stieltjes(t, w, size, q, qPrev, diagonal, offDiagonal, n);
      tridiagonalEigenInPlace(diagonal, offDiagonal, firstRow, n);
    },
    write(mean, std, lo, hi, mass, nodes, weights, from) {
      let norm = 0;
      for (let i = 0; i < n; i++) norm += firstRow[i] * firstRow[i];
      for (let i = 0; i < n; i++) {
        const action = mean + std * (centre + halfWidth * diagonal[i]);
        nodes[from + i] = Math.min(hi, Math.max(lo, action));
        weights[from + i] = (mass * firstRow[i] * firstRow[i]) / norm;
      }
      return from + n;
    },
  };
}

/**
 * Composite Gauss–Legendre discretisation of φ on [a, b] in t = (z − centre)/halfWidth, weights
 * relative to φ(zPeak) (the constant cancels on normalising). Each of the equal panels carries
 * n+12 nodes, exact for degree 2n+23, so the degree-(2n−1) products the Gauss rule must
 * reproduce leave degree 24 for φ itself. The panel count grows with the interval's width (one
 * per 3.5σ) and with the fall of log φ across it (one per 14); both limits were set by measuring
 * the recurrence coefficients against a 40-panel discretisation (agreement ≤ 1e−13 for n = 1..32,
 * α from −∞ to 30, widths 0.3σ to ∞). Returns the number of points.
 */
function discretise(legendre: GaussRule, a: number, b: number, zPeak: number, t: Float64Array, w: Float64Array): number {
  const k = legendre.nodes.length, centre = 0.5 * (a + b), halfWidth = 0.5 * (b - a);
  const logFall = 0.5 * ((a - zPeak) * (a + zPeak) + (b - zPeak) * (b + zPeak));
  const panels = Math.min(MAX_PANELS, Math.max(1, Math.ceil(Math.max((b - a) / 3.5, logFall / 14))));
  const panelHalf = 1 / panels;
  for (let p = 0; p < panels; p++) {
    const panelCentre = -1 + (2 * p + 1) * panelHalf;
    for (let j = 0; j < k; j++) {
      const tj = panelCentre + panelHalf * legendre.nodes[j];
      const z = centre + halfWidth * tj;
      t[p * k + j] = tj;
      w[p * k + j] = panelHalf * legendre.weights[j] * Math.exp(-0.5 * (z - zPeak) * (z + zPeak));
    }
  }
  return panels * k;
}

/**
 * Discretised Stieltjes procedure (Gautschi 2004, §2.2.3.1) on the measure (t, w): monic
 * π_{k+1} = (t − a_k) π_k − b_k π_{k−1}, a_k = ⟨tπ_k, π_k⟩/⟨π_k, π_k⟩, b_k = ⟨π_k, π_k⟩/⟨π_{k−1}, π_{k−1}⟩,
 * one fused pass over the points per degree. Writes the Jacobi matrix: diagonal a_0..a_{n−1},
 * offDiagonal √b_1..√b_{n−1}. On t ∈ [−1, 1] the norms fall like 4^{−k}, far from underflow
 * for n ≤ 32.
 */
function stieltjes(
  t: Float64Array, w: Float64Array, size: number, p: Float64Array, pPrev: Float64Array,
  diagonal: Float64Array, offDiagonal: Float64Array, n: number,
): void {
  let norm = 0, moment = 0;
  for (let i = 0; i < size; i++) {
    norm += w[i];
    moment += w[i] * t[i];
  }
  p.fill(1, 0, size);
  pPrev.fill(0, 0, size);
  let a = moment / norm, b = 0;
  diagonal[0] = a;
  for (let k = 1; k < n; k++) {
    let nextNorm = 0, nextMoment = 0;
    for (let i = 0; i < size; i++) {
      const r = (t[i] - a) * p[i] - b * pPrev[i];
      pPrev[i] = p[i];
      p[i] = r;
      const wr2 = w[i] * r * r;
      nextNorm += wr2;
      nextMoment += wr2 * t[i];
    }
    b = nextNorm / norm;
    a = nextMoment / nextNorm;
    norm = nextNorm;
    diagonal[k] = a;
    offDiagonal[k - 1] = Math.sqrt(b);
  }
}

function checkArguments(
  mean: number, std: number, lo: number, hi: number, mode: BoundMode,
  nodes: Float64Array, weights: Float64Array, maxPoints: number,
): void {
  if (!Number.isFinite(mean)) throw new RangeError(`bounded normal quadrature: mean must be finite, got ${mean}`);
  if (!(std > 0 && Number.isFinite(std))) throw new RangeError(`bounded normal quadrature: std must be positive and finite, got ${std}`);
  if (!(lo < hi) || lo === Infinity || hi === -Infinity) {
    throw new RangeError(`bounded normal quadrature: need lo < hi with lo < +∞ and hi > −∞, got [${lo}, ${hi}]`);
  }
  if (mode !== 'clip' && mode !== 'truncate') throw new RangeError(`bounded normal quadrature: mode must be 'clip' or 'truncate', got '${String(mode)}'`);
  if (nodes.length < maxPoints || weights.length < maxPoints) {
    throw new RangeError(`bounded normal quadrature: node and weight buffers need length ≥ ${maxPoints}`);
  }
}
