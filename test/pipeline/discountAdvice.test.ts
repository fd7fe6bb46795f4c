/**
 * The advice when a discount's horizon is longer than the logs: 1/(1 − γ) ≤ n holds exactly for
 * γ ≤ 1 − 1/n (arithmetic), so the advised bound is that value, written without trailing zeros,
 * and with a single transition no discount in (0, 1) can meet it.
 */
import { describe, expect, it } from 'vitest';
import { discountProblems } from '../../src/pipeline/plan/planChecks';

describe('the discount advice on a short log', () => {
  it('advises γ ≤ 1 − 1/n, and no advice where the horizon fits', () => {
    expect(discountProblems(0.99, 100)).toEqual([]); // 1/(1 − 0.99) = 100 ≤ 100
    expect(discountProblems(0.995, 100)[0].message).toMatch(/use a discount of at most 0\.99, or more data$/);
    expect(discountProblems(0.999, 300)[0].message).toMatch(/at most 0\.996667,/);
  });

  it('says more data is needed where no discount in (0, 1) fits a single transition (it advised "at most 0.00000")', () => {
    const message = discountProblems(0.5, 1)[0].message;
    expect(message).not.toMatch(/at most 0\.0/);
    expect(message).toMatch(/no discount is short enough for a single transition: more data is needed$/);
  });
});
