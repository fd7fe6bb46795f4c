import { describe, expect, it } from 'vitest';
import { Matrix, solve as mlSolve } from 'ml-matrix';
import {
  LqModelError, UnstableClosedLoopError, closedFormActionCost, closedFormGaussianStartCost, closedFormPolicyCost,
  closedFormRewardActionValue, closedFormStateCost, deviationFeedback, feedbackCostToGo, lqClosedForm, rewardFromCost,
  type LinearQuadraticPlant, type OperatingPoint,
} from '../../src/core/lq';
import { createGaussianPolicy, sampleAction, type GaussianPolicy, type GaussianPolicySpec } from '../../src/core/policy';
import { cholesky } from '../../src/core/linalg/dense';
import { createRandom, type RandomSource } from '../../src/core/random';

const f64 = (values: number[]): Float64Array => Float64Array.from(values);

function plantOf(a: number[], b: number[], w: number[], q: number[], r: number[], n: number, m: number): LinearQuadraticPlant {
  return { stateDim: n, actionDim: m, dynamics: f64(a), inputGain: f64(b), processNoiseCovariance: f64(w), stateWeight: f64(q), actionWeight: f64(r) };
}

// An invented two-state plant with coupled dynamics, correlated process noise and one action.
const plant = plantOf([0.9, 0.2, -0.1, 0.8], [0.5, 1.0], [0.04, 0.01, 0.01, 0.02], [1, 0, 0, 0.5], [0.2], 2, 1);
const point: OperatingPoint = { state: f64([10, 4]), action: f64([2]) };
const discount = 0.9;
// Centred offset would be u_sp − G·x_sp = 2 + 3 + 0.8 = 5.8; 6.3 puts the policy 0.5 off centre.
const offCentre: GaussianPolicySpec = { offset: [6.3], gain: [[-0.3, -0.2]], std: [0.4] };
const centred: GaussianPolicySpec = { offset: [5.8], gain: [[-0.3, -0.2]], std: [0.4] };

describe('closed form against published and derived examples', () => {
  it('the Lyapunov cost of the printed optimal gain equals the printed Riccati solution', () => {
    // Altair Compose OML reference, "dlqr", Example (2021.help.altair.com/2021/compose/business/en_us/
    // topics/reference/oml_language/ControlSystem/dlqr.htm): A = [9 0.2; 0 8], B = [0; 1], Q = [2 1; 1 2],
    // R = 1 gives K = [394.61003 16.76761], X = [1.04036e7 2.34349e5; 2.34349e5 5.34387e3].
    // At the optimal gain the Riccati solution satisfies the policy's Lyapunov equation
    // (Anderson & Moore, "Optimal Control: Linear Quadratic Methods", 1990), and P is stationary in K, so the
    // rounding of the printed K changes P only at second order. The example is undiscounted;
    // with A/√γ and B/√γ the discounted equation is the same equation (γ·FᵀPF unchanged).
    const g = 0.5, r2 = Math.SQRT2;
    const p = plantOf([9 * r2, 0.2 * r2, 0, 8 * r2], [0, r2], [0, 0, 0, 0], [2, 1, 1, 2], [1], 2, 1);
    const v = feedbackCostToGo(p, { feedbackGain: f64([394.61003, 16.76761]), bias: f64([0]), noiseCovariance: f64([0]) }, g);
    const printed = [1.04036e7, 2.34349e5, 2.34349e5, 5.34387e3];
    printed.forEach((x, i) => expect(Math.abs(v.quadratic[i] - x) / x).toBeLessThan(6e-6));
    expect(v.constant).toBeCloseTo(0, 12);
  });

  it('scalar regulator x⁺ = x + u, q = r = 1: the optimal cost is the golden ratio', () => {
    // DARE p = q + a²p − (abp)²/(r + b²p) reduces to p² − p − 1 = 0, p = φ, K = p/(1 + p) = 1/φ
    // (closed form, derived here; the DARE as in Anderson & Moore, "Optimal Control: Linear Quadratic Methods").
    const phi = (1 + Math.sqrt(5)) / 2, g = 0.81;
    const p = plantOf([1 / 0.9], [1 / 0.9], [0], [1], [1], 1, 1);
    const v = feedbackCostToGo(p, { feedbackGain: f64([1 / phi]), bias: f64([0]), noiseCovariance: f64([0]) }, g);
    expect(v.quadratic[0]).toBeCloseTo(phi, 12);
  });

  it('scalar closed form p = qc/(1 − γ(a − bk)²) and the noise constant', () => {
    // Geometric series; c0 = [r·s + γ·p·(b²s + w)]/(1 − γ) from the derivation in lq.ts.
    const [a, b, q, r, w, k, s, g] = [0.95, 0.4, 2, 0.5, 0.3, 0.8, 0.09, 0.93];
    const v = feedbackCostToGo(plantOf([a], [b], [w], [q], [r], 1, 1), { feedbackGain: f64([k]), bias: f64([0]), noiseCovariance: f64([s]) }, g);
    const p = (q + r * k * k) / (1 - g * (a - b * k) ** 2);
    expect(v.quadratic[0]).toBeCloseTo(p, 12);
    expect(v.linear[0]).toBeCloseTo(0, 14);
    expect(v.constant).toBeCloseTo((r * s + g * p * (b * b * s + w)) / (1 - g), 10);
  });

  it('P, p and c agree with an augmented-state Kronecker solve by ml-matrix to 1e-10 (n up to 10, m up to 3)', () => {
    for (const [n, m] of [[1, 1], [3, 2], [6, 3], [10, 2]] as const) {
      const rng = createRandom(31 * n + m);
      const test = randomPlant(rng, n, m);
      const gamma = 0.95;
      const feedback = { feedbackGain: Float64Array.from({ length: m * n }, () => 0.05 * rng.normal()), bias: Float64Array.from({ length: m }, () => rng.normal()), noiseCovariance: diag(m, 0.3) };
      const v = feedbackCostToGo(test, feedback, gamma);
      const ref = mlReference(test, feedback, gamma);
      expect(relativeMaxError(v.quadratic, ref.quadratic)).toBeLessThan(1e-10);
      expect(relativeMaxError(v.linear, ref.linear)).toBeLessThan(1e-10);
      expect(Math.abs(v.constant - ref.constant) / Math.abs(ref.constant)).toBeLessThan(1e-10);
    }
  });

  it('V(x) = E_{a~π} Q(x, a) = Q(x, μ(x)) + tr(S(R + γBᵀPB)) (Gaussian expectation of a quadratic)', () => {
    const policy = createGaussianPolicy(offCentre, 2);
    const form = lqClosedForm(plant, point, policy, discount);
    const p = form.costToGo.quadratic;
    const bpb = 0.5 * (0.5 * p[0] + 1 * p[2]) + 1 * (0.5 * p[1] + 1 * p[3]);
    for (const s of [[10, 4], [11.5, 3.2], [8, 6]]) {
      const mean = 6.3 - 0.3 * s[0] - 0.2 * s[1];
      const expected = closedFormActionCost(form, s, [mean]) + 0.16 * (0.2 + discount * bpb);
      expect(closedFormStateCost(form, s)).toBeCloseTo(expected, 10);
    }
  });
});

describe('closed form against seeded Monte Carlo rollouts (tolerance 4 standard errors)', () => {
  const rollouts = 4000, horizon = 260; // 0.9^260 ≈ 1.3e-12: truncation bias negligible next to the SE

  for (const [label, spec] of [['off-centre', offCentre], ['centred', centred]] as const) {
    it(`V(s0) and Q(s0, a0) of the ${label} policy`, () => {
      const policy = createGaussianPolicy(spec, 2);
      const form = lqClosedForm(plant, point, policy, discount);
      const s0 = [10.8, 3.5], a0 = [3.1];
      const v = monteCarlo(policy, () => f64(s0), null, rollouts, horizon, 11);
      const q = monteCarlo(policy, () => f64(s0), a0, rollouts, horizon, 12);
      expect(Math.abs(v.mean - closedFormStateCost(form, s0))).toBeLessThan(4 * v.standardError);
      expect(Math.abs(q.mean - closedFormActionCost(form, s0, a0))).toBeLessThan(4 * q.standardError);
    });
  }

  it('J from a Gaussian start N(μ0, Σ0), and J from a set of start states', () => {
    const policy = createGaussianPolicy(offCentre, 2);
    const form = lqClosedForm(plant, point, policy, discount);
    const mu0 = [9.5, 4.6], sigma0 = [0.5, 0.1, 0.1, 0.3], l = cholesky(sigma0, 2);
    const startRng = createRandom(13);
    const starts: number[] = [];
    const draw = (): Float64Array => {
      const z0 = startRng.normal(), z1 = startRng.normal();
      const s = f64([mu0[0] + l[0] * z0, mu0[1] + l[2] * z0 + l[3] * z1]);
      starts.push(s[0], s[1]);
      return s;
    };
    const j = monteCarlo(policy, draw, null, rollouts, horizon, 14);
    expect(Math.abs(j.mean - closedFormGaussianStartCost(form, mu0, sigma0))).toBeLessThan(4 * j.standardError);
    // The empirical start states' mean V differs from the rollout mean only by the return noise.
    expect(Math.abs(j.mean - closedFormPolicyCost(form, f64(starts), rollouts))).toBeLessThan(4 * j.standardError);
  });
});

describe('mapping, sign helper and errors', () => {
  it('the centred policy has zero bias; the off-centre one has d = offset + G·x_sp − u_sp', () => {
    expect(deviationFeedback(createGaussianPolicy(centred, 2), point).bias[0]).toBeCloseTo(0, 14);
    const f = deviationFeedback(createGaussianPolicy(offCentre, 2), point);
    expect(f.bias[0]).toBeCloseTo(0.5, 14);
    expect(Array.from(f.feedbackGain)).toEqual([0.3, 0.2]);
    expect(f.noiseCovariance[0]).toBeCloseTo(0.16, 14);
  });

  it('the reward-valued action-value function is −Q', () => {
    const form = lqClosedForm(plant, point, createGaussianPolicy(offCentre, 2), discount);
    const out = new Float64Array(2);
    closedFormRewardActionValue(form).evaluate(f64([10, 4, 2, 11, 3, 1]), 2, out);
    expect(out[0]).toBe(rewardFromCost(closedFormActionCost(form, [10, 4], [2])));
    expect(out[1]).toBe(-closedFormActionCost(form, [11, 3], [1]));
  });

  it('an unstable closed loop throws UnstableClosedLoopError with a plain message', () => {
    // A − BK = 1.2 (open loop 1.2, no feedback): γ·ρ² = 0.9 · 1.44 = 1.296.
    const p = plantOf([1.2], [1], [0.1], [1], [1], 1, 1);
    const run = (): unknown => feedbackCostToGo(p, { feedbackGain: f64([0]), bias: f64([0]), noiseCovariance: f64([0.1]) }, 0.9);
    expect(run).toThrow(UnstableClosedLoopError);
    expect(run).toThrow(/discount 0\.9/);
    try { run(); } catch (e) { expect((e as UnstableClosedLoopError).discountedSpectralRadiusSquared).toBeCloseTo(1.296, 2); }
  });

  it('rejects bounded policies, a bad discount and asymmetric weights', () => {
    const bounded = createGaussianPolicy({ ...offCentre, bounds: { lo: [0], hi: [10], mode: 'clip' } }, 2);
    expect(() => lqClosedForm(plant, point, bounded, discount)).toThrow(/unbounded actuator/);
    expect(() => lqClosedForm(plant, point, createGaussianPolicy(offCentre, 2), 1)).toThrow(LqModelError);
    const skew = { ...plant, stateWeight: f64([1, 0.3, 0, 1]) };
    expect(() => lqClosedForm(skew, point, createGaussianPolicy(offCentre, 2), discount)).toThrow(/state weight Q: must be symmetric/);
  });
});

/** Discounted cost of seeded rollouts in absolute coordinates; firstAction fixes a0 (for Q). */
function monteCarlo(
  policy: GaussianPolicy, start: () => Float64Array, firstAction: number[] | null, count: number, horizon: number, seed: number,
): { mean: number; standardError: number } {
  const rng = createRandom(seed), wFactor = cholesky(plant.processNoiseCovariance, 2);
  const returns = new Float64Array(count), action = new Float64Array(1);
  for (let k = 0; k < count; k++) {
    const s = start();
    let total = 0, weight = 1;
    for (let t = 0; t < horizon; t++) {
      if (t === 0 && firstAction) action[0] = firstAction[0];
      else sampleAction(policy, s, rng, action);
      total += weight * stepInPlace(s, action[0], wFactor, rng);
      weight *= discount;
    }
    returns[k] = total;
  }
  const mean = returns.reduce((a, b) => a + b, 0) / count;
  const variance = returns.reduce((a, r) => a + (r - mean) ** 2, 0) / (count - 1);
  return { mean, standardError: Math.sqrt(variance / count) };
}

/** Advance s (absolute) one step under action a; returns the stage cost. */
function stepInPlace(s: Float64Array, a: number, wFactor: Float64Array, rng: RandomSource): number {
  const x0 = s[0] - point.state[0], x1 = s[1] - point.state[1], v = a - point.action[0];
  const cost = x0 * x0 + 0.5 * x1 * x1 + 0.2 * v * v;
  const z0 = rng.normal(), z1 = rng.normal();
  s[0] = point.state[0] + 0.9 * x0 + 0.2 * x1 + 0.5 * v + wFactor[0] * z0;
  s[1] = point.state[1] - 0.1 * x0 + 0.8 * x1 + 1.0 * v + wFactor[2] * z0 + wFactor[3] * z1;
  return cost;
}

function diag(n: number, value: number): Float64Array {
  const d = new Float64Array(n * n);
  for (let i = 0; i < n; i++) d[i * n + i] = value;
  return d;
}

function randomPlant(rng: RandomSource, n: number, m: number): LinearQuadraticPlant {
  const a = Float64Array.from({ length: n * n }, () => (0.6 / Math.sqrt(n)) * rng.normal());
  const b = Float64Array.from({ length: n * m }, () => rng.normal());
  return { stateDim: n, actionDim: m, dynamics: a, inputGain: b, processNoiseCovariance: diag(n, 0.1), stateWeight: diag(n, 1), actionWeight: diag(m, 0.5) };
}

/**
 * An independent route to (P, p, c): augment the state with a constant 1, z = [x; 1], so the affine
 * loop becomes homogeneous (common practice): z⁺ = F_z z + [ξ; 0] with F_z = [F, Bd; 0, 1],
 * ξ ~ N(0, BSBᵀ + W), expected stage cost zᵀMz with M = [Qc, −KᵀRd; −dᵀRK, dᵀRd + tr(RS)].
 * Then P_z = M + γF_zᵀP_zF_z, solved in Kronecker form by ml-matrix, and V(x) = zᵀP_z z + κ with
 * κ = γ tr(P_xx (BSBᵀ + W))/(1 − γ). So P = P_xx, p = P_x1, c = P_11 + κ.
 */
function mlReference(p: LinearQuadraticPlant, f: { feedbackGain: Float64Array; bias: Float64Array; noiseCovariance: Float64Array }, gamma: number) {
  const { stateDim: n, actionDim: m } = p;
  const toM = (a: Float64Array, r: number, c: number) => new Matrix(Array.from({ length: r }, (_, i) => Array.from(a.subarray(i * c, (i + 1) * c))));
  const A = toM(p.dynamics, n, n), B = toM(p.inputGain, n, m), K = toM(f.feedbackGain, m, n), R = toM(p.actionWeight, m, m);
  const S = toM(f.noiseCovariance, m, m), d = Matrix.columnVector(Array.from(f.bias));
  const F = A.clone().sub(B.mmul(K));
  const Fz = Matrix.zeros(n + 1, n + 1);
  Fz.setSubMatrix(F, 0, 0).setSubMatrix(B.mmul(d), 0, n).set(n, n, 1);
  const Mz = Matrix.zeros(n + 1, n + 1);
  const cross = K.transpose().mmul(R).mmul(d).mul(-1);
  Mz.setSubMatrix(toM(p.stateWeight, n, n).add(K.transpose().mmul(R).mmul(K)), 0, 0).setSubMatrix(cross, 0, n).setSubMatrix(cross.transpose(), n, 0);
  Mz.set(n, n, d.transpose().mmul(R).mmul(d).get(0, 0) + R.mmul(S).trace());
  // Row-major vec(F_zᵀ P F_z) = (F_zᵀ ⊗ F_zᵀ) vec P (Magnus & Neudecker, ch. 2, row stacking).
  const Fzt = Fz.transpose(), nz = n + 1;
  const vecP = mlSolve(Matrix.eye(nz * nz).sub(Fzt.kroneckerProduct(Fzt).mul(gamma)), Matrix.columnVector(Mz.to1DArray())).to1DArray();
  const Pz = new Matrix([...Array(nz)].map((_, i) => vecP.slice(i * nz, (i + 1) * nz)));
  const Pxx = Pz.subMatrix(0, n - 1, 0, n - 1);
  const drive = B.mmul(S).mmul(B.transpose()).add(toM(p.processNoiseCovariance, n, n));
  return {
    quadratic: Float64Array.from(Pxx.to1DArray()),
    linear: Float64Array.from(Pz.subMatrix(0, n - 1, n, n).to1DArray()),
    constant: Pz.get(n, n) + (gamma * Pxx.mmul(drive).trace()) / (1 - gamma),
  };
}

function relativeMaxError(a: ArrayLike<number>, b: ArrayLike<number>): number {
  let err = 0, size = 0;
  for (let i = 0; i < a.length; i++) { err = Math.max(err, Math.abs(a[i] - b[i])); size = Math.max(size, Math.abs(b[i])); }
  return err / size;
}
