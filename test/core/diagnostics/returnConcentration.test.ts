/**
 * The costliest tenth's share of the logged return (src/core/diagnostics/returnConcentration.ts).
 * Outside facts: equal runs give exactly a tenth; for a Pareto law of index α (x ≥ 1, P(X > x) =
 * x^(−α)) the top fraction p of the values carries p^(1 − 1/α) of their mean (the Pareto Lorenz
 * curve, L(u) = 1 − (1 − u)^(1 − 1/α); common practice), checked by Monte Carlo on a large seeded
 * sample: α = 3 (finite variance, 0.1^(2/3) = 0.2154) and α = 1.2 (0.1^(1/6) = 0.6813, a tail the
 * caution must flag).
 */
import { describe, expect, it } from 'vitest';
import { CONCENTRATION_LIMIT, returnConcentration, returnConcentrationFinding } from '../../../src/core/diagnostics/returnConcentration';
import { createRandom } from '../../../src/core/random';

function paretoCosts(alpha: number, count: number, seed: number): Float64Array {
  const rng = createRandom(seed);
  return Float64Array.from({ length: count }, () => -((1 - rng.uniform()) ** (-1 / alpha))); // costs: negative rewards
}

describe('return concentration', () => {
  it('is a tenth for equal runs, in either sense', () => {
    expect(returnConcentration(new Float64Array(100).fill(-2))).toBeCloseTo(0.1, 12);
    expect(returnConcentration(new Float64Array(95).fill(3))).toBeCloseTo(10 / 95, 12); // ⌈9.5⌉ = 10 runs of 95
  });

  it('follows the Pareto Lorenz curve', () => {
    expect(returnConcentration(paretoCosts(3, 200_000, 3))).toBeCloseTo(0.1 ** (2 / 3), 2);
    const heavy = returnConcentration(paretoCosts(1.2, 200_000, 4))!;
    expect(Math.abs(heavy - 0.1 ** (1 / 6))).toBeLessThan(0.05); // infinite variance: the sample share itself scatters
    expect(heavy).toBeGreaterThan(CONCENTRATION_LIMIT);
  });

  it('is not read for returns of both signs, a zero total or fewer than ten runs', () => {
    expect(returnConcentration([-1, 2, -3, -4, -5, -6, -7, -8, -9, -10])).toBeNull();
    expect(returnConcentration(new Float64Array(20))).toBeNull();
    expect(returnConcentration([-1, -2, -3])).toBeNull();
  });

  it('is a caution only above half, in the project’s words', () => {
    expect(returnConcentrationFinding(0.5, 250, true)).toBeNull();
    expect(returnConcentrationFinding(null, 250, true)).toBeNull();
    expect(returnConcentrationFinding(0.94, 250, true)).toMatchObject({
      severity: 'caution', topic: 'runConcentration', message: expect.stringMatching(/^The 25 costliest of the 250 logged runs carry 94\u00a0% of the logged discounted cost/),
    });
    expect(returnConcentrationFinding(0.6, 95, false)!.message).toMatch(/^The 10 most rewarding of the 95 logged runs carry 60\u00a0% of the logged discounted return/);
  });
});
