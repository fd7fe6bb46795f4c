/**
 * How much the polynomial and hidden parts of Q cancel (src/core/fqe/networkPartCancellation.ts):
 * κ = Σ(|P_i| + |H_i|) / Σ|P_i + H_i|, the condition number of a sum (Higham, "Accuracy and
 * Stability of Numerical Algorithms", 2nd ed. 2002, §4.2), checked on sums done by hand; and the
 * ladder's sentence names the reason it was climbed (networkRidgeLadder.ts).
 */
import { describe, expect, it } from 'vitest';
import { partCancellation } from '../../../src/core/fqe/networkPartCancellation';
import { ridgeLadderSentence } from '../../../src/core/fqe/networkRidgeLadder';

describe('the cancellation of the polynomial and hidden parts', () => {
  // Rows [φ₀, φ₁ | h₀] with v = [1, 1 | w]: P = φ₀ + φ₁, H = w·h₀.
  const rows = Float64Array.of(1, 1, 1, /* row 2 */ 0.5, 0.5, -1);

  it('is 1 when the hidden part adds to the polynomial one, or when there is none', () => {
    expect(partCancellation(Float64Array.of(1, 1, 1), [1, 1, 3], 3, 2)).toBe(1); // P = 2, H = 3
    expect(partCancellation(rows, [1, 1, 0], 3, 2)).toBe(1);
  });

  it('is Σ(|P| + |H|) / Σ|Q| when they cancel, as done by hand', () => {
    // w = 0.5: row 1 P = 2, H = 0.5, Q = 2.5; row 2 P = 1, H = −0.5, Q = 0.5 → (2.5 + 1.5) / 3 = 4/3.
    expect(partCancellation(rows, [1, 1, 0.5], 3, 2)).toBeCloseTo(4 / 3, 14);
    // w = −1.9: row 1 P = 2, H = −1.9, Q = 0.1; row 2 P = 1, H = 1.9, Q = 2.9 → (3.9 + 2.9) / 3 = 6.8/3.
    expect(partCancellation(rows, [1, 1, -1.9], 3, 2)).toBeCloseTo(6.8 / 3, 14);
    // Exact cancellation on every row: no value left, κ infinite.
    expect(partCancellation(Float64Array.of(1, 1, 1), [1, 1, -2], 3, 2)).toBe(Number.POSITIVE_INFINITY);
  });

  it('is named in the ladder\'s sentence when it is why the ridge was raised', () => {
    const reach = ridgeLadderSentence([{ iteration: 1, hiddenRidge: 0.1, why: 'reach' }], 0.01)!;
    expect(reach).toContain('values no policy can have');
    expect(reach).not.toContain('cancel');
    const cancel = ridgeLadderSentence([{ iteration: 2, hiddenRidge: 0.1, why: 'cancellation' }], 0.01)!;
    expect(cancel).toContain('largely cancel');
    expect(cancel).not.toContain('values no policy can have');
    expect(ridgeLadderSentence([{ iteration: 1, hiddenRidge: 0.1, why: 'reach' }, { iteration: 2, hiddenRidge: 0.1, why: 'cancellation' }], 0.01))
      .toContain('values no policy can have, or a polynomial part and a hidden-feature part that largely cancel');
    // The ratchet: iterates that kept an earlier iterate's raised ridge are counted, not listed as raised.
    const held = ridgeLadderSentence([{ iteration: 2, hiddenRidge: 0.1, why: 'cancellation' }, ...[3, 4, 5].map((iteration) => ({ iteration, hiddenRidge: 0.1, why: 'held' as const }))], 0.01)!;
    expect(held).toMatch(/^At outer iteration 2 the last layer/);
    expect(held).toContain('3 later iterates were solved with the raised ridge kept, not lowered again.');
    expect(ridgeLadderSentence([{ iteration: 3, hiddenRidge: 0.1, why: 'held' }], 0.01)).toBeNull();
  });
});
