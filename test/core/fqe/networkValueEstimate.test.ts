/**
 * The network interval's widening (networkValueEstimate.ts): independent variances add, so a
 * refit spread equal to the bootstrap standard error stretches each side by √2 about the estimate
 * (common practice for combining independent error sources); no spread leaves the percentile
 * interval as it is; a drift bound (an error of unknown sign within ±drift) widens both ends by itself.
 */
import { describe, expect, it } from 'vitest';
import { bootstrapInterval } from '../../../src/core/bootstrap/bootstrapInterval';
import { networkValueInterval } from '../../../src/core/fqe/networkValueEstimate';

const replicates = Array.from({ length: 101 }, (_, i) => 10 + (i - 50) / 25); // 8 … 12, uniform
const b = bootstrapInterval(10.2, replicates, 0.9);

describe('networkValueInterval', () => {
  it('is the percentile interval when the iterates do not spread', () => {
    expect(networkValueInterval(b, 0)).toEqual({ level: 0.9, lower: b.percentile[0], upper: b.percentile[1], standardError: b.standardError });
  });

  it('stretches each side by √(1 + (refit/SE)²) about the estimate', () => {
    const w = networkValueInterval(b, b.standardError);
    expect(w.standardError).toBeCloseTo(Math.SQRT2 * b.standardError, 12);
    expect(10.2 - w.lower).toBeCloseTo(Math.SQRT2 * (10.2 - b.percentile[0]), 12);
    expect(w.upper - 10.2).toBeCloseTo(Math.SQRT2 * (b.percentile[1] - 10.2), 12);
  });

  it('adds the stopping rule\'s drift allowance to both ends, and to the standard error as one more independent part', () => {
    const plain = networkValueInterval(b, b.standardError), w = networkValueInterval(b, b.standardError, 0.3);
    expect(w.lower).toBeCloseTo(plain.lower - 0.3, 12);
    expect(w.upper).toBeCloseTo(plain.upper + 0.3, 12);
    expect(w.standardError).toBeCloseTo(Math.hypot(plain.standardError, 0.3), 12);
  });
});
