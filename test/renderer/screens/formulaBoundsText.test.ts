/**
 * The sentence beside a reward formula in the editor says what the formula keeps whatever its
 * columns hold (src/data/expressionBounds.ts). Closed forms: a square is never negative; 20^x > 0,
 * so 0.1·(20^x − 1)/19 > −0.1/19 = −0.0052631…, said rounded outward as −0.005264; clamp stays within its limits.
 */
import { describe, expect, it } from 'vitest';
import { formulaBoundsText } from '../../../src/renderer/src/screens/plantLog/formulaBoundsText';

describe('the editor\'s sentence on a formula\'s bounds', () => {
  it('names the floor of a cost and both ends of a clamped reward', () => {
    expect(formulaBoundsText('(zone_temp_c - 21)^2', 'cost', false)).toBe('This cost is never below 0 on any row, whatever the plant does (read from the formula): a range to report is cut where that puts it out of reach of every policy.');
    expect(formulaBoundsText('(t - 21)^2 + 0.1 * (20^(v / 100) - 1) / 19', 'cost', false)).toContain('never below −0.005264 on any row'); // rounded outward: the floor is −0.0052631…
    expect(formulaBoundsText('clamp(x, -1, 1)', 'reward', false)).toContain('never below −1 nor above 1');
  });

  it('reads a decimal comma where the file uses one, and says nothing of a formula that bounds nothing or does not parse', () => {
    expect(formulaBoundsText('max(x^2; 0,5)', 'cost', true)).toContain('never below 0.5');
    expect(formulaBoundsText('x - y', 'cost', false)).toBeNull();
    expect(formulaBoundsText('(x - ', 'cost', false)).toBeNull();
  });
});
