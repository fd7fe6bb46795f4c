/**
 * The calibrated occupancy shift against an exact computation on invented linear plants.
 *
 * Reference: the candidate's discounted state–action occupancy and the logged data's feature second
 * moment from the exact Gaussian law of (x_t, u_t) at every step (closed-loop mean and covariance
 * recursion, the discrete Lyapunov recursion; Anderson & Moore, "Optimal Filtering", 1979, §2.3),
 * integrated exactly by Gauss–Hermite (Abramowitz & Stegun 25.4.46), νᵀΣ⁻¹ν solved by ml-matrix
 * (exactOccupancy.ts). Checks from the issue: within 10 %; the logged controller's own shift in
 * [0.8, 1.25] when the logs start in their own steady state; exact shift < 2 never serious, > 20
 * always serious. Algebra: ν at the constant feature is 1 and the shift is ≥ 1 (Cauchy–Schwarz),
 * and occupancy-ratio weights in the same linear class reproduce the LSTD-Q value exactly (Uehara,
 * Huang & Jiang 2020), so they are no independent check.
 */
import { Matrix, solve } from 'ml-matrix';
import { describe, expect, it } from 'vitest';
import { createActionQuadrature } from '../../../src/core/actionQuadrature';
import { episodeBellmanSums, resampleBellmanStatistics } from '../../../src/core/bootstrap/episodeBellmanSums';
import { episodeMultiplicities } from '../../../src/core/bootstrap/episodeMultiplicities';
import { meanStartFeatures, startStateFeatures } from '../../../src/core/features/policyFeatures';
import { occupancyShift, type OccupancyShift } from '../../../src/core/diagnostics/occupancyShift';
import { OCCUPANCY_SHIFT_LIMITS, occupancyShiftFinding, severityAbove } from '../../../src/core/diagnostics/severity';
import { createFeatureMap, type FeatureMap } from '../../../src/core/features/featureMap';
import { polynomialFeatureSpec } from '../../../src/core/features/polynomialFeatures';
import { fitStateActionStandardiser } from '../../../src/core/features/standardiser';
import { accumulateBellmanStatistics } from '../../../src/core/fqe/bellmanStatistics';
import { fixedPointWeights, ridgeGram } from '../../../src/core/fqe/ridgeSystem';
import { luFactor, luSolveTransposed } from '../../../src/core/linalg/dense';
import { fittedBehaviourPolicy } from '../../../src/core/offPolicy/behaviourPolicy';
import { createGaussianPolicy, type GaussianPolicy } from '../../../src/core/policy';
import { createRandom } from '../../../src/core/random';
import type { TransitionSet } from '../../../src/core/transitions';
import { simulateLog, type TestController, type TestPlant } from '../linearGaussianPlant';
import { candidateFamily, cascadeLogging, cascadePlant, rotorLogging, rotorPlant, startLaws } from '../testPlants';
import { exactDataSecondMoment, exactShift } from './exactOccupancy';

const EPISODES = 300, STEPS = 100, NODES = 10, RIDGE = 1e-6, RESAMPLES = 60;

function policyOf(c: TestController, n: number): GaussianPolicy {
  return createGaussianPolicy({ offset: c.offset, gain: [c.gain], std: c.std }, n);
}

function estimate(data: TransitionSet, features: FeatureMap, policy: GaussianPolicy, discount: number): OccupancyShift {
  const q = createActionQuadrature(policy, NODES);
  return solved(occupancyShift({
    statistics: accumulateBellmanStatistics(data, features, q), discount, ridge: RIDGE, constantIndex: features.constantIndex,
    startFeatureMean: meanStartFeatures(startStateFeatures(features, q, data.startStates, data.stateDim), features.dim),
  }));
}

function solved(result: ReturnType<typeof occupancyShift>): OccupancyShift {
  if ('failure' in result) throw new Error(result.failure);
  return result;
}

/**
 * The shift on the full data and the standard deviation of its episode-bootstrap replicates, per
 * discount: the per-episode sums do not depend on γ, so they are formed once per candidate.
 */
function shiftsWithSpread(data: TransitionSet, features: FeatureMap, policy: GaussianPolicy, discounts: number[], resamples: number): { shift: number; standardError: number }[] {
  const q = createActionQuadrature(policy, NODES), d = features.dim;
  const sums = episodeBellmanSums(data, features, q), xi = startStateFeatures(features, q, data.startStates, data.stateDim);
  const draws = [undefined, ...Array.from({ length: resamples }, (_, b) => episodeMultiplicities(data.episodeCount, 41, b))];
  const inputs = draws.map((c) => ({ statistics: resampleBellmanStatistics(sums, c ?? new Uint32Array(data.episodeCount).fill(1)), startFeatureMean: meanStartFeatures(xi, d, c) }));
  return discounts.map((discount) => {
    const [full, ...values] = inputs.map((input) => solved(occupancyShift({ ...input, discount, ridge: RIDGE, constantIndex: features.constantIndex })).shift);
    const mean = values.reduce((a, v) => a + v, 0) / resamples;
    return { shift: full, standardError: Math.sqrt(values.reduce((a, v) => a + (v - mean) ** 2, 0) / (resamples - 1)) };
  });
}

interface Case { plant: string; starts: string; discount: number; seed: number; candidate: string; exact: number; estimate: number; standardError: number }

function battery(name: string, plant: TestPlant, logging: TestController, discounts: number[], seeds: number[]): Case[] {
  const cases: Case[] = [];
  for (const [starts, start] of startLaws(plant, logging)) {
    for (const seed of seeds) {
      const data = simulateLog(plant, logging, { episodes: EPISODES, steps: STEPS, seed, start });
      const features = createFeatureMap(polynomialFeatureSpec(fitStateActionStandardiser(data).spec, 2));
      const sigma = exactDataSecondMoment({ plant, logging, start, stepsPerEpisode: STEPS, discount: discounts[0], features, candidate: logging });
      for (const [label, c] of candidateFamily(logging)) {
        // The logged controller is estimated as the product does: through the behaviour model fitted to the log.
        const policy = label === 'logged' ? fittedBehaviourPolicy(data).policy : policyOf(c, plant.n);
        const estimates = shiftsWithSpread(data, features, policy, discounts, RESAMPLES);
        discounts.forEach((discount, k) => {
          const exact = exactShift({ plant, logging, candidate: c, start, stepsPerEpisode: STEPS, discount, features }, sigma);
          cases.push({ plant: name, starts, discount, seed, candidate: label, exact, estimate: estimates[k].shift, standardError: estimates[k].standardError });
        });
      }
    }
  }
  return cases;
}

const cases = [
  ...battery('cascade (3 states)', cascadePlant, cascadeLogging, [0.9, 0.97, 0.99], [11]),
  ...battery('rotor (2 states)', rotorPlant, rotorLogging, [0.9, 0.97], [21]),
];

describe('occupancy shift on the linear battery', () => {
  it('prints the table of estimate against exact', () => {
    const rows = cases.map((c) => `${c.plant.padEnd(19)} ${c.starts.padEnd(7)} γ ${c.discount} seed ${c.seed}  ${c.candidate.padEnd(32)} exact ${c.exact.toPrecision(4).padStart(8)}  ` +
      `estimate ${c.estimate.toPrecision(4).padStart(8)} ± ${c.standardError.toPrecision(2).padStart(7)}  ${(100 * (c.estimate / c.exact - 1)).toFixed(1).padStart(6)} %`);
    console.info(rows.join('\n'));
    expect(cases.length).toBe(3 * 3 * 8 + 3 * 2 * 8);
  });

  it('is within 10 % of the exact occupancy shift for every plant, start law, discount, seed and candidate', () => {
    const worst = cases.reduce((w, c) => Math.max(w, Math.abs(c.estimate / c.exact - 1)), 0);
    console.info(`largest relative error ${(100 * worst).toFixed(1)} % over ${cases.length} cases`);
    for (const c of cases) expect(Math.abs(c.estimate / c.exact - 1), `${c.plant} ${c.starts} γ ${c.discount} ${c.candidate}`).toBeLessThan(0.1);
  });

  it('gives the logged controller (as fitted from its log) a shift in [0.8, 1.25] when the log starts in its own steady state', () => {
    const own = cases.filter((c) => c.candidate === 'logged' && c.starts === 'steady');
    expect(own.length).toBeGreaterThan(0);
    for (const c of own) {
      expect(c.estimate).toBeGreaterThanOrEqual(0.8);
      expect(c.estimate).toBeLessThanOrEqual(1.25);
    }
  });

  it('never calls an exact shift below 2 serious, and always calls one above 20 serious', () => {
    const small = cases.filter((c) => c.exact < 2), large = cases.filter((c) => c.exact > 20);
    expect(small.length).toBeGreaterThan(20);
    expect(large.length).toBeGreaterThan(10);
    for (const c of small) expect(severityAbove(c.estimate, OCCUPANCY_SHIFT_LIMITS)).not.toBe('serious');
    for (const c of large) {
      expect(severityAbove(c.estimate, OCCUPANCY_SHIFT_LIMITS)).toBe('serious');
      expect(occupancyShiftFinding(c.estimate, 1)?.message).toMatch(/above the serious limit 10/);
    }
  });
});

describe('occupancy shift: algebra and resamples', () => {
  const start = startLaws(cascadePlant, cascadeLogging)[1][1];
  const data = simulateLog(cascadePlant, cascadeLogging, { episodes: 120, steps: STEPS, seed: 5, start });
  const features = createFeatureMap(polynomialFeatureSpec(fitStateActionStandardiser(data).spec, 2));
  const policy = policyOf(candidateFamily(cascadeLogging)[5][1], 3); // offset 0.5σ
  const q = createActionQuadrature(policy, NODES);
  const stats = accumulateBellmanStatistics(data, features, q);
  const xi = startStateFeatures(features, q, data.startStates, 3), d = features.dim;

  it('has occupancy mass 1 at the constant feature and a shift of at least 1', () => {
    const r = estimate(data, features, policy, 0.97);
    expect(r.occupancyMass).toBeCloseTo(1, 10);
    expect(r.shift).toBeGreaterThanOrEqual(1);
  });

  it('gives occupancy-ratio weights in the same linear class the LSTD-Q value exactly (so they cannot confirm FQE)', () => {
    const discount = 0.97, xiBar = meanStartFeatures(xi, d);
    const r = occupancyShift({ statistics: stats, startFeatureMean: xiBar, discount, ridge: 0, constantIndex: 0 });
    if ('failure' in r) throw new Error(r.failure);
    // β = G⁻¹ν, J_weights = βᵀb/(1 − γ), solved by ml-matrix; J_LSTD = ξ̄₀ᵀw with (G − γM)w = b.
    const g = new Matrix(Array.from({ length: d }, (_, i) => Array.from(stats.gram.subarray(i * d, (i + 1) * d))));
    const beta = solve(g, Matrix.columnVector(Array.from(r.occupancyFeatures))).to1DArray();
    const weighted = beta.reduce((s, v, i) => s + v * stats.featureReward[i], 0) / (1 - discount);
    const fixed = fixedPointWeights(stats, ridgeGram(stats, 0, 0), discount);
    if ('failure' in fixed) throw new Error(fixed.failure);
    const lstd = Array.from(xiBar).reduce((s, v, i) => s + v * fixed.weights[i], 0);
    expect(Math.abs(weighted / lstd - 1)).toBeLessThan(1e-8);
  });

  it('solves the adjoint system with the same LU factors as ml-matrix does with the transpose', () => {
    const rng = createRandom(3), n = 7;
    const a = Float64Array.from({ length: n * n }, () => rng.normal()), b = Float64Array.from({ length: n }, () => rng.normal());
    const x = luSolveTransposed(luFactor(a, n), b);
    const at = new Matrix(Array.from({ length: n }, (_, i) => Array.from({ length: n }, (_, j) => a[j * n + i])));
    const reference = solve(at, Matrix.columnVector(Array.from(b))).to1DArray();
    x.forEach((v, i) => expect(v).toBeCloseTo(reference[i], 10));
  });

  it('equals a refit on the resampled episodes when formed from per-episode sums, and its bootstrap spread is reported', () => {
    const sums = episodeBellmanSums(data, features, q), values: number[] = [];
    for (let b = 0; b < 200; b++) {
      const c = episodeMultiplicities(data.episodeCount, 9, b);
      const r = occupancyShift({ statistics: resampleBellmanStatistics(sums, c), startFeatureMean: meanStartFeatures(xi, d, c), discount: 0.97, ridge: RIDGE, constantIndex: 0 });
      if ('failure' in r) throw new Error(r.failure);
      values.push(r.shift);
    }
    const full = occupancyShift({ statistics: resampleBellmanStatistics(sums, new Uint32Array(data.episodeCount).fill(1)), startFeatureMean: meanStartFeatures(xi, d), discount: 0.97, ridge: RIDGE, constantIndex: 0 });
    const direct = estimate(data, features, policy, 0.97);
    if ('failure' in full) throw new Error(full.failure);
    expect(full.shift).toBeCloseTo(direct.shift, 8);
    values.sort((x, y) => x - y);
    const exact = exactShift({ plant: cascadePlant, logging: cascadeLogging, candidate: candidateFamily(cascadeLogging)[5][1], start, stepsPerEpisode: STEPS, discount: 0.97, features });
    console.info(`offset 0.5σ, 120 episodes: exact ${exact.toFixed(2)}, estimate ${direct.shift.toFixed(2)}, bootstrap 5–95 % [${values[10].toFixed(2)}, ${values[189].toFixed(2)}]`);
    expect(exact).toBeGreaterThan(values[0]);
    expect(exact).toBeLessThan(values[199]);
  });
});
