/**
 * The discount factor with its time horizon, as every screen states it (GUIDE §4: "discount factor
 * with its time horizon"): the effective horizon 1/(1 − γ) steps (common practice; closed form:
 * γ = 0.97 gives 33.33 steps, γ = 0.95 gives 20) and, with the sampling period, the same in time
 * (33.33 × 30 s = 1000 s = 16 min 40 s).
 */
import { describe, expect, it } from 'vitest';
import { discountWithHorizon } from '../../../src/renderer/src/screens/estimator/discountHorizon';
import { settingsLine } from '../../../src/renderer/src/screens/findings/plotLabels';
import type { Evaluation } from '../../../src/pipeline/estimates';

describe('the discount with its horizon', () => {
  it('gives the horizon in steps and, with a sampling period, in time', () => {
    expect(discountWithHorizon(0.97, 30)).toBe('0.97 (horizon about 33.3 steps; about 16 min 40 s at the 30 s sampling period)');
    expect(discountWithHorizon(0.95, null)).toBe('0.95 (horizon about 20 steps)');
    expect(discountWithHorizon(1, 30)).toBe('1'); // outside (0, 1): no horizon to state
  });

  it('puts the horizon in the exported figures’ caption line', () => {
    const evaluation = { settings: { discount: 0.95, approximator: 'linear, degree 2', quadratureNodes: 7, seed: 1, transitions: 19960, episodes: 40 } } as unknown as Evaluation;
    expect(settingsLine(evaluation)).toMatch(/^γ = 0\.95 \(horizon about 20 steps\); linear/);
  });
});
