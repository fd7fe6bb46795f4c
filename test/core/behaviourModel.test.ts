/**
 * The behaviour model is ordinary least squares of actions on [1, s] with the dof-corrected
 * residual covariance. Checked against ml-matrix (an independent least-squares solve), and on
 * simulated logs with a known controller against the sampling distribution of OLS (Greene,
 * "Econometric Analysis", 7th ed., §4.3: Var(b | X) = σ²(XᵀX)⁻¹; §4.7: E[s²] = σ²).
 */
import { describe, expect, it } from 'vitest';
import { inverse, Matrix, solve as mlSolve } from 'ml-matrix';
import { BehaviourModelError, fitBehaviourModel, meanActionAtMeanState } from '../../src/core/behaviourModel';
import { createGaussianPolicy } from '../../src/core/policy';
import { createRandom } from '../../src/core/random';

const TRUE_OFFSET = [1, -0.5];
const TRUE_GAIN = [[0.8, -0.3], [0.2, 0.5]];
const TRUE_COV = [[0.04, 0.012], [0.012, 0.09]];
const STATE_MEAN = [350, 2]; // a temperature in K and a level in m: far from zero on purpose
const STATE_STD = [2, 0.5];

/** A logged controller a = c + G s + e with correlated noise e ~ N(0, Σ) (Σ = L Lᵀ). */
function simulateLog(n: number, seed: number) {
  const rng = createRandom(seed);
  const l11 = Math.sqrt(TRUE_COV[0][0]), l21 = TRUE_COV[1][0] / l11, l22 = Math.sqrt(TRUE_COV[1][1] - l21 * l21);
  const states = new Float64Array(n * 2), actions = new Float64Array(n * 2);
  for (let i = 0; i < n; i++) {
    const s = [STATE_MEAN[0] + STATE_STD[0] * rng.normal(), STATE_MEAN[1] + STATE_STD[1] * rng.normal()];
    const z1 = rng.normal(), z2 = rng.normal();
    const e = [l11 * z1, l21 * z1 + l22 * z2];
    states.set(s, 2 * i);
    for (let j = 0; j < 2; j++) actions[2 * i + j] = TRUE_OFFSET[j] + TRUE_GAIN[j][0] * s[0] + TRUE_GAIN[j][1] * s[1] + e[j];
  }
  return { states, actions };
}

function designMatrix(states: Float64Array, n: number): Matrix {
  return new Matrix(Array.from({ length: n }, (_, i) => [1, states[2 * i], states[2 * i + 1]]));
}

describe('fitBehaviourModel', () => {
  const n = 4000;
  const { states, actions } = simulateLog(n, 20240301);
  const model = fitBehaviourModel(states, actions, n, 2, 2);
  const X = designMatrix(states, n);
  const A = new Matrix(Array.from({ length: n }, (_, i) => [actions[2 * i], actions[2 * i + 1]]));

  it('agrees with an independent least-squares solve by ml-matrix (coefficients, Σ, R²)', () => {
    const beta = mlSolve(X, A); // 3×2, QR least squares
    for (let j = 0; j < 2; j++) {
      expect(model.offset[j]).toBeCloseTo(beta.get(0, j), 8);
      for (let p = 0; p < 2; p++) expect(model.gain[j][p]).toBeCloseTo(beta.get(p + 1, j), 9);
    }
    const E = A.clone().sub(X.mmul(beta));
    const sigma = E.transpose().mmul(E).div(n - 3); // dof correction: n − k, k = 3 regressors
    for (let j = 0; j < 2; j++) for (let q = 0; q < 2; q++) expect(model.covariance[j][q]).toBeCloseTo(sigma.get(j, q), 10);
    for (let j = 0; j < 2; j++) {
      const column = A.getColumn(j), mean = column.reduce((a, b) => a + b, 0) / n;
      const total = column.reduce((a, b) => a + (b - mean) ** 2, 0);
      const residual = E.getColumn(j).reduce((a, b) => a + b * b, 0);
      expect(model.rSquared[j]).toBeCloseTo(1 - residual / total, 10);
      expect(model.std[j]).toBeCloseTo(Math.sqrt(sigma.get(j, j)), 12);
    }
    expect(model.degreesOfFreedom).toBe(n - 3);
  });

  it('recovers the known gain and offset within 4 standard errors of OLS (Greene §4.3)', () => {
    const xtxInverse = inverse(X.transpose().mmul(X));
    for (let j = 0; j < 2; j++) {
      const se = (k: number): number => Math.sqrt(TRUE_COV[j][j] * xtxInverse.get(k, k));
      expect(Math.abs(model.offset[j] - TRUE_OFFSET[j])).toBeLessThan(4 * se(0));
      for (let p = 0; p < 2; p++) expect(Math.abs(model.gain[j][p] - TRUE_GAIN[j][p])).toBeLessThan(4 * se(p + 1));
      // Reported standard errors use σ̂ in place of σ: equal to within the relative error of σ̂,
      // about 1/√(2·dof) ≈ 1.1% here; 5% is over four of those.
      expect(model.offsetStandardError[j] / se(0)).toBeCloseTo(1, 1);
      for (let p = 0; p < 2; p++) expect(Math.abs(model.gainStandardError[j][p] / se(p + 1) - 1)).toBeLessThan(0.05);
    }
  });

  it('recovers the noise covariance within 4 standard errors of the Wishart estimate', () => {
    // Residual covariance ~ Wishart(Σ, dof)/dof: Var(S_jq) = (Σ_jq² + Σ_jj Σ_qq)/dof
    // (Anderson, "An Introduction to Multivariate Statistical Analysis", 3rd ed., §7.2).
    const dof = n - 3;
    for (let j = 0; j < 2; j++) {
      for (let q = 0; q < 2; q++) {
        const sd = Math.sqrt((TRUE_COV[j][q] ** 2 + TRUE_COV[j][j] * TRUE_COV[q][q]) / dof);
        expect(Math.abs(model.covariance[j][q] - TRUE_COV[j][q])).toBeLessThan(4 * sd);
      }
    }
  });

  it('is a valid GaussianPolicySpec for the same states', () => {
    const policy = createGaussianPolicy({ offset: model.offset, gain: model.gain, covariance: model.covariance }, 2);
    expect(policy.actionDim).toBe(2);
    expect(policy.independent).toBe(false);
    createGaussianPolicy({ offset: model.offset, gain: model.gain, std: model.std }, 2);
  });

  it('one action, one state: slope and residual variance match the textbook closed form', () => {
    // Simple regression (Greene §3.2): b = Sxy/Sxx, s² = Σe²/(n − 2). Data: y = 2x + noise on 5 points.
    const x = Float64Array.from([1, 2, 3, 4, 5]), y = Float64Array.from([2.1, 3.9, 6.2, 7.8, 10.1]);
    const fit = fitBehaviourModel(x, y, 5, 1, 1);
    const sxy = (1 - 3) * (2.1 - 6.02) + (2 - 3) * (3.9 - 6.02) + (4 - 3) * (7.8 - 6.02) + (5 - 3) * (10.1 - 6.02);
    expect(fit.gain[0][0]).toBeCloseTo(sxy / 10, 12);
    expect(fit.offset[0]).toBeCloseTo(6.02 - (sxy / 10) * 3, 12);
    const residuals = [...x].map((xi, i) => y[i] - fit.offset[0] - fit.gain[0][0] * xi);
    expect(fit.covariance[0][0]).toBeCloseTo(residuals.reduce((a, e) => a + e * e, 0) / 3, 12);
    expect(fit.gainStandardError[0][0]).toBeCloseTo(Math.sqrt(fit.covariance[0][0] / 10), 12);
  });

  it('refuses logs it cannot fit, naming the reason', () => {
    const flat = Float64Array.from([1, 1, 1, 1]), a = Float64Array.from([0, 1, 2, 4]);
    expect(() => fitBehaviourModel(flat, a, 4, 1, 1)).toThrow(new BehaviourModelError('state 1 is constant in the log, so its gain cannot be estimated'));
    expect(() => fitBehaviourModel(Float64Array.from([1, 2]), Float64Array.from([1, 2]), 2, 1, 1)).toThrow(/needs at least 3 transitions, got 2/);
    const s = Float64Array.from([1, 2, 3, 4]);
    expect(() => fitBehaviourModel(s, Float64Array.from([5, 5, 5, 5]), 4, 1, 1)).toThrow(/action 1 is constant/);
    expect(() => fitBehaviourModel(s, Float64Array.from([2, 4, 6, 8]), 4, 1, 1)).toThrow(/follows the states exactly/);
    const collinear = Float64Array.from([1, 2, 2, 4, 3, 6, 4, 8]);
    expect(() => fitBehaviourModel(collinear, a, 4, 2, 1)).toThrow(/state 2 is \(almost\) a linear combination/);
    const nearly = Float64Array.from([1, 0.1, 2, 0.2, 3, 0.3 + 1e-15, 4, 0.4]);
    expect(() => fitBehaviourModel(nearly, a, 4, 2, 1)).toThrow(BehaviourModelError);
  });
});

describe('meanActionAtMeanState', () => {
  it('is the mean logged action for an unclipped least-squares fit: least squares with an intercept passes through the means (common practice; Greene, "Econometric Analysis", ch. 3, from memory)', () => {
    const n = 4000, { states, actions } = simulateLog(n, 7);
    const model = fitBehaviourModel(states, actions, n, 2, 2);
    const centre = meanActionAtMeanState(model);
    expect(model.stateMean[0]).toBeCloseTo(Array.from({ length: n }, (_, i) => states[2 * i]).reduce((a, b) => a + b) / n, 9);
    for (let j = 0; j < 2; j++) {
      let mean = 0;
      for (let i = 0; i < n; i++) mean += actions[2 * i + j] / n;
      expect(centre[j]).toBeCloseTo(mean, 9);
    }
    // The offset alone is the mean at s = 0, far from where these logs sit (a temperature near 350 K).
    expect(Math.abs(model.offset[0] - centre[0])).toBeGreaterThan(100);
  });

  it('with a clipped log it is the law before the clip, where the mean logged action is pulled below it', () => {
    // a = 50 + 10·(s − 2) + N(0, 5²), s ~ N(2, 1), clipped at 55: at s̄ = 2 the law's mean is 50, while the mean logged
    // action is 50 − σ·(φ(z) − z·(1 − Φ(z))) ≈ 47.6 with σ = √(10² + 5²), z = 5/σ (the mean of a normal capped above; common practice).
    const n = 20_000, rng = createRandom(11), states = new Float64Array(n), actions = new Float64Array(n);
    for (let i = 0; i < n; i++) {
      states[i] = 2 + rng.normal();
      actions[i] = Math.min(55, 50 + 10 * (states[i] - 2) + 5 * rng.normal());
    }
    const model = fitBehaviourModel(states, actions, n, 1, 1);
    expect(model.bounds?.hi).toEqual([55]);
    const centre = meanActionAtMeanState(model)[0], logged = actions.reduce((a, b) => a + b) / n;
    expect(Math.abs(centre - 50)).toBeLessThan(0.3);
    expect(logged).toBeLessThan(48.5);
  });
});

describe('fitBehaviourModel on the rows not held (the held-actions repair)', () => {
  // A log with two laws, both known in closed form (OLS slope S_sa/S_ss and intercept ā − β s̄; Seber & Lee,
  // "Linear Regression Analysis", 2nd ed., 2003, §3.1, from memory). Moving rows: a = 0.3·s + e, s ∈ {±1, ±2} twice
  // each, e = ±0.1 once each per state (Σe = Σs·e = 0), so their law is 0.3·s exactly, σ² = 8·0.01/6. Then 0.4 held
  // for three rows at s = 3 (an operator's valve): every row's law is the pooled one, a law that never ran.
  const rows: [number, number][] = [[-2, -0.5], [-1, -0.2], [1, 0.2], [2, 0.7], [-2, -0.7], [-1, -0.4], [2, 0.5], [1, 0.4], [3, 0.4], [3, 0.4], [3, 0.4]];
  const states = Float64Array.from(rows.map((r) => r[0])), actions = Float64Array.from(rows.map((r) => r[1])), n = rows.length;
  const moving = Uint8Array.from(rows.map((_, i) => (i < 8 ? 1 : 0)));

  it('recovers the law the other rows follow, while the fit on every row gives the pooled law', () => {
    const repaired = fitBehaviourModel(states, actions, n, 1, 1, undefined, moving);
    expect(repaired.count).toBe(8);
    expect(repaired.gain[0][0]).toBeCloseTo(0.3, 12);
    expect(repaired.offset[0]).toBeCloseTo(0, 12);
    expect(repaired.std[0]).toBeCloseTo(Math.sqrt(0.08 / 6), 12);
    const pooled = fitBehaviourModel(states, actions, n, 1, 1);
    const sss = 47 - 81 / 11, ssa = 9.6 - (9 * 1.2) / 11; // Σs = 9, Σs² = 47, Σa = 1.2, Σs·a = 9.6 over all 11 rows
    expect(pooled.gain[0][0]).toBeCloseTo(ssa / sss, 12);
    expect(pooled.offset[0]).toBeCloseTo(1.2 / 11 - (ssa / sss) * (9 / 11), 12);
  });

  it('every row marked moving: the same model as without a mask, bit for bit', () => {
    expect(fitBehaviourModel(states, actions, n, 1, 1, undefined, new Uint8Array(n).fill(1))).toEqual(fitBehaviourModel(states, actions, n, 1, 1));
  });

  it('the limits are read on every row, and the clipped fit runs on the rows not held', () => {
    // A valve at its stop 1 on 30 rows of 200 (read as a limit), and a held stretch of 20 rows mid-range.
    const m = 200, random = createRandom(5), s = new Float64Array(m), a = new Float64Array(m);
    for (let i = 0; i < m; i++) {
      s[i] = 2 * random.normal();
      a[i] = Math.min(1, 0.5 + 0.3 * s[i] + 0.05 * random.normal());
    }
    for (let i = 100; i < 120; i++) a[i] = 0.42;
    const keep = Uint8Array.from(a, (_, i) => (i >= 100 && i < 120 ? 0 : 1));
    const model = fitBehaviourModel(s, a, m, 1, 1, undefined, keep);
    expect(model.count).toBe(180);
    expect(model.limits).toEqual(fitBehaviourModel(s, a, m, 1, 1).limits);
    expect(model.bounds?.hi).toEqual([1]);
    expect(model.gain[0][0]).toBeCloseTo(0.3, 1);
  });
});
