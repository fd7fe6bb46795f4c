/**
 * Censored normal regression (the Tobit model; Tobin, "Estimation of relationships for limited
 * dependent variables", Econometrica 26, 1958): y_i = clip(x_iᵀβ + σε_i, lo, hi), ε_i ~ N(0, 1),
 * fitted by maximum likelihood. This is the law of a clipped actuator: a logged action at a limit
 * says only that the controller asked for at least (at most) that much.
 *
 * Log-likelihood per row, in Olsen's parameters δ = β/σ, θ = 1/σ (Olsen, "Note on the uniqueness of
 * the maximum likelihood estimator for the Tobit model", Econometrica 46, 1978), where it is
 * globally concave, so Newton's method with step halving converges from any start:
 *   inside:      log θ − ½(θy − xᵀδ)² − ½ log 2π
 *   at lo:       log Φ(θ·lo − xᵀδ)
 *   at hi:       log Φ(xᵀδ − θ·hi)
 * With λ(z) = φ(z)/Φ(z) (the inverse Mills ratio), d log Φ/dz = λ and d² log Φ/dz² = −λ(z + λ)
 * (Greene, "Econometric Analysis", 7th ed., ch. 19; section from memory). Standard errors of (β, σ) by the delta method
 * from the inverse of the observed information in (δ, θ).
 *
 * Shapes: x n×k row-major (include a column of ones for an intercept); y n.
 */
import { cholesky, choleskySolve, SingularMatrixError } from './linalg/dense';
import { logNormalDensity, normalCdf, normalDensity } from './normalDistribution';

export interface CensoredRegressionFit {
  readonly coefficients: Float64Array; // β: k
  readonly sigma: number; // σ
  /** Covariance of (β, σ): (k+1)×(k+1) row-major, σ last. */
  readonly covariance: Float64Array;
  readonly logLikelihood: number;
  readonly iterations: number;
  readonly censoredLow: number;
  readonly censoredHigh: number;
}

export class CensoredRegressionError extends Error {
  constructor(message: string) {
    super(message);
    this.name = 'CensoredRegressionError';
  }
}

const MAX_ITERATIONS = 100;
/** Newton decrement gᵀ(−H)⁻¹g below this (per row) ends the iteration: far below any sampling error. */
const DECREMENT_TOLERANCE = 1e-12;

export function fitCensoredRegression(
  x: Float64Array, y: Float64Array, n: number, k: number, lo: number, hi: number, start: { coefficients: ArrayLike<number>; sigma: number },
): CensoredRegressionFit {
  if (x.length !== n * k || y.length !== n) throw new CensoredRegressionError(`censored regression: expected ${n}×${k} regressors and ${n} responses`);
  if (!(start.sigma > 0)) throw new CensoredRegressionError('censored regression: the starting σ must be positive');
  let p = Float64Array.from({ length: k + 1 }, (_, j) => (j < k ? start.coefficients[j] / start.sigma : 1 / start.sigma));
  let current = evaluate(x, y, n, k, lo, hi, p);
  for (let iteration = 1; iteration <= MAX_ITERATIONS; iteration++) {
    const step = newtonStep(current.gradient, current.hessian, k + 1);
    let decrement = 0;
    for (let j = 0; j <= k; j++) decrement += step[j] * current.gradient[j];
    if (decrement < DECREMENT_TOLERANCE * n) return finish(p, current, k, iteration, y, lo, hi);
    for (let scale = 1; ; scale /= 2) {
      if (scale < 1e-10) return finish(p, current, k, iteration, y, lo, hi); // no ascent left at rounding level
      const trial = Float64Array.from(p, (v, j) => v + scale * step[j]);
      if (!(trial[k] > 0)) continue;
      const next = evaluate(x, y, n, k, lo, hi, trial);
      if (next.logLikelihood >= current.logLikelihood) {
        p = trial;
        current = next;
        break;
      }
    }
  }
  throw new CensoredRegressionError(`censored regression: no convergence in ${MAX_ITERATIONS} Newton steps`);
}

interface Evaluation { logLikelihood: number; gradient: Float64Array; hessian: Float64Array }

/** ℓ, its gradient and Hessian in (δ, θ). */
function evaluate(x: Float64Array, y: Float64Array, n: number, k: number, lo: number, hi: number, p: Float64Array): Evaluation {
  const q = k + 1, theta = p[k], gradient = new Float64Array(q), hessian = new Float64Array(q * q), v = new Float64Array(q);
  let ll = 0;
  for (let i = 0; i < n; i++) {
    let xd = 0;
    for (let j = 0; j < k; j++) xd += x[i * k + j] * p[j];
    const yi = y[i];
    let g: number, h: number; // ℓ_i = f(z) with z = vᵀp: dℓ/dp = g·v, d²ℓ/dp² = h·vvᵀ (plus the log θ term inside)
    if (yi <= lo || yi >= hi) {
      const low = yi <= lo, z = low ? theta * lo - xd : xd - theta * hi;
      for (let j = 0; j < k; j++) v[j] = low ? -x[i * k + j] : x[i * k + j];
      v[k] = low ? lo : -hi;
      const lambda = millsRatio(z);
      ll += logNormalCdf(z);
      g = lambda;
      h = -lambda * (z + lambda);
    } else {
      const r = theta * yi - xd;
      for (let j = 0; j < k; j++) v[j] = -x[i * k + j];
      v[k] = yi;
      ll += Math.log(theta) + logNormalDensity(r);
      g = -r;
      h = -1;
      gradient[k] += 1 / theta;
      hessian[k * q + k] -= 1 / (theta * theta);
    }
    for (let a = 0; a < q; a++) {
      gradient[a] += g * v[a];
      for (let b = 0; b < q; b++) hessian[a * q + b] += h * v[a] * v[b];
    }
  }
  return { logLikelihood: ll, gradient, hessian };
}

/** (−H)⁻¹g: −H is positive definite by Olsen's concavity. */
function newtonStep(gradient: Float64Array, hessian: Float64Array, q: number): Float64Array {
  try {
    return choleskySolve(cholesky(hessian.map((v) => -v), q), q, gradient);
  } catch (error) {
    if (!(error instanceof SingularMatrixError)) throw error;
    throw new CensoredRegressionError('censored regression: the regressors are collinear, or nearly every action sits at a limit');
  }
}

function finish(p: Float64Array, at: Evaluation, k: number, iterations: number, y: Float64Array, lo: number, hi: number): CensoredRegressionFit {
  const q = k + 1, theta = p[k];
  const information = cholesky(at.hessian.map((v) => -v), q);
  const inverse = new Float64Array(q * q);
  for (let c = 0; c < q; c++) {
    const e = new Float64Array(q);
    e[c] = 1;
    const col = choleskySolve(information, q, e);
    for (let r = 0; r < q; r++) inverse[r * q + c] = col[r];
  }
  // Delta method: β_j = δ_j/θ, σ = 1/θ.
  const jacobian = new Float64Array(q * q);
  for (let j = 0; j < k; j++) {
    jacobian[j * q + j] = 1 / theta;
    jacobian[j * q + k] = -p[j] / (theta * theta);
  }
  jacobian[k * q + k] = -1 / (theta * theta);
  const covariance = new Float64Array(q * q);
  for (let a = 0; a < q; a++) for (let b = 0; b < q; b++) {
    let s = 0;
    for (let c = 0; c < q; c++) for (let d = 0; d < q; d++) s += jacobian[a * q + c] * inverse[c * q + d] * jacobian[b * q + d];
    covariance[a * q + b] = s;
  }
  let censoredLow = 0, censoredHigh = 0;
  for (const v of y) {
    if (v <= lo) censoredLow++;
    else if (v >= hi) censoredHigh++;
  }
  return {
    coefficients: Float64Array.from({ length: k }, (_, j) => p[j] / theta), sigma: 1 / theta, covariance,
    logLikelihood: at.logLikelihood, iterations, censoredLow, censoredHigh,
  };
}

/** Below this z, Φ(z) is taken from its asymptotic series (erfc underflows near z = −37). */
const TAIL_Z = -30;

/** log Φ(z); for z < −30, log φ(z) − log(−z) + log(1 − 1/z² + 3/z⁴) (A&S 26.2.12). */
function logNormalCdf(z: number): number {
  if (z >= TAIL_Z) return Math.log(normalCdf(z));
  const w = 1 / (z * z);
  return logNormalDensity(z) - Math.log(-z) + Math.log(1 - w + 3 * w * w);
}

/** λ(z) = φ(z)/Φ(z), with the same series in the far left tail. */
function millsRatio(z: number): number {
  if (z >= TAIL_Z) return normalDensity(z) / normalCdf(z);
  const w = 1 / (z * z);
  return -z / (1 - w + 3 * w * w);
}
