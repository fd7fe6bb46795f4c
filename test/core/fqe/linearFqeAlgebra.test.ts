/**
 * The one-pass statistics, FQE steps, fixed point and Bellman residual against an explicit
 * construction: Φ and Ψ are built row by row here and the least-squares problems are solved by
 * ml-matrix (an independent general-purpose library): Householder QR on the augmented ridge
 * system, and LU for the fixed point.
 */
import { Matrix, QrDecomposition, solve } from 'ml-matrix';
import { describe, expect, it } from 'vitest';
import { quadratureNodesAt } from '../../../src/core/actionQuadrature';
import { createFeatureMap, type FeatureMap } from '../../../src/core/features/featureMap';
import { polynomialFeatureSpec } from '../../../src/core/features/polynomialFeatures';
import { fitStateActionStandardiser } from '../../../src/core/features/standardiser';
import { fitLinearFqe, type LinearFqeInput } from '../../../src/core/fqe/linearFqe';
import { createGaussianPolicy, type GaussianPolicy } from '../../../src/core/policy';
import type { TransitionSet } from '../../../src/core/transitions';
import { simulateLinearPlant } from './simulatedTransitions';

const NODES = 5, DISCOUNT = 0.9, RIDGE = 1e-3;

function smallProblem(): { data: TransitionSet; policy: GaussianPolicy; features: FeatureMap } {
  const data = simulateLinearPlant({
    dynamics: [0.9, 0.1, -0.05, 0.8], inputGain: [0.5, 0.2], processNoiseStd: [0.1, 0.05],
    stateWeight: [1, 0, 0, 2], actionWeight: [0.3], behaviourGain: [-0.4, -0.1], behaviourStd: [0.6],
    startStd: 1, episodes: 6, stepsPerEpisode: 50, seed: 7,
  });
  for (let i = 49; i < data.count; i += 50) data.terminal[i] = 1; // some episodes end in a terminal state
  const policy = createGaussianPolicy({ offset: [0.1], gain: [[-0.6, -0.3]], std: [0.4] }, 2);
  const features = createFeatureMap(polynomialFeatureSpec(fitStateActionStandardiser(data).spec, 2));
  return { data, policy, features };
}

/** Φ (n×d) and Ψ (n×d, Ψ_i = (1 − done_i) Σ_j w_j φ(s'_i, a_j)) formed explicitly. */
function explicitMatrices(data: TransitionSet, policy: GaussianPolicy, features: FeatureMap): { phi: Matrix; psi: Matrix } {
  const d = features.dim, phi: number[][] = [], psi: number[][] = [], out = new Float64Array(d);
  for (let i = 0; i < data.count; i++) {
    features.evaluate([data.states[2 * i], data.states[2 * i + 1], data.actions[i]], 0, out, 0);
    phi.push(Array.from(out));
    const next = new Array<number>(d).fill(0);
    if (!data.terminal[i]) {
      const s = [data.nextStates[2 * i], data.nextStates[2 * i + 1]];
      const rule = quadratureNodesAt(policy, s, NODES);
      for (let j = 0; j < rule.count; j++) {
        features.evaluate([s[0], s[1], rule.points[j]], 0, out, 0);
        for (let a = 0; a < d; a++) next[a] += rule.weights[j] * out[a];
      }
    }
    psi.push(next);
  }
  return { phi: new Matrix(phi), psi: new Matrix(psi) };
}

/** Ridge least squares as one QR solve of [Φ/√n; √λ·D] w = [y/√n; 0], D = I without the constant (index 0). */
function ridgeByQr(phi: Matrix, y: number[]): number[] {
  const n = phi.rows, d = phi.columns;
  const rows = phi.to2DArray().map((r, i) => [...r.map((v) => v / Math.sqrt(n)), y[i] / Math.sqrt(n)]);
  for (let j = 1; j < d; j++) rows.push(Array.from({ length: d + 1 }, (_, k) => (k === j ? Math.sqrt(RIDGE) : 0)));
  const aug = new Matrix(rows);
  const a = aug.subMatrix(0, aug.rows - 1, 0, d - 1), b = aug.subMatrix(0, aug.rows - 1, d, d);
  return new QrDecomposition(a).solve(b).getColumn(0);
}

function relativeDifference(a: ArrayLike<number>, b: ArrayLike<number>): number {
  let num = 0, den = 0;
  for (let i = 0; i < a.length; i++) {
    num += (a[i] - b[i]) ** 2;
    den += b[i] ** 2;
  }
  return Math.sqrt(num / den);
}

function fqeInput(problem: ReturnType<typeof smallProblem>, maxIterations: number): LinearFqeInput {
  return { ...problem, discount: DISCOUNT, ridge: RIDGE, quadratureNodes: NODES, tolerance: 1e-14, maxIterations };
}

describe('linear FQE algebra against ml-matrix', () => {
  const problem = smallProblem();
  const { phi, psi } = explicitMatrices(problem.data, problem.policy, problem.features);
  const r = Array.from(problem.data.rewards), n = problem.data.count;

  it('accumulates G = ΦᵀΦ/n and M = ΦᵀΨ/n', () => {
    const stats = fitLinearFqe(fqeInput(problem, 1)).statistics;
    expect(relativeDifference(stats.gram, phi.transpose().mmul(phi).div(n).to1DArray())).toBeLessThan(1e-12);
    expect(relativeDifference(stats.crossNext, phi.transpose().mmul(psi).div(n).to1DArray())).toBeLessThan(1e-12);
    expect(relativeDifference(stats.nextGram, psi.transpose().mmul(psi).div(n).to1DArray())).toBeLessThan(1e-12);
  });

  it('takes the same first two FQE steps as QR ridge least squares', () => {
    const w1 = ridgeByQr(phi, r); // w_0 = 0: regress the reward
    const y2 = psi.mmul(Matrix.columnVector(w1)).getColumn(0).map((v, i) => r[i] + DISCOUNT * v);
    const w2 = ridgeByQr(phi, y2);
    const one = fitLinearFqe(fqeInput(problem, 1)), two = fitLinearFqe(fqeInput(problem, 2));
    expect(one.status).toBe('maxIterations');
    expect(relativeDifference(one.iterative!.q.weights, w1)).toBeLessThan(1e-10);
    expect(relativeDifference(two.iterative!.q.weights, w2)).toBeLessThan(1e-10);
  });

  it('solves the LSTD-Q fixed point (G + λD − γM)w = b like ml-matrix LU, with the same Bellman residual', () => {
    const g = phi.transpose().mmul(phi).div(n), m = phi.transpose().mmul(psi).div(n);
    const lhs = g.clone().sub(m.clone().mul(DISCOUNT));
    for (let j = 1; j < g.rows; j++) lhs.set(j, j, lhs.get(j, j) + RIDGE);
    const b = phi.transpose().mmul(Matrix.columnVector(r)).div(n);
    const w = solve(lhs, b).getColumn(0);
    const fit = fitLinearFqe(fqeInput(problem, 3));
    expect(relativeDifference(fit.fixedPoint!.q.weights, w)).toBeLessThan(1e-10);
    // Mean squared TD error computed row by row from Φ and Ψ (definition; common practice).
    const fitted = phi.mmul(Matrix.columnVector(w)).getColumn(0), next = psi.mmul(Matrix.columnVector(w)).getColumn(0);
    const msTd = r.reduce((s, ri, i) => s + (ri + DISCOUNT * next[i] - fitted[i]) ** 2, 0) / n;
    expect(fit.fixedPoint!.bellmanResidual).toBeCloseTo(msTd, 10);
    expect(Math.abs(fit.fixedPoint!.bellmanResidual - msTd) / msTd).toBeLessThan(1e-9);
  });
});
