/**
 * The closed-form value of a fitted linear-quadratic model (augmented state, cross terms removed by
 * completing the square) against two outside references: lq.ts's own closed form of the tank plant
 * (Bertsekas, "Dynamic Programming and Optimal Control", Vol. I, §4.1) written in shifted
 * coordinates, which gives the model an intercept and linear cost terms; and a Monte Carlo
 * simulation of a model with a state–action cross term in the cost (fixed seed, 4 standard errors).
 */
import { describe, expect, it } from 'vitest';
import { tankDiscount, tankOperatingPoint, tankPlant, tankTrimmedPolicy } from '../../../sample-projects/tank-levels/simulate';
import { closedFormPolicyCost, lqClosedForm, rewardFromCost, UnstableClosedLoopError } from '../../../src/core/lq';
import type { LinearQuadraticModelFit } from '../../../src/core/offPolicy/linearQuadraticModel';
import { modelPolicyValue, ModelValueError } from '../../../src/core/offPolicy/modelBasedValue';
import { createGaussianPolicy } from '../../../src/core/policy';
import { createRandom } from '../../../src/core/random';

/** The tank plant in coordinates centred at c (states) and ā (action) instead of its setpoint. */
function shiftedTankModel(c: number[], aBar: number): LinearQuadraticModelFit {
  const [a11, a12, a21, a22] = tankPlant.dynamics, [b1, b2] = tankPlant.inputGain;
  const dx = [c[0] - tankOperatingPoint.state[0], c[1] - tankOperatingPoint.state[1]], dv = aBar - tankOperatingPoint.action[0];
  // s' − c = A x + B v + [A(c − x_sp) + B(ā − u_sp) − (c − x_sp)]
  const intercept = [a11 * dx[0] + a12 * dx[1] + b1 * dv - dx[0], a21 * dx[0] + a22 * dx[1] + b2 * dv - dx[1]];
  const q = tankPlant.stateWeight, r = tankPlant.actionWeight[0];
  return {
    stateCentre: Float64Array.from(c), actionCentre: Float64Array.of(aBar), dynamics: tankPlant.dynamics, inputGain: tankPlant.inputGain,
    intercept: Float64Array.from(intercept), noiseCovariance: tankPlant.processNoiseCovariance, dynamicsRSquared: [1, 1], costRSquared: 1,
    cost: {
      constant: q[0] * dx[0] ** 2 + q[3] * dx[1] ** 2 + r * dv ** 2, stateLinear: Float64Array.of(2 * q[0] * dx[0], 2 * q[3] * dx[1]),
      actionLinear: Float64Array.of(2 * r * dv), stateQuadratic: q, cross: new Float64Array(2), actionQuadratic: Float64Array.of(r),
    },
  };
}

describe('modelPolicyValue', () => {
  it('equals lq.ts’s closed form of the tank plant written around another centre', () => {
    const policy = createGaussianPolicy(tankTrimmedPolicy, 2);
    const starts = Float64Array.of(1.1, 0.75, 1.3, 0.85, 1.2, 0.8);
    const exact = rewardFromCost(closedFormPolicyCost(lqClosedForm(tankPlant, tankOperatingPoint, policy, tankDiscount), starts, 3));
    const value = modelPolicyValue(shiftedTankModel([1.17, 0.83], 47), policy, tankDiscount, starts);
    expect(Math.abs(value - exact) / Math.abs(exact)).toBeLessThan(1e-9);
  });

  it('matches a Monte Carlo simulation of a model with an intercept and a state–action cross term', () => {
    // s' = 0.3 + 0.8 s + 0.5 a + w, w ~ N(0, 0.1²); cost = 1 + 0.5 s + 0.3 a + 2 s² + 0.4 s a + 0.2 a²; a = 0.2 − 0.6 s + N(0, 0.3²).
    const model: LinearQuadraticModelFit = {
      stateCentre: Float64Array.of(0), actionCentre: Float64Array.of(0), dynamics: Float64Array.of(0.8), inputGain: Float64Array.of(0.5),
      intercept: Float64Array.of(0.3), noiseCovariance: Float64Array.of(0.01), dynamicsRSquared: [1], costRSquared: 1,
      cost: { constant: 1, stateLinear: Float64Array.of(0.5), actionLinear: Float64Array.of(0.3), stateQuadratic: Float64Array.of(2), cross: Float64Array.of(0.2), actionQuadratic: Float64Array.of(0.2) },
    };
    const policy = createGaussianPolicy({ offset: [0.2], gain: [[-0.6]], std: [0.3] }, 1);
    const gamma = 0.9, start = 1.5, rng = createRandom(2718), runs = 8000, steps = 150; // γ^150 ≈ 1.4e-7 of the weight left out
    let sum = 0, sumSq = 0;
    for (let k = 0; k < runs; k++) {
      let s = start, g = 0, w = 1;
      for (let t = 0; t < steps; t++, w *= gamma) {
        const a = 0.2 - 0.6 * s + 0.3 * rng.normal();
        g += w * (1 + 0.5 * s + 0.3 * a + 2 * s * s + 0.4 * s * a + 0.2 * a * a);
        s = 0.3 + 0.8 * s + 0.5 * a + 0.1 * rng.normal();
      }
      sum += g;
      sumSq += g * g;
    }
    const mean = sum / runs, se = Math.sqrt((sumSq / runs - mean * mean) / runs);
    expect(Math.abs(-modelPolicyValue(model, policy, gamma, Float64Array.of(start)) - mean)).toBeLessThan(4 * se);
  });

  it('refuses a candidate with actuator limits, and an unstable closed loop', () => {
    const model = shiftedTankModel([1.2, 0.8], 45);
    const limited = createGaussianPolicy({ ...tankTrimmedPolicy, bounds: { lo: [0], hi: [100], mode: 'clip' } }, 2);
    expect(() => modelPolicyValue(model, limited, tankDiscount, Float64Array.of(1.2, 0.8))).toThrow(ModelValueError);
    const unstable = createGaussianPolicy({ offset: [0], gain: [[2000, 0]], std: [1] }, 2);
    expect(() => modelPolicyValue(model, unstable, tankDiscount, Float64Array.of(1.2, 0.8))).toThrow(UnstableClosedLoopError);
  });
});
