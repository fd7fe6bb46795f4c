/**
 * The discounted-LQR optimum (src/core/lqOptimalGain.ts) against three outside references:
 * the scalar Riccati equation solved as a quadratic by hand; scipy.linalg.solve_discrete_are, an
 * independent general-purpose library, on √γ-scaled A and B (values from
 * test/core/reference/discountedLqr.py, copied to 17 digits); and the defining property that no
 * nearby gain does better, judged by the closed-form policy evaluation (src/core/lq.ts).
 */
import { describe, expect, it } from 'vitest';
import { discountedLqrGain } from '../../src/core/lqOptimalGain';
import { feedbackCostToGo, type LinearQuadraticPlant } from '../../src/core/lq';

const f64 = (v: number[]) => Float64Array.from(v);
const plant = (a: number[], b: number[], q: number[], r: number[], n: number, m: number): LinearQuadraticPlant => ({
  stateDim: n, actionDim: m, dynamics: f64(a), inputGain: f64(b), processNoiseCovariance: new Float64Array(n * n), stateWeight: f64(q), actionWeight: f64(r),
});

const TANK = plant([0.92, 0, 0.06, 0.95], [0.004, 0], [100, 0, 0, 400], [0.01], 2, 1);
const THREE = plant([1.02, 0.1, 0, 0, 0.95, 0.2, 0.05, 0, 0.9], [0.5, 0, 0, 0.3, 0.1, 0.4], [2, 0, 0, 0, 1, 0, 0, 0, 0.5], [0.3, 0.05, 0.05, 0.2], 3, 2);

describe('discounted LQR gain', () => {
  it('solves the scalar Riccati equation γb²p² + (r − γb²q − γa²r)p − qr = 0', () => {
    const [a, b, q, r, g] = [1.1, 0.5, 2, 0.7, 0.9];
    const c = r - g * b * b * q - g * a * a * r;
    const p = (-c + Math.sqrt(c * c + 4 * g * b * b * q * r)) / (2 * g * b * b);
    const k = (g * b * p * a) / (r + g * b * b * p);
    const solution = discountedLqrGain(plant([a], [b], [q], [r], 1, 1), g);
    expect(solution.costToGo[0]).toBeCloseTo(p, 12);
    expect(solution.gain[0]).toBeCloseTo(k, 12);
  });

  it.each([
    ['tank', TANK, 0.95, [74.84114615829014, 70.85930359114084]],
    ['three-state, two-action', THREE, 0.97, [1.434609514378937, 0.10168180228706974, 0.011272003419571859, -0.1477418337967192, 1.1810976625620944, 0.7889926544443097]],
  ] as [string, LinearQuadraticPlant, number, number[]][])('agrees with scipy on the %s plant', (_, p, g, reference) => {
    const { gain } = discountedLqrGain(p, g);
    reference.forEach((k, i) => expect(Math.abs(gain[i] - k)).toBeLessThan(1e-8 * Math.max(1, Math.abs(k))));
  });

  it('is a minimum: every small change of the gain raises the closed-form cost (tr P)', () => {
    const { gain } = discountedLqrGain(THREE, 0.97);
    const cost = (k: Float64Array) => {
      const p = feedbackCostToGo(THREE, { feedbackGain: k, bias: new Float64Array(2), noiseCovariance: new Float64Array(4) }, 0.97).quadratic;
      return p[0] + p[4] + p[8];
    };
    const best = cost(gain);
    for (let i = 0; i < gain.length; i++) {
      for (const step of [-1e-3, 1e-3]) {
        const k = Float64Array.from(gain);
        k[i] += step;
        expect(cost(k)).toBeGreaterThan(best);
      }
    }
  });
});
