/**
 * A user's candidate name keeps each number with the unit after it when a narrow column wraps it
 * (core/unitGroups.ts): a value and its unit stay on one line (typographic practice; common practice —
 * the app's own numbers do it already, shareNoBreak.test.ts). The names are the heating-loop sample's
 * and invented ones; the expected texts are written out by hand, "~" standing for U+00A0.
 */
import { describe, expect, it } from 'vitest';
import { keepUnitGroups, UNIT_GROUP_MOST } from '../../src/core/unitGroups';

const shown = (name: string) => keepUnitGroups(name).replace(/\u00a0/g, '~');

describe('a name’s numbers held to their units', () => {
  it('holds a gain and an integral time to their units, and nothing else', () => {
    expect(shown('PI (25 %/K, 30 min)')).toBe('PI (25~%/K, 30~min)');
    expect(shown('PI with a 2 %/min rate limit')).toBe('PI with a 2~%/min rate limit');
    expect(shown('Outdoor reset schedule + P trim')).toBe('Outdoor reset schedule + P trim');
    expect(shown('reset at −2 °C, 0.5 m³/h; 3 s')).toBe('reset at −2~°C, 0.5~m³/h; 3~s');
  });

  it('leaves a number before a bracket, a sign or another number, and a long word after one', () => {
    expect(shown('loop 2 (spare)')).toBe('loop 2 (spare)');
    expect(shown('trim 1 + 2 K')).toBe('trim 1 + 2~K');
    expect(shown('PI 3 4 s')).toBe('PI 3 4~s');
    const long = 'x'.repeat(UNIT_GROUP_MOST + 1), short = 'x'.repeat(UNIT_GROUP_MOST);
    expect(shown(`2 ${long}`)).toBe(`2 ${long}`); // no group wider than a unit: a name still wraps in a narrow column
    expect(shown(`2 ${short}`)).toBe(`2~${short}`);
  });

  it('changes only spaces, one for one: the name reads and copies as the user wrote it', () => {
    for (const name of ['PI (25 %/K, 30 min)', 'PI with a 2 %/min rate limit', 'a  2  min']) {
      expect(keepUnitGroups(name).replace(/\u00a0/g, ' ')).toBe(name);
    }
  });
});
