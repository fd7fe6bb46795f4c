import { describe, expect, it } from 'vitest';
import { createActionQuadrature, expectUnderPolicy } from '../../../src/core/actionQuadrature';
import { actionLimitsAt, createGaussianPolicy, policyMean } from '../../../src/core/policy';
import { bruteForceExpectation } from './bruteForce';

/**
 * The action quadrature of a scheduled mean and of moving (rate) limits against a brute-force
 * fine rule built from the definitions (bruteForce.ts). At one state the rule sees only μ(s), σ,
 * L(s), U(s), so it must keep its degree of exactness: a polynomial of degree ≤ 2n−1 in the action
 * is integrated to rounding, whatever the schedule or the limits.
 */
const N = 6; // nodes per dimension: exact to degree 11
const cubic = (a: number) => 0.3 + 0.02 * a - 0.004 * a * a + 1e-5 * a * a * a;
const degree11 = (a: number) => ((a - 50) / 40) ** 11 + ((a - 50) / 40) ** 4;

// Valve % as a reset schedule in outdoor temperature (state 1), plus a P term on zone temperature (state 0).
const schedule = { action: 0, state: 1, breakpoints: [-15, -5, 5, 15], values: [95, 80, 50, 20] };
const scheduled = createGaussianPolicy({ offset: [210], gain: [[-10, 0, 0]], std: [4], schedules: [schedule] }, 3);
const rateLimited = createGaussianPolicy({
  offset: [210], gain: [[-10, 0, 0]], std: [4], schedules: [schedule],
  bounds: { lo: [0], hi: [100], mode: 'clip' }, rateLimit: { previousActionState: [2], maxStep: [3] },
}, 3);

function ruleExpectation(policy: ReturnType<typeof createGaussianPolicy>, state: number[], f: (a: number) => number): number {
  const q = createActionQuadrature(policy, N);
  const points = new Float64Array(q.maxPoints), weights = new Float64Array(q.maxPoints);
  const k = q.at(state, 0, points, weights);
  let v = 0;
  for (let j = 0; j < k; j++) v += weights[j] * f(points[j]);
  return v;
}

describe('action quadrature for the candidate forms', () => {
  it('reads a scheduled mean from the breakpoints table (linear interpolation, held beyond the ends)', () => {
    const mean = new Float64Array(1);
    const at = (zone: number, outdoor: number) => { policyMean(scheduled, [zone, outdoor, 0], mean); return mean[0]; };
    expect(at(21, -5)).toBeCloseTo(210 - 210 + 80, 12); // on a breakpoint
    expect(at(21, 0)).toBeCloseTo(65, 12); // half way from 80 to 50
    expect(at(21, -30)).toBeCloseTo(95, 12); // held below the table
    expect(at(21, 40)).toBeCloseTo(20, 12); // held above the table
    expect(at(20, 10)).toBeCloseTo(10 + 35, 12); // P term +10 % per K below 21 °C
  });

  it('integrates a scheduled mean exactly at, between and beyond breakpoints (brute force agrees)', () => {
    for (const outdoor of [-20, -15, -9.7, -5, 0.3, 5, 14.99, 15, 30]) {
      const state = [21.4, outdoor, 0], mean = new Float64Array(1);
      policyMean(scheduled, state, mean);
      for (const f of [cubic, degree11]) {
        const reference = bruteForceExpectation(f, mean[0], 4, -Infinity, Infinity, 'none');
        expect(Math.abs(ruleExpectation(scheduled, state, f) - reference)).toBeLessThan(1e-11 * Math.max(1, Math.abs(reference)));
      }
    }
  });

  it('puts point masses at the moving limits of a rate limit (brute force agrees)', () => {
    // previous valve 60 %: band inside the position limits; 99 %: band cut at 100 %; 110 %: band beyond, all mass at 100 %.
    const cases = [
      { outdoor: 0, previous: 60 }, { outdoor: 0, previous: 66 }, { outdoor: -14, previous: 99 },
      { outdoor: -14, previous: 110 }, { outdoor: 14, previous: 1 }, { outdoor: 14, previous: -20 },
    ];
    const lo = new Float64Array(1), hi = new Float64Array(1), mean = new Float64Array(1);
    for (const { outdoor, previous } of cases) {
      const state = [21, outdoor, previous];
      policyMean(rateLimited, state, mean);
      actionLimitsAt(rateLimited, state, 0, lo, hi);
      expect(lo[0]).toBeCloseTo(Math.min(Math.max(previous - 3, 0), 100), 12);
      expect(hi[0]).toBeCloseTo(Math.min(Math.max(previous + 3, 0), 100), 12);
      for (const f of [cubic, degree11]) {
        const reference = bruteForceExpectation(f, mean[0], 4, lo[0], hi[0], 'clip');
        expect(Math.abs(ruleExpectation(rateLimited, state, f) - reference)).toBeLessThan(1e-9 * Math.max(1, Math.abs(reference)));
      }
    }
  });

  it('gives a collapsed band its one value with weight 1', () => {
    const q = createActionQuadrature(rateLimited, N);
    const points = new Float64Array(q.maxPoints), weights = new Float64Array(q.maxPoints);
    expect(q.at([21, -14, 110], 0, points, weights)).toBe(1);
    expect([points[0], weights[0]]).toEqual([100, 1]);
  });

  it('rate-limits one action of two and leaves the other Gaussian (product rule against brute force)', () => {
    const two = createGaussianPolicy({
      offset: [10, -2], gain: [[0.5, 0], [0, 1]], std: [2, 0.5], rateLimit: { previousActionState: [1, -1], maxStep: [1.5, Infinity] },
    }, 2);
    const state = [4, 11];
    const f = (a: Float64Array) => a[0] * a[0] * a[1] + a[1] ** 3;
    // E[a0²·a1 + a1³] = E[a0²]·E[a1] + E[a1³] by independence; each factor by brute force.
    const lo = new Float64Array(2), hi = new Float64Array(2);
    actionLimitsAt(two, state, 0, lo, hi);
    const ea0sq = bruteForceExpectation((a) => a * a, 12, 2, lo[0], hi[0], 'clip');
    const ea1 = bruteForceExpectation((a) => a, 9, 0.5, -Infinity, Infinity, 'none');
    const ea1cube = bruteForceExpectation((a) => a ** 3, 9, 0.5, -Infinity, Infinity, 'none');
    const { value } = expectUnderPolicy(two, state, f, N);
    expect(value).toBeCloseTo(ea0sq * ea1 + ea1cube, 8);
  });
});
