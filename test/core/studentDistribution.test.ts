/**
 * Student's t against outside references: Abramowitz & Stegun, Table 26.10 (t_{0.95, 3} = 2.353,
 * t_{0.975, 10} = 2.228, t_{0.95, 30} = 1.697; from memory), scipy.stats.t.ppf and .cdf (SciPy 1.17, computed
 * 2026-12-05 for this test), and the closed forms for one and two degrees of freedom (the Cauchy quantile
 * tan(π(p − ½)), and t = (2p − 1)/√(2p(1 − p)) for ν = 2; common practice).
 */
import { describe, expect, it } from 'vitest';
import { logGamma, studentCdf, studentQuantile } from '../../src/core/studentDistribution';

describe('Student t quantile and distribution function', () => {
  it('matches Abramowitz & Stegun Table 26.10 to its three decimals', () => {
    expect(studentQuantile(0.95, 3)).toBeCloseTo(2.353, 3);
    expect(studentQuantile(0.975, 10)).toBeCloseTo(2.228, 3);
    expect(studentQuantile(0.95, 30)).toBeCloseTo(1.697, 3);
  });

  it('matches scipy.stats.t.ppf to 1e-9', () => {
    const cases: [number, number, number][] = [
      [0.95, 1, 6.313751514675037], [0.95, 2, 2.9199855803537242], [0.95, 3, 2.3533634348018233], [0.975, 3, 3.1824463052837078],
      [0.95, 10, 1.8124611228116756], [0.99, 4, 3.746947387979196], [0.95, 30, 1.697260886593957],
    ];
    for (const [p, nu, t] of cases) expect(Math.abs(studentQuantile(p, nu) - t)).toBeLessThan(1e-9 * t);
    expect(studentCdf(1.5, 3)).toBeCloseTo(0.8847080673775886, 10);
    expect(studentCdf(-0.7, 7)).toBeCloseTo(0.2532587760978, 10);
  });

  it('agrees with the closed forms for one and two degrees of freedom, and is odd about p = ½', () => {
    for (const p of [0.6, 0.9, 0.95, 0.995]) {
      expect(studentQuantile(p, 1)).toBeCloseTo(Math.tan(Math.PI * (p - 0.5)), 8);
      expect(studentQuantile(p, 2)).toBeCloseTo((2 * p - 1) / Math.sqrt(2 * p * (1 - p)), 9);
      expect(studentQuantile(1 - p, 5)).toBeCloseTo(-studentQuantile(p, 5), 12);
    }
    expect(studentQuantile(0.5, 4)).toBe(0);
  });

  it('ln Γ at integers and at ½ (Γ(n) = (n − 1)!, Γ(½) = √π)', () => {
    expect(logGamma(5)).toBeCloseTo(Math.log(24), 9);
    expect(logGamma(0.5)).toBeCloseTo(0.5 * Math.log(Math.PI), 9);
  });

  it('refuses a probability outside (0, 1) and degrees of freedom ≤ 0', () => {
    expect(() => studentQuantile(1, 3)).toThrow(/strictly between 0 and 1/);
    expect(() => studentQuantile(0.9, 0)).toThrow(/positive/);
  });
});
