/**
 * Checks the pipeline calls with what the file cannot know: actuator bounds, and the number of
 * features to be fitted. The rule of thumb of about ten observations per estimated coefficient
 * is common practice in regression (e.g. Harrell, "Regression Modeling Strategies", §4.4, from memory).
 */
import { describe, expect, it } from 'vitest';
import { checkActionBounds, checkEnoughTransitions } from '../../src/data/datasetChecks';
import { importDataset } from '../../src/data/importDataset';
import type { TransitionSet } from '../../src/core/transitions';

function transitions(valves: number[]): TransitionSet {
  const text = ['level,valve,reward', ...valves.map((v, i) => `${i},${v},0`)].join('\n');
  const result = importDataset(text, 'v.csv', { delimiter: ',', decimalMark: '.', badRows: 'stop' }, {
    states: [{ column: 'level', unit: '' }], actions: [{ column: 'valve', unit: '%' }],
    reward: { kind: 'column', column: 'reward', sense: 'reward' }, nextState: { kind: 'nextRow' }, episode: { kind: 'single' },
  });
  if (!result.ok) throw new Error(result.problems[0].message);
  return result.value.transitions;
}

describe('checkActionBounds', () => {
  it('counts logged actions outside the bounds and names the first lines', () => {
    const t = transitions([50, 120, 30, -5, 101, 99, 130, 140, 150, 160, 0]); // the last row has no transition
    const [warning, ...rest] = checkActionBounds(t, { lo: [0], hi: [100] });
    expect(rest).toEqual([]);
    expect(warning.kind).toBe('actions-outside-bounds');
    expect(warning.where).toBe('action valve');
    expect(warning.message).toBe('7 logged actions of 10 lie outside the actuator bounds [0, 100] (lines 3, 5, 6, 8, 9, …); check the units of the column and the bounds');
  });

  it('null means no limit on that side; values at a bound are inside', () => {
    const t = transitions([0, 100, 1e6, 7]);
    expect(checkActionBounds(t, { lo: [0], hi: [null] })).toEqual([]);
    expect(checkActionBounds(t, { lo: [null], hi: [100] })).toHaveLength(1);
  });
});

describe('checkEnoughTransitions', () => {
  it('fails below one transition per feature, warns below ten, passes from ten', () => {
    const fail = checkEnoughTransitions(27, 28);
    expect(fail.ok).toBe(false);
    if (!fail.ok) expect(fail.problems[0].message).toBe('27 transitions cannot determine 28 features; expected at least 28 (better 280): use more data or fewer features');
    const warn = checkEnoughTransitions(28, 28);
    expect(warn.ok && warn.warnings.length).toBe(1);
    const pass = checkEnoughTransitions(280, 28);
    expect(pass.ok && pass.warnings.length).toBe(0);
  });
});
