/**
 * The command line's baseline line names each action beside its offset and dither when the present
 * controller has several (with two valves the order alone leaves the reader guessing), and reads as
 * before with one, or for results saved without the action names.
 */
import { describe, expect, it } from 'vitest';
import { centreText, perAction } from '../../src/cli/formatEvaluation';

describe('the present controller’s numbers per action', () => {
  it('names each action when there are several', () => {
    expect(perAction('offset', [0.31, 0.69], ['hot_valve', 'cold_valve'])).toBe('offset 0.31 on hot_valve, 0.69 on cold_valve');
  });
  it('reads as before with one action or without names', () => {
    expect(perAction('dither', [4], ['heating_valve_pct'])).toBe('dither 4');
    expect(perAction('dither', [0.1, 0.1], undefined)).toBe('dither 0.1, 0.1');
    // each value in its action's declared unit (the screens review found the baseline line without units)
    expect(perAction('dither', [4], ['heating_valve_pct'], ['%'])).toBe('dither 4 %');
    expect(perAction('offset', [0.31, 0.69], ['hot_valve', 'cold_valve'], ['', 'm³/h'])).toBe('offset 0.31 on hot_valve, 0.69 m³/h on cold_valve');
  });
});

describe('where the modelled present controller sits', () => {
  const model = { offset: [392.7], gain: [[-14.4, 0.1, 0]], std: [10.07], lo: [null], hi: [100], actions: ['heating_valve_pct'], units: ['%'] };
  it('gives its mean action at the mean logged state, not the offset at the state 0', () => {
    expect(centreText({ ...model, meanAtMeanState: [78.4] })).toBe('linear in the state: mean 78.4 % at the mean logged state, before the limits');
  });
  it('says “before the limits” only where the log shows a limit (the tank sample, with none, read “before the limits; … none seen”)', () => {
    expect(centreText({ ...model, hi: [null], meanAtMeanState: [45] })).toBe('linear in the state: mean 45 % at the mean logged state');
    expect(centreText({ ...model, lo: [0], hi: [null], meanAtMeanState: [45] })).toBe('linear in the state: mean 45 % at the mean logged state, before the limits');
  });
  it('reads the offset for results saved before the mean was kept', () => {
    expect(centreText(model)).toBe('offset 392.7 %');
  });
});
