import { describe, expect, it } from 'vitest';
import { createActionQuadrature } from '../../src/core/actionQuadrature';
import type { ActionValueFunction } from '../../src/core/actionValue';
import { createGaussianPolicy } from '../../src/core/policy';
import { actionValueSlice, policyValue, stateValue, stateValues, valueSurface, ValueQueryError } from '../../src/core/value';

/** An ActionValueFunction from a plain function of (s, a). */
function actionValue(stateDim: number, actionDim: number, q: (s: Float64Array, a: Float64Array) => number): ActionValueFunction {
  const p = stateDim + actionDim;
  return {
    stateDim, actionDim,
    evaluate(inputs, count, out) {
      for (let i = 0; i < count; i++) out[i] = q(inputs.subarray(i * p, i * p + stateDim), inputs.subarray(i * p + stateDim, (i + 1) * p));
    },
  };
}

describe('state and policy values', () => {
  // Q(s, a) = 3 + 0.5 s1 − s1 s2 + gᵀa + aᵀK s + ½ aᵀHa with a ~ N(μ(s), Σ), m = 2, full Σ.
  const g = [0.7, -1.2], k = [[0.3, -0.1], [0.2, 0.4]], h = [[-2, 0.5], [0.5, -1]];
  const q = actionValue(2, 2, (s, a) => {
    let v = 3 + 0.5 * s[0] - s[0] * s[1];
    for (let i = 0; i < 2; i++) {
      v += g[i] * a[i] + a[i] * (k[i][0] * s[0] + k[i][1] * s[1]);
      for (let j = 0; j < 2; j++) v += 0.5 * a[i] * h[i][j] * a[j];
    }
    return v;
  });
  const sigma = [[0.5, 0.2], [0.2, 0.3]];
  const policy = createGaussianPolicy({ offset: [0.1, -0.4], gain: [[1, -0.5], [0.2, 0.3]], covariance: sigma }, 2);
  const quadrature = createActionQuadrature(policy, 3);

  it('stateValue of a quadratic Q equals Q(s, μ(s)) + ½ tr(∇²ₐQ Σ)', () => {
    // E[aᵀHa] = μᵀHμ + tr(HΣ) for a ~ N(μ, Σ) (common practice); the 3-point rule is exact to degree 5.
    for (const s of [[0, 0], [1.5, -2], [-0.7, 0.9]]) {
      const mu = [0.1 + s[0] - 0.5 * s[1], -0.4 + 0.2 * s[0] + 0.3 * s[1]];
      const out = new Float64Array(1);
      q.evaluate(Float64Array.from([...s, ...mu]), 1, out);
      const traceHSigma = h[0][0] * sigma[0][0] + h[0][1] * sigma[1][0] + h[1][0] * sigma[0][1] + h[1][1] * sigma[1][1];
      const expected = out[0] + 0.5 * traceHSigma;
      expect(stateValue(q, policy, s, quadrature)).toBeCloseTo(expected, 12);
    }
  });

  it('batches many states with the same answers', () => {
    const states = Float64Array.from({ length: 2 * 1500 }, (_, i) => Math.sin(i)); // more than one block
    const batch = stateValues(q, policy, states, 1500, quadrature);
    for (const i of [0, 511, 512, 1499]) expect(batch[i]).toBeCloseTo(stateValue(q, policy, states.subarray(2 * i, 2 * i + 2), quadrature), 12);
  });

  it('policyValue is the mean over start states with standard error sd/√e', () => {
    // V(s) = s1 for Q = s1: J is the sample mean and its standard error the sample sd over √e (common practice).
    const qs = actionValue(2, 2, (s) => s[0]);
    const starts = Float64Array.from([1, 0, 2, 0, 4, 0, 9, 0]); // s1 = 1, 2, 4, 9: mean 4, squared deviations 9 + 4 + 0 + 25 = 38, sample variance 38/3 (hand-computed)
    const estimate = policyValue(qs, policy, starts, quadrature);
    expect(estimate.value).toBeCloseTo(4, 13);
    expect(estimate.count).toBe(4);
    expect(estimate.standardError!).toBeCloseTo(Math.sqrt(((9 + 4 + 0 + 25) / 3) / 4), 13);
    expect(policyValue(qs, policy, [5, 1], quadrature).standardError).toBeNull();
  });
});

describe('value surface and action slice', () => {
  // ds = 3 so one state is held; V(s) = s1² + 2 s2 + E[a] with E[a] = μ(s) = 0.5 s1 − s3.
  const q = actionValue(3, 1, (s, a) => s[0] ** 2 + 2 * s[1] + a[0]);
  const policy = createGaussianPolicy({ offset: [0], gain: [[0.5, 0, -1]], std: [0.8] }, 3);
  const quadrature = createActionQuadrature(policy, 4);

  it('evaluates V on a row-major grid over two states with the rest held', () => {
    const surface = valueSurface(q, policy, quadrature, {
      xAxis: 0, yAxis: 1, xRange: [-1, 2], yRange: [0, 1], resolution: [4, 3], heldState: [99, 99, 0.25],
    });
    expect(Array.from(surface.x)).toEqual([-1, 0, 1, 2]);
    expect(Array.from(surface.y)).toEqual([0, 0.5, 1]);
    for (let iy = 0; iy < 3; iy++) {
      for (let ix = 0; ix < 4; ix++) {
        const s1 = surface.x[ix], s2 = surface.y[iy];
        expect(surface.values[iy * 4 + ix]).toBeCloseTo(s1 * s1 + 2 * s2 + 0.5 * s1 - 0.25, 12);
      }
    }
    const large = valueSurface(q, policy, quadrature, {
      xAxis: 2, yAxis: 0, xRange: [0, 1], yRange: [0, 1], resolution: [100, 100], heldState: [0, 0.5, 0],
    });
    expect(large.values.length).toBe(10_000);
    expect(large.values[99 * 100 + 99]).toBeCloseTo(1 + 1 + 0.5 - 1, 12); // s = (1, 0.5, 1)
  });

  it('slices Q along one action with the others held, and rejects bad queries by name', () => {
    const q2 = actionValue(1, 2, (s, a) => -((a[0] - s[0]) ** 2) - 0.5 * a[1] ** 2);
    const slice = actionValueSlice(q2, [0.3], 0, [-1, 1], 5, [0, 2]);
    expect(Array.from(slice.actions)).toEqual([-1, -0.5, 0, 0.5, 1]);
    slice.actions.forEach((a, i) => expect(slice.values[i]).toBeCloseTo(-((a - 0.3) ** 2) - 2, 14));
    expect(() => actionValueSlice(q2, [0.3], 0, [-1, 1], 5)).toThrow(/heldAction/);
    expect(() => actionValueSlice(q2, [0.3], 2, [-1, 1], 5, [0, 0])).toThrow(/actionIndex/);
    const options = { xAxis: 0, yAxis: 0, xRange: [0, 1] as [number, number], yRange: [0, 1] as [number, number], resolution: [2, 2] as [number, number], heldState: [0, 0, 0] };
    expect(() => valueSurface(q, policy, quadrature, options)).toThrow(ValueQueryError);
    expect(() => valueSurface(q, policy, quadrature, { ...options, yAxis: 1, heldState: [0] })).toThrow(/heldState/);
    expect(() => valueSurface(q, policy, quadrature, { ...options, yAxis: 1, xRange: [1, 0] })).toThrow(/xRange/);
  });
});
