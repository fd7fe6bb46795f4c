/**
 * The unpaired standard error of a check's difference from the fit (unpairedDifference.ts), against
 * the variance of a difference, Var(A − B) = σ_A² + σ_B² − 2ρσ_Aσ_B (e.g. Casella & Berger,
 * "Statistical Inference", 2nd ed., Thm 4.5.6 — from memory), by seeded Monte Carlo.
 */
import { describe, expect, it } from 'vitest';
import { crossCheckVerdict } from '../../../src/core/offPolicy/crossCheckVerdict';
import { unpairedStandardError } from '../../../src/core/offPolicy/unpairedDifference';
import { createRandom } from '../../../src/core/random';

/** The sample standard deviation of A − B for N pairs with sds sa, sb and correlation rho (A = sa·z1, B = sb·(ρ·z1 + √(1 − ρ²)·z2)). */
function sampledDifferenceSd(sa: number, sb: number, rho: number, n: number, seed: number): number {
  const rng = createRandom(seed);
  let sum = 0, sumSq = 0;
  for (let i = 0; i < n; i++) {
    const z1 = rng.normal(), z2 = rng.normal(), d = sa * z1 - sb * (rho * z1 + Math.sqrt(1 - rho * rho) * z2);
    sum += d;
    sumSq += d * d;
  }
  return Math.sqrt((sumSq - (sum * sum) / n) / (n - 1));
}

describe('unpairedStandardError', () => {
  const sa = 0.3, sb = 1.5, n = 200_000; // a narrow check beside a wide fit, as a model check beside a network

  it('bounds the difference’s spread from above at every correlation, and is reached at ρ = −1', () => {
    for (const rho of [-1, -0.5, 0, 0.5, 0.9, 1]) {
      const closedForm = Math.sqrt(sa * sa + sb * sb - 2 * rho * sa * sb), sampled = sampledDifferenceSd(sa, sb, rho, n, 7);
      // The sample sd's standard error is about sd/√(2N) (common practice); 5 of them.
      expect(Math.abs(sampled - closedForm)).toBeLessThanOrEqual(5 * (closedForm / Math.sqrt(2 * n)) + 1e-12);
      expect(closedForm).toBeLessThanOrEqual(unpairedStandardError(sa, sb) + 1e-12);
    }
    expect(unpairedStandardError(sa, sb)).toBeCloseTo(Math.sqrt(sa * sa + sb * sb + 2 * sa * sb), 12);
  });

  it('the check’s own σ alone falls below the smallest spread the difference can have once σ_fit > 2·σ_check', () => {
    for (const rho of [-1, 0, 1]) expect(sampledDifferenceSd(sa, sb, rho, n, 11)).toBeGreaterThan(1.1 * sa); // |σ_A − σ_B| = 1.2 at ρ = 1
  });

  it('is infinite when a part is missing or not finite', () => {
    expect(unpairedStandardError(null, 1)).toBe(Infinity);
    expect(unpairedStandardError(Number.NaN, 1)).toBe(Infinity);
    expect(unpairedStandardError(1, Infinity)).toBe(Infinity);
  });

  it('gives the verdict its words: an unpaired standard error is called so', () => {
    const e = { label: 'Model rollouts', difference: -3.5, fqe: 2.7, shareOutsideLogs: 0 };
    expect(crossCheckVerdict({ ...e, differenceStandardError: 0.27 }).note).toMatch(/13\.0 standard errors of the paired difference/);
    const unpaired = crossCheckVerdict({ ...e, differenceStandardError: unpairedStandardError(0.27, 1.5), paired: false });
    expect(unpaired.note).toMatch(/2\.0 standard errors of the difference, unpaired/);
    expect(unpaired.agreement).toBe('uninformative'); // 2.0 < 3 standard errors, and 3 × 1.77 is far above 10 % of |J|
  });
});
