/**
 * Test fixtures: invented linear plants x' = A x + B u + w with quadratic cost, logged under a
 * linear-Gaussian controller, and the exact Gaussian law of (x_t, u_t) at every step for any
 * linear-Gaussian policy (so occupancies and data moments can be computed without sampling).
 *
 * Exactness: with x_0 ~ N(m_0, C_0) and u = k + G x + e, e ~ N(0, S), every x_t is Gaussian with
 *   m_{t+1} = F m_t + B k,   C_{t+1} = F C_t Fᵀ + B S Bᵀ + W,   F = A + B G
 * (Anderson & Moore, "Optimal Filtering", 1979, §2.3), and (x_t, u_t) is jointly Gaussian. A
 * tensor Gauss–Hermite rule with q nodes per input integrates polynomials of degree ≤ 2q − 1 in
 * each input exactly (Abramowitz & Stegun 25.4.46), so feature moments of polynomial features are
 * exact to rounding.
 */
import type { FeatureMap } from '../../src/core/features/featureMap';
import { cholesky } from '../../src/core/linalg/dense';
import { closedFormPolicyCost, lqClosedForm, rewardFromCost, type LinearQuadraticPlant } from '../../src/core/lq';
import { createGaussianPolicy } from '../../src/core/policy';
import { standardNormalRule } from '../../src/core/quadrature/gaussHermite';
import { createRandom } from '../../src/core/random';
import type { TransitionSet } from '../../src/core/transitions';

export interface TestPlant {
  n: number; m: number;
  A: number[]; B: number[]; // n×n, n×m row-major
  noiseStd: number[]; // n, independent process noise
  Q: number[]; R: number[]; // cost weights n×n, m×m
}

/** u = offset + gain·x + std·N(0, 1) per action, optionally clipped to [lo, hi]. */
export interface TestController { offset: number[]; gain: number[]; std: number[]; lo?: number[]; hi?: number[] }

export interface GaussianLaw { mean: Float64Array; cov: Float64Array } // dim p, p×p

export interface LogSpec { episodes: number; steps: number; seed: number; start: GaussianLaw }

export function simulateLog(plant: TestPlant, controller: TestController, spec: LogSpec): TransitionSet {
  const { n, m } = plant, count = spec.episodes * spec.steps, rng = createRandom(spec.seed);
  const states = new Float64Array(count * n), actions = new Float64Array(count * m), nextStates = new Float64Array(count * n);
  const rewards = new Float64Array(count), episode = new Int32Array(count), startStates = new Float64Array(spec.episodes * n);
  const startFactor = cholesky(spec.start.cov, n);
  const x = new Float64Array(n), u = new Float64Array(m), z = new Float64Array(n);
  let row = 0;
  for (let e = 0; e < spec.episodes; e++) {
    for (let i = 0; i < n; i++) z[i] = rng.normal();
    for (let i = 0; i < n; i++) x[i] = startStates[e * n + i] = spec.start.mean[i] + rowDot(startFactor, i, z, n);
    for (let t = 0; t < spec.steps; t++, row++) {
      controllerAction(controller, x, rng, u);
      states.set(x, row * n);
      actions.set(u, row * m);
      rewards[row] = -(quadratic(plant.Q, x) + quadratic(plant.R, u));
      plantStep(plant, x, u, rng, x);
      nextStates.set(x, row * n);
      episode[row] = e;
    }
  }
  return {
    count, stateDim: n, actionDim: m,
    stateNames: Array.from({ length: n }, (_, i) => `x${i + 1}`), actionNames: Array.from({ length: m }, (_, i) => `u${i + 1}`),
    states, actions, rewards, nextStates, terminal: new Uint8Array(count), episode, episodeCount: spec.episodes, startStates,
    sourceLine: Int32Array.from({ length: count }, (_, i) => i + 2),
  };
}

export function controllerAction(c: TestController, x: ArrayLike<number>, rng: { normal(): number }, out: Float64Array): void {
  const n = x.length;
  for (let a = 0; a < out.length; a++) {
    let v = c.offset[a] + c.std[a] * rng.normal();
    for (let j = 0; j < n; j++) v += c.gain[a * n + j] * x[j];
    if (c.lo) v = Math.max(c.lo[a], v);
    if (c.hi) v = Math.min(c.hi[a], v);
    out[a] = v;
  }
}

/** x ← A x + B u + w (in place allowed: out may alias x). */
export function plantStep(p: TestPlant, x: ArrayLike<number>, u: ArrayLike<number>, rng: { normal(): number }, out: Float64Array): void {
  const next = new Float64Array(p.n);
  for (let i = 0; i < p.n; i++) next[i] = rowDot(p.A, i, x, p.n) + rowDot(p.B, i, u, p.m) + p.noiseStd[i] * rng.normal();
  out.set(next);
}

/** The law of the state at steps 0 … steps−1 under a linear-Gaussian controller (no clipping). */
export function stateLaws(plant: TestPlant, c: TestController, start: GaussianLaw, steps: number): GaussianLaw[] {
  const { n, m } = plant, f = closedLoop(plant, c), laws: GaussianLaw[] = [];
  const bsb = new Float64Array(n * n);
  for (let i = 0; i < n; i++) for (let j = 0; j < n; j++) {
    for (let a = 0; a < m; a++) bsb[i * n + j] += plant.B[i * m + a] * c.std[a] ** 2 * plant.B[j * m + a];
    if (i === j) bsb[i * n + j] += plant.noiseStd[i] ** 2;
  }
  let mean: Float64Array = Float64Array.from(start.mean), cov: Float64Array = Float64Array.from(start.cov);
  for (let t = 0; t < steps; t++) {
    laws.push({ mean, cov });
    const nextMean = new Float64Array(n);
    for (let i = 0; i < n; i++) nextMean[i] = rowDot(f, i, mean, n) + rowDot(plant.B, i, c.offset, m);
    const fc = matmul(f, cov, n, n, n), next = matmul(fc, transpose(f, n, n), n, n, n);
    for (let k = 0; k < n * n; k++) next[k] += bsb[k];
    mean = nextMean;
    cov = next;
  }
  return laws;
}

/** The joint law of (x, u) given the law of x and a linear-Gaussian controller. */
export function stateActionLaw(c: TestController, law: GaussianLaw, n: number, m: number): GaussianLaw {
  const p = n + m, mean = new Float64Array(p), cov = new Float64Array(p * p);
  mean.set(law.mean);
  for (let a = 0; a < m; a++) mean[n + a] = c.offset[a] + rowDot(c.gain, a, law.mean, n);
  const gc = matmul(c.gain, law.cov, m, n, n); // m×n
  const gcg = matmul(gc, transpose(c.gain, m, n), m, n, m);
  for (let i = 0; i < n; i++) for (let j = 0; j < n; j++) cov[i * p + j] = law.cov[i * n + j];
  for (let a = 0; a < m; a++) {
    for (let j = 0; j < n; j++) cov[(n + a) * p + j] = cov[j * p + n + a] = gc[a * n + j];
    for (let b = 0; b < m; b++) cov[(n + a) * p + n + b] = gcg[a * m + b] + (a === b ? c.std[a] ** 2 : 0);
  }
  return { mean, cov };
}

/** E[φ] (d) and, unless meanOnly, E[φφᵀ] (d×d) under a Gaussian law of the feature inputs, by a tensor Gauss–Hermite rule. */
export function featureMoments(features: FeatureMap, law: GaussianLaw, nodes = 4, meanOnly = false): { mean: Float64Array; second: Float64Array } {
  const p = law.mean.length, d = features.dim, rule = standardNormalRule(nodes), l = choleskyPsd(law.cov, p);
  const mean = new Float64Array(d), second = new Float64Array(d * d), phi = new Float64Array(d);
  const zeta = new Float64Array(p), input = new Float64Array(p);
  for (let j = 0, count = nodes ** p; j < count; j++) {
    let w = 1;
    for (let i = 0, rest = j; i < p; i++, rest = Math.floor(rest / nodes)) {
      zeta[i] = rule.nodes[rest % nodes];
      w *= rule.weights[rest % nodes];
    }
    for (let i = 0; i < p; i++) input[i] = law.mean[i] + rowDot(l, i, zeta, p);
    features.evaluate(input, 0, phi, 0);
    for (let a = 0; a < d; a++) {
      mean[a] += w * phi[a];
      if (!meanOnly) for (let b = 0; b < d; b++) second[a * d + b] += w * phi[a] * phi[b];
    }
  }
  return { mean, second };
}

/** Cholesky with a tiny diagonal lift for a singular covariance (a deterministic input). */
function choleskyPsd(cov: Float64Array, p: number): Float64Array {
  let scale = 0;
  for (let i = 0; i < p; i++) scale = Math.max(scale, cov[i * p + i]);
  const lifted = Float64Array.from(cov, (v, k) => (k % (p + 1) === 0 ? v + 1e-14 * scale : v));
  return cholesky(lifted, p);
}

export function closedLoop(plant: TestPlant, c: TestController): Float64Array {
  const bg = matmul(plant.B, c.gain, plant.n, plant.m, plant.n);
  return Float64Array.from(plant.A, (v, i) => v + bg[i]);
}

export function matmul(a: ArrayLike<number>, b: ArrayLike<number>, r: number, k: number, c: number): Float64Array {
  const out = new Float64Array(r * c);
  for (let i = 0; i < r; i++) for (let j = 0; j < c; j++) {
    let s = 0;
    for (let t = 0; t < k; t++) s += a[i * k + t] * b[t * c + j];
    out[i * c + j] = s;
  }
  return out;
}

export function transpose(a: ArrayLike<number>, r: number, c: number): Float64Array {
  const out = new Float64Array(r * c);
  for (let i = 0; i < r; i++) for (let j = 0; j < c; j++) out[j * r + i] = a[i * c + j];
  return out;
}

function rowDot(a: ArrayLike<number>, row: number, v: ArrayLike<number>, n: number): number {
  let s = 0;
  for (let j = 0; j < n; j++) s += a[row * n + j] * v[j];
  return s;
}

function quadratic(w: number[], v: ArrayLike<number>): number {
  let s = 0;
  for (let i = 0; i < v.length; i++) for (let j = 0; j < v.length; j++) s += v[i] * w[i * v.length + j] * v[j];
  return s;
}

/** The plant in src/core/lq.ts's form (deviation coordinates around 0), for the closed-form values. */
export function closedFormPlant(p: TestPlant): LinearQuadraticPlant {
  return {
    stateDim: p.n, actionDim: p.m, dynamics: Float64Array.from(p.A), inputGain: Float64Array.from(p.B),
    processNoiseCovariance: Float64Array.from({ length: p.n * p.n }, (_, k) => (k % (p.n + 1) === 0 ? p.noiseStd[k / (p.n + 1)] ** 2 : 0)),
    stateWeight: Float64Array.from(p.Q), actionWeight: Float64Array.from(p.R),
  };
}

/** J of a linear-Gaussian controller in REWARD terms (−cost) from given start states (count×n), by the closed form. */
export function exactPolicyValue(p: TestPlant, c: TestController, discount: number, starts: Float64Array): number {
  const policy = createGaussianPolicy({ offset: c.offset, gain: [...Array(p.m)].map((_, a) => c.gain.slice(a * p.n, (a + 1) * p.n)), std: c.std }, p.n);
  const form = lqClosedForm(closedFormPlant(p), { state: new Float64Array(p.n), action: new Float64Array(p.m) }, policy, discount);
  return rewardFromCost(closedFormPolicyCost(form, starts, starts.length / p.n));
}
