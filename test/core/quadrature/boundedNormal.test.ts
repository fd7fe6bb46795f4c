import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { createBoundedNormalQuadrature, NEGLIGIBLE_MASS } from '../../../src/core/quadrature/boundedNormal';
import { standardNormalRule } from '../../../src/core/quadrature/gaussHermite';
import { normalCdf, normalDensity, normalIntervalProbability, normalSurvival } from '../../../src/core/normalDistribution';
import type { BoundMode } from '../../../src/core/policy';

interface Case { mean: number; std: number; lo: number; hi: number }

/** E f(A) by the bounded rule with n interior nodes, plus the rule itself. */
function expectation(f: (a: number) => number, c: Case, mode: BoundMode, n: number) {
  const rule = createBoundedNormalQuadrature(n);
  const nodes = new Float64Array(rule.maxPoints), weights = new Float64Array(rule.maxPoints);
  const count = rule.fill(c.mean, c.std, c.lo, c.hi, mode, nodes, weights);
  let value = 0;
  for (let i = 0; i < count; i++) value += weights[i] * f(nodes[i]);
  return { value, count, nodes: nodes.slice(0, count), weights: weights.slice(0, count) };
}

const phi = (z: number) => (Number.isFinite(z) ? normalDensity(z) : 0);
const zPhi = (z: number) => (Number.isFinite(z) ? z * normalDensity(z) : 0);

/**
 * Truncated normal mean and variance: Johnson, Kotz & Balakrishnan, "Continuous Univariate
 * Distributions", Vol. 1 (2nd ed.), §10.1: E = μ + σ(φ(α)−φ(β))/Z,
 * Var = σ²[1 + (αφ(α)−βφ(β))/Z − ((φ(α)−φ(β))/Z)²], Z = Φ(β) − Φ(α).
 */
function truncatedMoments({ mean, std, lo, hi }: Case) {
  const alpha = (lo - mean) / std, beta = (hi - mean) / std, z = normalIntervalProbability(alpha, beta);
  const ratio = (phi(alpha) - phi(beta)) / z;
  return { z, alpha, beta, mean: mean + std * ratio, variance: std * std * (1 + (zPhi(alpha) - zPhi(beta)) / z - ratio * ratio) };
}

/**
 * Two-limit censored (clipped) normal mean: Greene, "Econometric Analysis", censored normal
 * distribution: E = Φ(α)·lo + Z·E_truncated + (1 − Φ(β))·hi; the second moment the same way.
 */
function clippedMoments(c: Case) {
  const t = truncatedMoments(c);
  const pLo = normalCdf(t.alpha), pHi = normalSurvival(t.beta);
  const atLo = pLo > 0 ? pLo : 0, atHi = pHi > 0 ? pHi : 0;
  const mean = (atLo ? atLo * c.lo : 0) + t.z * t.mean + (atHi ? atHi * c.hi : 0);
  const second = (atLo ? atLo * c.lo ** 2 : 0) + t.z * (t.variance + t.mean ** 2) + (atHi ? atHi * c.hi ** 2 : 0);
  return { mean, variance: second - mean * mean };
}

/** E[e^{tA}] of the truncated normal: e^{μt + σ²t²/2}(Φ(β − σt) − Φ(α − σt))/Z (JKB §10.1). */
function truncatedMgf(c: Case, t: number): number {
  const m = truncatedMoments(c);
  return (Math.exp(c.mean * t + (c.std * t) ** 2 / 2) * normalIntervalProbability(m.alpha - c.std * t, m.beta - c.std * t)) / m.z;
}

function expectRelative(actual: number, expected: number, tolerance: number): void {
  expect(Math.abs(actual - expected)).toBeLessThanOrEqual(tolerance * Math.abs(expected));
}

const CASES: Record<string, Case> = {
  'two-sided': { mean: 0.3, std: 1.2, lo: -1, hi: 2 },
  'lower bound only': { mean: 1, std: 0.5, lo: 0.8, hi: Infinity },
  'upper bound only': { mean: -2, std: 2, lo: -Infinity, hi: -1 },
  'cut at the mean': { mean: 0, std: 1, lo: 0, hi: Infinity },
  'mean above the bounds': { mean: 5, std: 2, lo: -1, hi: 1 },
  'mean 3σ below the lower bound': { mean: -3, std: 1, lo: 0, hi: Infinity },
  'narrow window (0.2σ)': { mean: 0.5, std: 1, lo: 0.4, hi: 0.6 },
};

describe('normal distribution function used for the bound masses', () => {
  it('matches A&S Table 26.1 (values from memory)', () => {
    // Abramowitz & Stegun, Table 26.1: P(x) and Q(x) = 1 − P(x).
    expect(normalCdf(0)).toBe(0.5);
    expectRelative(normalCdf(0.5), 0.691462461274013, 1e-14);
    expectRelative(normalCdf(1), 0.841344746068543, 1e-14);
    expectRelative(normalCdf(2), 0.977249868051821, 1e-14);
    expectRelative(normalCdf(3), 0.99865010196837, 1e-14);
    expectRelative(normalSurvival(4), 3.16712418331200e-5, 1e-12);
    expectRelative(normalSurvival(5), 2.86651571879194e-7, 1e-12);
  });
});

describe('truncated normal rule', () => {
  for (const [name, c] of Object.entries(CASES)) {
    it(`${name}: mean and variance match the closed forms (JKB §10.1)`, () => {
      const exact = truncatedMoments(c);
      const m1 = expectation((a) => a, c, 'truncate', 8);
      const m2 = expectation((a) => (a - exact.mean) ** 2, c, 'truncate', 8);
      expect(Math.abs(m1.value - exact.mean)).toBeLessThan(1e-13 * Math.max(c.std, Math.abs(exact.mean)));
      // The closed-form variance cancels terms of size (E/σ)²; allow for that cancellation.
      const cancellation = 1 + (exact.mean - c.mean) ** 2 / c.std ** 2;
      expectRelative(m2.value, exact.variance, 1e-13 * cancellation * (c.std ** 2 / exact.variance));
      expectRelative(m1.weights.reduce((s, w) => s + w, 0), 1, 1e-14);
      for (const a of m1.nodes) {
        expect(a).toBeGreaterThanOrEqual(c.lo);
        expect(a).toBeLessThanOrEqual(c.hi);
      }
    });

    it(`${name}: E[e^{tA}] matches the truncated-normal moment generating function to 1e−11`, () => {
      for (const t of [0.5 / c.std, 1 / c.std, 2 / c.std]) {
        expectRelative(expectation((a) => Math.exp(t * a), c, 'truncate', 16).value, truncatedMgf(c, t), 1e-11);
      }
    });
  }

  it('is exact for polynomials of degree ≤ 2n−1 and not for degree 2n', () => {
    // Standardised truncated moments, JKB §10.1: M_k = (k−1)M_{k−2} + (α^{k−1}φ(α) − β^{k−1}φ(β))/Z.
    const c = { mean: 0, std: 1, lo: -1.5, hi: 2.5 };
    const { z, alpha, beta } = truncatedMoments(c);
    const moments = [1, (phi(alpha) - phi(beta)) / z];
    for (let k = 2; k <= 16; k++) moments.push((k - 1) * moments[k - 2] + (alpha ** (k - 1) * phi(alpha) - beta ** (k - 1) * phi(beta)) / z);
    for (const n of [1, 3, 4, 8]) {
      for (let k = 0; k <= 2 * n - 1; k++) {
        const scale = Math.max(Math.abs(moments[k]), 2.5 ** k * 1e-3);
        expect(Math.abs(expectation((a) => a ** k, c, 'truncate', n).value - moments[k])).toBeLessThan(1e-13 * scale);
      }
      const miss = Math.abs(expectation((a) => a ** (2 * n), c, 'truncate', n).value - moments[2 * n]);
      expect(miss).toBeGreaterThan(1e-6 * moments[2 * n]);
    }
  });

  it('a mean 40σ below the lower bound: E[Z | Z > 40] from the Mills-ratio series (A&S 26.2.12)', () => {
    // Q(x)/φ(x) ~ (1/x)(1 − 1/x² + 3/x⁴ − 15/x⁶ + 105/x⁸ − 945/x¹⁰); E[Z | Z > x] = φ(x)/Q(x).
    // Here Φ underflows in double precision, so only a rule built relative to the peak survives.
    const x = 40, u = 1 / (x * x);
    const mills = (1 - u + 3 * u ** 2 - 15 * u ** 3 + 105 * u ** 4 - 945 * u ** 5) / x;
    const r = expectation((a) => a, { mean: 0, std: 1, lo: x, hi: Infinity }, 'truncate', 8);
    expectRelative(r.value, 1 / mills, 1e-14);
    expect(r.nodes[0]).toBeGreaterThanOrEqual(x);
  });
});

describe('clipped normal rule', () => {
  for (const [name, c] of Object.entries(CASES)) {
    it(`${name}: mean and variance match the censored-normal closed form (Greene)`, () => {
      const exact = clippedMoments(c);
      const r = expectation((a) => a, c, 'clip', 8);
      const spread = c.std + Math.abs(exact.mean);
      expect(Math.abs(r.value - exact.mean)).toBeLessThan(1e-13 * spread);
      const v = expectation((a) => (a - exact.mean) ** 2, c, 'clip', 8).value;
      expect(Math.abs(v - exact.variance)).toBeLessThan(1e-12 * spread ** 2);
      expectRelative(r.weights.reduce((s, w) => s + w, 0), 1, 1e-14);
    });
  }

  it('puts Φ(α) at lo and 1 − Φ(β) at hi exactly', () => {
    const c = { mean: 0.2, std: 0.7, lo: -0.5, hi: 1 };
    const r = expectation((a) => a, c, 'clip', 6);
    expect(r.nodes[0]).toBe(c.lo);
    expect(r.nodes[r.count - 1]).toBe(c.hi);
    expect(r.weights[0]).toBe(normalCdf((c.lo - c.mean) / c.std));
    expect(r.weights[r.count - 1]).toBe(normalSurvival((c.hi - c.mean) / c.std));
    expect(r.count).toBe(8);
  });

  it('a mean 40σ below lo puts all the mass on lo', () => {
    const r = expectation((a) => a, { mean: 0, std: 1, lo: 40, hi: 50 }, 'clip', 8);
    expect(r.count).toBe(1);
    expect(r.value).toBe(40);
  });

  it('E[e^{tA}] = Φ(α)e^{t·lo} + Z·MGF_truncated + (1−Φ(β))e^{t·hi} to 1e−11', () => {
    const c = CASES['two-sided'];
    const m = truncatedMoments(c), t = 0.8;
    const exact = normalCdf(m.alpha) * Math.exp(t * c.lo) + m.z * truncatedMgf(c, t) + normalSurvival(m.beta) * Math.exp(t * c.hi);
    expectRelative(expectation((a) => Math.exp(t * a), c, 'clip', 16).value, exact, 1e-11);
  });
});

describe('bounds far away', () => {
  it('beyond the 1e−15 tail mass the rule is the Gauss–Hermite rule itself', () => {
    const gh = standardNormalRule(8);
    for (const mode of ['clip', 'truncate'] as const) {
      const r = expectation((a) => a, { mean: 1, std: 2, lo: -30, hi: 40 }, mode, 8);
      expect(r.count).toBe(8);
      r.nodes.forEach((a, i) => expect(a).toBe(1 + 2 * gh.nodes[i]));
      r.weights.forEach((w, i) => expect(w).toBe(gh.weights[i]));
    }
  });

  it('shows no visible jump where the Gauss–Hermite fallback takes over', () => {
    // Φ(−7.94) ≈ 1.0e−15 (A&S 26.2.12 asymptotics): straddle the switch with a smooth f, one- and
    // two-sided. The true change of E f across it is of order Φ(−7.94)·max|f| ≈ 1e−13 here.
    const f = (a: number) => Math.cos(a) + 0.1 * a ** 3;
    expect(normalCdf(-7.94)).toBeGreaterThan(NEGLIGIBLE_MASS);
    expect(normalCdf(-7.95)).toBeLessThan(NEGLIGIBLE_MASS);
    for (const mode of ['clip', 'truncate'] as const) {
      for (const twoSided of [false, true]) {
        const at = (zBound: number) => expectation(f, { mean: 0, std: 1, lo: -zBound, hi: twoSided ? zBound : Infinity }, mode, 10).value;
        expect(Math.abs(at(7.94) - at(7.95))).toBeLessThan(2e-13);
        // E cos Z = e^{−1/2} and E Z³ = 0 for the unbounded normal (common practice).
        expect(Math.abs(at(7.95) - Math.exp(-0.5))).toBeLessThan(1e-11);
      }
    }
  });
});

describe('properties over random policies and bounds (fast-check)', () => {
  it('weights are a probability vector on [lo, hi] and the mean matches the closed forms', () => {
    fc.assert(
      fc.property(
        fc.double({ min: -3, max: 3, noNaN: true }), fc.double({ min: 0.05, max: 3, noNaN: true }),
        fc.double({ min: -4, max: 4, noNaN: true }), fc.double({ min: 0.01, max: 6, noNaN: true }),
        fc.boolean(), fc.boolean(), fc.constantFrom<BoundMode>('clip', 'truncate'), fc.integer({ min: 1, max: 12 }),
        (mean, std, lo, width, openBelow, openAbove, mode, n) => {
          const c = { mean, std, lo: openBelow ? -Infinity : lo, hi: openAbove ? Infinity : lo + width };
          if (openBelow && openAbove) c.hi = lo + width;
          // Beyond ~20σ the double-precision closed form itself breaks down (Z near underflow);
          // those tails are covered by the Mills-ratio test above.
          fc.pre(truncatedMoments(c).z > 1e-80);
          const r = expectation((a) => a, c, mode, n);
          let total = 0;
          r.weights.forEach((w, i) => {
            expect(w).toBeGreaterThanOrEqual(0);
            expect(r.nodes[i]).toBeGreaterThanOrEqual(c.lo);
            expect(r.nodes[i]).toBeLessThanOrEqual(c.hi);
            total += w;
          });
          expect(Math.abs(total - 1)).toBeLessThan(1e-13);
          const exact = mode === 'clip' ? clippedMoments(c).mean : truncatedMoments(c).mean;
          // The closed form itself loses digits to σ·(φ(α)−φ(β))/Z cancelling μ far in a tail
          // (checked against 50-digit arithmetic), hence the |exact − μ| term.
          expect(Math.abs(r.value - exact)).toBeLessThan(1e-12 * (std + Math.abs(exact) + Math.abs(exact - mean)));
        },
      ),
      { seed: 424242, numRuns: 400 },
    );
  });
});

describe('argument checks', () => {
  it('names the offending value', () => {
    const rule = createBoundedNormalQuadrature(4);
    const x = new Float64Array(6), w = new Float64Array(6);
    expect(() => rule.fill(0, 0, -1, 1, 'clip', x, w)).toThrow(/std must be positive/);
    expect(() => rule.fill(0, 1, 1, -1, 'clip', x, w)).toThrow(/lo < hi/);
    expect(() => rule.fill(NaN, 1, -1, 1, 'clip', x, w)).toThrow(/mean must be finite/);
    expect(() => rule.fill(0, 1, -1, 1, 'clip', new Float64Array(3), w)).toThrow(/buffers/);
    expect(() => createBoundedNormalQuadrature(0)).toThrow(RangeError);
    expect(() => createBoundedNormalQuadrature(33)).toThrow(RangeError);
  });
});
