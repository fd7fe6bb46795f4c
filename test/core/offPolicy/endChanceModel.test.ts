/**
 * The end-chance model (endChanceModel.ts): logistic regression by Newton's method.
 * - With one binary input x, logit P(end) = β₀ + β₁x is saturated, and the maximum-likelihood fit is
 *   the observed log-odds of each group: β₀ = logit(k₀/n₀), β₁ = logit(k₁/n₁) − logit(k₀/n₀)
 *   (the saturated logit model; e.g. Agresti, "Categorical Data Analysis", 3rd ed., §5.1; quoted from
 *   memory, and it is the score equations solved by hand). The ridge moves it by less than 1e-4 here.
 * - Multiplicities equal copying runs (the bootstrap's definition).
 * - Ends that the state separates exactly (a threshold) give finite weights and a chance near 0 and 1
 *   on either side, not a failure.
 */
import { describe, expect, it } from 'vitest';
import { indexEpisodes } from '../../../src/core/bootstrap/episodeTransitions';
import { createPolynomialFeatures, polynomialFeatureSpec } from '../../../src/core/features/polynomialFeatures';
import { endChance, endChanceData, fitEndChance } from '../../../src/core/offPolicy/endChanceModel';
import { createRandom } from '../../../src/core/random';
import type { TransitionSet } from '../../../src/core/transitions';

/** One transition per row, state x, action 0; run k holds rows of `runOf`; the row ends its run where `ended` is 1. */
function log(x: number[], ended: number[], runOf: number[]): TransitionSet {
  const n = x.length, runs = Math.max(...runOf) + 1;
  return {
    count: n, stateDim: 1, actionDim: 1, stateNames: ['x'], actionNames: ['u'], states: Float64Array.from(x), nextStates: Float64Array.from(x),
    actions: new Float64Array(n), rewards: new Float64Array(n), terminal: Uint8Array.from(ended), episode: Int32Array.from(runOf), episodeCount: runs,
    startStates: new Float64Array(runs), sourceLine: Int32Array.from({ length: n }, (_, i) => i + 2),
  };
}

/** Features 1, x, u of (x, u) unscaled (degree 1); u is 0 throughout, so only the ridge acts on its weight. */
const linearInX = createPolynomialFeatures(polynomialFeatureSpec({ mean: [0, 0], scale: [1, 1] }, 1));
const logit = (p: number) => Math.log(p / (1 - p));

describe('the chance that a step ends its run', () => {
  it('fits the observed log-odds of each group for one binary input', () => {
    // Group x = 0: 30 of 200 rows end; group x = 1: 90 of 150 end. Each row is its own run.
    const x = [...Array(200).fill(0), ...Array(150).fill(1)];
    const ended = [...Array(200).fill(0).map((_, i) => (i < 30 ? 1 : 0)), ...Array(150).fill(0).map((_, i) => (i < 90 ? 1 : 0))];
    const data = log(x, ended, x.map((_, i) => i)), source = endChanceData(data, indexEpisodes(data), linearInX)!;
    const fit = fitEndChance(source);
    expect(fit.weights[0]).toBeCloseTo(logit(30 / 200), 3);
    expect(fit.weights[1]).toBeCloseTo(logit(90 / 150) - logit(30 / 200), 3);
    expect(endChance(fit, [1, 1, 0])).toBeCloseTo(0.6, 4);
  });

  it('gives with multiplicities what it gives on the runs copied out', () => {
    const x = Array.from({ length: 120 }, (_, i) => (i % 7) / 3), ended = x.map((v, i) => ((i * 13) % 5 === 0 || v > 1.9 ? 1 : 0)), runOf = x.map((_, i) => Math.floor(i / 4));
    const data = log(x, ended, runOf), c = Array.from({ length: 30 }, (_, k) => k % 3);
    const keep = runOf.flatMap((k, i) => Array(c[k]).fill(i) as number[]);
    const copied = log(keep.map((i) => x[i]), keep.map((i) => ended[i]), keep.map((i, j) => j)); // each copy a run of its own: the fit does not see runs
    const a = fitEndChance(endChanceData(data, indexEpisodes(data), linearInX)!, c);
    const b = fitEndChance(endChanceData(copied, indexEpisodes(copied), linearInX)!);
    a.weights.forEach((w, j) => expect(w).toBeCloseTo(b.weights[j], 6)); // both converged to 1e-9 of their size, by different sums
  });

  it('stays finite where a threshold in the state separates the ends exactly, with chances near 0 and 1 either side', () => {
    const x = Array.from({ length: 400 }, (_, i) => i / 100), ended = x.map((v) => (v >= 2.5 ? 1 : 0));
    const data = log(x, ended, x.map((_, i) => i)), fit = fitEndChance(endChanceData(data, indexEpisodes(data), linearInX)!);
    expect(fit.weights.every(Number.isFinite)).toBe(true);
    expect(endChance(fit, [1, 2.0, 0])).toBeLessThan(0.01);
    expect(endChance(fit, [1, 3.0, 0])).toBeGreaterThan(0.99);
  });

  it('has no model where no row ends its run', () => {
    const data = log([0, 1, 2], [0, 0, 0], [0, 0, 0]);
    expect(endChanceData(data, indexEpisodes(data), linearInX)).toBeNull();
  });
});

describe('the end-chance model on a log longer than its row budget', () => {
  it('regresses a weighted subsample that keeps every end and gives the full fit’s chances', () => {
    // 60,000 rows, end chance σ(x − 5) for x spread evenly over [0, 3) (about 4 % end): a budget of 6,000 rows keeps every end
    // and a stride of the rest, weighted by rows had ÷ rows kept (case-control sampling with weights; King & Zeng 2001).
    const n = 60_000, x = Array.from({ length: n }, (_, i) => (3 * ((i * 7919) % n)) / n);
    const rng = createRandom(3), ended = x.map((v) => (rng.uniform() < 1 / (1 + Math.exp(5 - v)) ? 1 : 0));
    const data = log(x, ended, x.map((_, i) => Math.floor(i / 10)));
    const ends = ended.reduce<number>((s, e) => s + e, 0);
    expect(ends).toBeLessThan(3_000);
    const full = endChanceData(data, indexEpisodes(data), linearInX)!, small = endChanceData(data, indexEpisodes(data), linearInX, 6_000)!;
    expect(small.ended.length).toBeLessThanOrEqual(6_000);
    expect(small.ended.reduce((s, e) => s + e, 0)).toBe(ends);
    const total = small.rowWeight.reduce((s, w) => s + w, 0);
    expect(total).toBeCloseTo(n, 6);
    const a = fitEndChance(full), b = fitEndChance(small);
    for (const v of [0, 1.5, 2.9]) expect(endChance(b, [1, v, 0])).toBeCloseTo(endChance(a, [1, v, 0]), 2);
  });
});
