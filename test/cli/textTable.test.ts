/**
 * The terminal's text table: columns three spaces apart, numbers right-aligned, and no line ending in
 * spaces (a retune map's rows without the "◀ best supported" marker printed 20 trailing spaces each).
 * Our layout rules, not an outside fact.
 */
import { describe, expect, it } from 'vitest';
import { textTable } from '../../src/cli/textTable';

describe('the text table', () => {
  it('aligns numbers right, a first column of names and a last column of words left, and ends no line in spaces', () => {
    const rows = [['K_c', 'J', 'support', ''], ['10', '8.80', 'supported', '◀ best supported'], ['20', '19.4', 'beyond the logs (serious)', '']];
    expect(textTable(rows, false, true).split('\n')).toEqual([
      'K_c      J                     support',
      ' 10   8.80                   supported   ◀ best supported',
      ' 20   19.4   beyond the logs (serious)',
    ]);
    expect(textTable([['policy', 'J', ''], ['a', '1.0', '']])).toBe('policy     J\na        1.0');
  });
});
