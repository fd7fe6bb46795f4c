/**
 * The finding that V̂ lies outside the possible range on most logged states writes its numbers through
 * the one writer (figures/parts/uncertainNumber.ts): fixed notation up to 1e15, a standard error to two
 * significant digits (JCGM 100, the GUM, §7.2.2 — common practice), never JavaScript's toPrecision
 * exponent form ("-1.235e+4"). Invented numbers of a plant that costs about 12,000 per run.
 */
import { describe, expect, it } from 'vitest';
import { stateFinding } from '../../src/pipeline/assessPossible';
import type { EvaluationPlan } from '../../src/pipeline/plan/evaluationPlan';

describe('the words of the state-by-state impossible-value finding', () => {
  it('writes a five-digit median and its standard error in fixed notation', () => {
    const plan = { sign: -1, sense: 'cost' } as unknown as EvaluationPlan;
    const w = stateFinding(plan, { lower: -20_000, upper: -15_000 }, { side: 'above', median: -12_345.678, share: 0.93, states: 500 }, 1_234.5);
    expect(w.message).toContain('V̂ has median 12350 over 500 logged states');
    expect(w.message).toContain('(15000 to 20000, discounted');
    expect(w.message).toContain('more than one standard error of J (1200) past its end');
    expect(w.message).not.toMatch(/e\+/);
  });
});
