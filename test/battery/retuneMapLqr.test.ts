/**
 * On a linear-quadratic plant the best point of a retune map must sit within one grid step of
 * the exact discounted-LQR optimum (discounted Riccati equation, src/core/lqOptimalGain.ts;
 * Bertsekas, "Dynamic Programming and Optimal Control", Vol. I, §4.1). The LQR gain minimises
 * V(x) at every state at once and dither does not move it (certainty equivalence, same section),
 * so it also minimises J over any start distribution. Plant: the invented tank-levels rig,
 * 100,000 logged transitions under its gentle logging controller; map: the two feedback gains,
 * each candidate centred on the setpoints (offset = 45 % + K·(1.2, 0.8) m), dither 1.5 %.
 * Linear FQE with quadratic features (exact for this plant), solved for all 49 points at once.
 * Here the whole grid is taken as supported; the shading by the shift measure is the pipeline's.
 */
import { describe, expect, it } from 'vitest';
import { simulateTankLevels, tankDiscount, tankPlant } from '../../sample-projects/tank-levels/simulate';
import { createFeatureMap } from '../../src/core/features/featureMap';
import { polynomialFeatureSpec } from '../../src/core/features/polynomialFeatures';
import { fitStateActionStandardiser } from '../../src/core/features/standardiser';
import { discountedLqrGain } from '../../src/core/lqOptimalGain';
import { createGaussianPolicy } from '../../src/core/policy';
import { gridPoints } from '../../src/core/retune/retuneAxes';
import { retuneGrid } from '../../src/core/retune/retuneGrid';
import { tankLogTransitions } from '../core/fqe/simulatedTransitions';

describe('retune map on a linear-quadratic plant', () => {
  it('puts its best point within one grid step of the discounted-LQR gain', () => {
    const log = simulateTankLevels({ runs: 200, stepsPerRun: 501, seed: 20_417 });
    const data = tankLogTransitions(log.rows, log.rowCount);
    const features = createFeatureMap(polynomialFeatureSpec(fitStateActionStandardiser(data).spec, 2));
    const optimum = discountedLqrGain(tankPlant, tankDiscount).gain; // u = −K x, K ≈ (74.8, 70.9) %/m
    const step = 10, axes = [{ from: 45, to: 105, count: 7, spacing: 'linear' as const }, { from: 41, to: 101, count: 7, spacing: 'linear' as const }];
    const points = gridPoints(axes);
    const policies = points.map(([k1, k2]) => createGaussianPolicy({ offset: [45 + 1.2 * k1 + 0.8 * k2], gain: [[-k1, -k2]], std: [1.5] }, 2));
    const map = retuneGrid({ data, features, policies, discount: tankDiscount, ridge: 0, quadratureNodes: 10, tolerance: 1e-12, maxIterations: 5000 });
    expect(map.points.every((p) => p.route === 'closedForm' && p.status === 'converged')).toBe(true);
    const best = map.points.reduce((a, b) => (b.policyValue! > a.policyValue! ? b : a));
    const [k1, k2] = points[best.index];
    console.log(`retune map on the tank: best point K = (${k1}, ${k2}) %/m, J = ${(-best.policyValue!).toFixed(4)}; discounted LQR K = (${optimum[0].toFixed(2)}, ${optimum[1].toFixed(2)}) %/m`);
    expect(Math.abs(k1 - optimum[0])).toBeLessThanOrEqual(step);
    expect(Math.abs(k2 - optimum[1])).toBeLessThanOrEqual(step);
  });
});
