/**
 * For polynomial features and a Gaussian policy with an affine mean and independent action
 * dimensions, the candidate-averaged features are a polynomial in the state:
 *   ψ_j(s) = E_{a~π(·|s)} φ_j(s, a) = S_j(z)·Π_i E[z_{a,i}^{k_ij}],
 *   E[z_a^k] = Σ_{l even} C(k, l) τ^l (l − 1)!! u(z)^{k−l},   u(z) = β_0 + βᵀz
 * (normal moments, common practice; z the standardised state, u the standardised mean, τ = σ/h),
 * of degree deg S_j + Σ_i k_ij ≤ K. So ψ(s) = C·χ(s) with χ the state monomials of degree ≤ K
 * and C (d×dχ) depending on the policy alone: the data enter only through sums of χ that are
 * formed once for the whole map (nextStateMonomialSums.ts). Actuator limits are not in C; where
 * they matter, policyDependentSums corrects row by row.
 *
 * Shapes: C is d×dχ row-major.
 */
import type { PolynomialFeatureSpec } from '../features/featureMap';
import { monomialBasis } from '../features/monomials';
import { actionStd, type GaussianPolicy } from '../policy';
import { multiplyPolynomials, type StatePolynomialRing } from './statePolynomials';

const binomial = (k: number, l: number): number => { let c = 1; for (let i = 1; i <= l; i++) c = (c * (k - l + i)) / i; return c; };
const doubleFactorial = (l: number): number => { let p = 1; for (let i = l - 1; i > 1; i -= 2) p *= i; return p; };

/** The structure of the features that C needs: each feature's state monomial and action exponents. */
export interface FeatureStructure {
  readonly dim: number; // d
  readonly stateMonomial: Int32Array; // d: index in the ring of S_j
  readonly actionExponents: Int32Array; // d×m
}

export function featureStructure(spec: PolynomialFeatureSpec, ring: StatePolynomialRing, stateDim: number, actionDim: number): FeatureStructure {
  const n = stateDim + actionDim, basis = monomialBasis(n, spec.degree), d = basis.size;
  const stateMonomial = new Int32Array(d), actionExponents = new Int32Array(d * actionDim);
  for (let j = 0; j < d; j++) {
    stateMonomial[j] = ring.indexOf(basis.exponents.subarray(j * n, j * n + stateDim));
    for (let i = 0; i < actionDim; i++) actionExponents[j * actionDim + i] = basis.exponents[j * n + stateDim + i];
  }
  return { dim: d, stateMonomial, actionExponents };
}

/** C for the policy's unlimited action law (its affine part; the caller checks there is no schedule). */
export function nextFeatureCoefficients(
  spec: PolynomialFeatureSpec, ring: StatePolynomialRing, structure: FeatureStructure, policy: GaussianPolicy,
): Float64Array {
  const m = policy.actionDim, K = spec.degree, n = ring.size;
  const moments = Array.from({ length: m }, (_, i) => momentPolynomials(spec, ring, policy, i, K));
  const c = new Float64Array(structure.dim * n), cache = new Map<string, Float64Array>();
  const scratch = new Float64Array(n);
  for (let j = 0; j < structure.dim; j++) {
    const exps = structure.actionExponents.subarray(j * m, (j + 1) * m), key = exps.join(',');
    let q = cache.get(key);
    if (!q) {
      q = Float64Array.from(moments[0][exps[0]]);
      for (let i = 1; i < m; i++) {
        multiplyPolynomials(ring, q, moments[i][exps[i]], scratch);
        q = Float64Array.from(scratch);
      }
      cache.set(key, q);
    }
    const s = structure.stateMonomial[j];
    for (let b = 0; b < n; b++) {
      if (q[b] === 0) continue;
      c[j * n + ring.product[s * n + b]] += q[b];
    }
  }
  return c;
}

/** E[z_a^k] for k = 0..K as polynomials in the standardised state, for action i. */
function momentPolynomials(spec: PolynomialFeatureSpec, ring: StatePolynomialRing, policy: GaussianPolicy, i: number, K: number): Float64Array[] {
  const ds = policy.stateDim, n = ring.size, { mean, scale } = spec.standardiser;
  const centre = mean[ds + i], h = scale[ds + i], tau = actionStd(policy, i) / h;
  // u(z) = (offset + Σ_v G_v (mean_v + scale_v z_v) − centre)/h: degree-1 monomials sit at 1 + v.
  const u = new Float64Array(n);
  let constant = policy.offset[i] - centre;
  for (let v = 0; v < ds; v++) {
    const g = policy.gain[i * ds + v];
    constant += g * mean[v];
    u[1 + v] = (g * scale[v]) / h;
  }
  u[0] = constant / h;
  const powers: Float64Array[] = [Float64Array.from({ length: n }, (_, k) => (k === 0 ? 1 : 0))];
  for (let l = 1; l <= K; l++) {
    const next = new Float64Array(n);
    multiplyPolynomials(ring, powers[l - 1], u, next);
    powers.push(next);
  }
  return Array.from({ length: K + 1 }, (_, k) => {
    const out = new Float64Array(n);
    for (let l = 0; l <= k; l += 2) {
      const w = binomial(k, l) * tau ** l * doubleFactorial(l);
      for (let b = 0; b < n; b++) out[b] += w * powers[k - l][b];
    }
    return out;
  });
}
