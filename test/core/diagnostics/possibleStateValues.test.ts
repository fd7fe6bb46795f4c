/**
 * The possible range state by state (src/core/diagnostics/possibleStateValues.ts).
 * - The exact V^π of the logging controller at every logged state of an invented linear plant
 *   (closed form, the discrete Lyapunov equation of src/core/lq.ts) lies inside the range: the rule
 *   never fires on exact values, with no allowance at all; shifted past the end, they fire.
 * - The median decides (Hyndman & Fan definition 7, R's default: the mean of the middle two of an
 *   even count; from memory): 2 of 5 states beyond the end do not fire, 3 of 5 do.
 * - The allowance of one standard error: a common shift e ~ N(0, σ²) of values that sit exactly at
 *   the end fires when e > σ, with probability 1 − Φ(1) = 0.158655 (normal table, Abramowitz &
 *   Stegun 26.2); Monte Carlo with a fixed seed, within 4 of its standard errors.
 */
import { describe, expect, it } from 'vitest';
import { evenStride, STATE_VALUE_ALLOWANCE, stateValuesOutsidePossible } from '../../../src/core/diagnostics/possibleStateValues';
import { possibleValues } from '../../../src/core/diagnostics/possibleValues';
import { createRandom } from '../../../src/core/random';
import { exactPolicyValue, simulateLog } from '../linearGaussianPlant';
import { cascadeLogging, cascadePlant, startLaws } from '../testPlants';

describe('possible values state by state', () => {
  it('never fires on the exact values at the logged states of an invented linear plant, and fires on them shifted past the end', () => {
    const [, steady] = startLaws(cascadePlant, cascadeLogging)[0];
    const data = simulateLog(cascadePlant, cascadeLogging, { episodes: 20, steps: 50, seed: 7, start: steady });
    const range = possibleValues(data.rewards, 0.97), n = cascadePlant.n, checked = evenStride(data.count, 200);
    const exact = Float64Array.from(checked, (row) => exactPolicyValue(cascadePlant, cascadeLogging, 0.97, data.states.slice(row * n, row * n + n)));
    for (const v of exact) expect(v).toBeLessThanOrEqual(range.upper);
    expect(stateValuesOutsidePossible(exact, range, 0)).toBeNull();
    const sorted = Float64Array.from(exact).sort(), median = (sorted[99] + sorted[100]) / 2;
    const shift = range.upper - median + 1, shifted = exact.map((v) => v + shift);
    const outside = stateValuesOutsidePossible(shifted, range, 0.5);
    expect(outside).toMatchObject({ side: 'above', states: 200 });
    expect(outside!.median).toBeCloseTo(median + shift, 9);
    expect(outside!.share).toBeGreaterThan(0.5);
    expect(stateValuesOutsidePossible(shifted, range, 1.5)).toBeNull(); // within one standard error of the end
  });

  it('reads the median: most states must lie beyond the end, on either side', () => {
    const range = { lower: -10, upper: 0 };
    expect(stateValuesOutsidePossible([-1, -2, -3, 5, 6], range, 0)).toBeNull(); // 2 of 5 above
    expect(stateValuesOutsidePossible([-1, -2, 4, 5, 6], range, 0)).toEqual({ side: 'above', median: 4, share: 0.6, states: 5 });
    expect(stateValuesOutsidePossible([-30, -20, -12, -1], range, 0)).toEqual({ side: 'below', median: -16, share: 0.75, states: 4 });
    expect(stateValuesOutsidePossible([1, 2, NaN], range, 0)).toBeNull();
    expect(stateValuesOutsidePossible([], range, 0)).toBeNull();
    expect(stateValuesOutsidePossible([5, 6], range, Number.NaN)).toBeNull();
  });

  it('fires on values at the very end in 1 − Φ(1) of logs, the allowance of one standard error', () => {
    expect(STATE_VALUE_ALLOWANCE).toBe(1);
    const rng = createRandom(11), range = { lower: -100, upper: 0 }, logs = 4000, sigma = 0.3;
    let fired = 0;
    const values = new Float64Array(51);
    for (let k = 0; k < logs; k++) {
      const shift = sigma * rng.normal();
      for (let i = 0; i < values.length; i++) values[i] = range.upper + shift + 0.01 * sigma * rng.normal();
      if (stateValuesOutsidePossible(values, range, sigma)) fired++;
    }
    const p = 0.158655, se = Math.sqrt((p * (1 - p)) / logs);
    expect(Math.abs(fired / logs - p)).toBeLessThan(4 * se);
  });

  it('takes up to the limit of rows at an even stride, all of them below it', () => {
    expect(Array.from(evenStride(5, 10))).toEqual([0, 1, 2, 3, 4]);
    const rows = evenStride(100_001, 20_000);
    expect(rows.length).toBe(20_000);
    expect(rows[0]).toBe(0);
    expect(rows[rows.length - 1]).toBeLessThan(100_001);
    expect(rows.every((r, i) => i === 0 || r > rows[i - 1])).toBe(true);
    expect(evenStride(10, 0).length).toBe(0);
  });
});
