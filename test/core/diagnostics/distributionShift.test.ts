/**
 * The distribution-shift statistic νᵀΣ⁻¹ν (Duan, Jia & Wang 2020): exactly 1 when ν is the data's
 * own mean feature vector and a constant feature is present (ν is then Σ's constant column, so
 * νᵀΣ⁻¹ν = e_cᵀΣe_c = 1); equal to a solve by ml-matrix (an independent library); and, on the
 * tank plant, growing monotonically as the candidate's gain moves away from the logged gain.
 */
import { Matrix, solve } from 'ml-matrix';
import { describe, expect, it } from 'vitest';
import { simulateTankLevels, tankBehaviourPolicy } from '../../../sample-projects/tank-levels/simulate';
import { createActionQuadrature } from '../../../src/core/actionQuadrature';
import { meanStartFeatures, startStateFeatures } from '../../../src/core/features/policyFeatures';
import { distributionShift, nextStateFeatureMean } from '../../../src/core/diagnostics/distributionShift';
import { createFeatureMap } from '../../../src/core/features/featureMap';
import { polynomialFeatureSpec } from '../../../src/core/features/polynomialFeatures';
import { fitStateActionStandardiser } from '../../../src/core/features/standardiser';
import { accumulateBellmanStatistics } from '../../../src/core/fqe/bellmanStatistics';
import { ridgeGram, ridgeGramFactor } from '../../../src/core/fqe/ridgeSystem';
import { createGaussianPolicy } from '../../../src/core/policy';
import { tankLogTransitions } from '../fqe/simulatedTransitions';

const log = simulateTankLevels({ runs: 40, stepsPerRun: 251, seed: 5 });
const data = tankLogTransitions(log.rows, log.rowCount);
const features = createFeatureMap(polynomialFeatureSpec(fitStateActionStandardiser(data).spec, 2));
const d = features.dim;

function shiftFor(gain: number[], std: number): { start: number; next: number } {
  // Centred on the setpoints (valve 45 % at 1.2 m and 0.8 m).
  const policy = createGaussianPolicy({ offset: [45 - gain[0] * 1.2 - gain[1] * 0.8], gain: [gain], std: [std] }, 2);
  const quadrature = createActionQuadrature(policy, 10);
  const stats = accumulateBellmanStatistics(data, features, quadrature);
  const factor = ridgeGramFactor(ridgeGram(stats, 0, features.constantIndex), d, 0);
  return {
    start: distributionShift(meanStartFeatures(startStateFeatures(features, quadrature, data.startStates, 2), d), factor, d),
    next: distributionShift(nextStateFeatureMean(stats, features.constantIndex)!, factor, d),
  };
}

describe('distributionShift', () => {
  it('is exactly 1 for the data’s own mean features, and equals an ml-matrix solve', () => {
    const stats = accumulateBellmanStatistics(data, features, createActionQuadrature(createGaussianPolicy(tankBehaviourPolicy, 2), 10));
    const ownMean = stats.gram.slice(0, d); // row of the constant feature: E_data[φ]
    const factor = ridgeGramFactor(ridgeGram(stats, 0, features.constantIndex), d, 0);
    expect(distributionShift(ownMean, factor, d)).toBeCloseTo(1, 8);
    const nu = nextStateFeatureMean(stats, features.constantIndex)!;
    const sigma = new Matrix(Array.from({ length: d }, (_, i) => Array.from(stats.gram.subarray(i * d, (i + 1) * d))));
    const x = solve(sigma, Matrix.columnVector(Array.from(nu)));
    const reference = Array.from(nu).reduce((s, v, i) => s + v * x.get(i, 0), 0);
    expect(distributionShift(nu, factor, d)).toBeCloseTo(reference, 6);
  });

  it('grows monotonically as the candidate’s gain moves away from the logged gain (30, 20) %/m', () => {
    const sweep = [0, 0.25, 0.5, 1, 1.5, 2, 3].map((t) => shiftFor([-30 - 30 * t, -20 - 70 * t], 4));
    for (let i = 1; i < sweep.length; i++) {
      expect(sweep[i].next).toBeGreaterThan(sweep[i - 1].next);
      expect(sweep[i].start).toBeGreaterThan(sweep[i - 1].start);
    }
    expect(sweep[0].next).toBeCloseTo(1, 1); // the logged controller itself: no shift beyond sampling
  });
});
