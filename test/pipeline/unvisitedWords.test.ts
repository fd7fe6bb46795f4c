/** The unvisited share's caution: one limit (core/diagnostics/unvisitedRegion.ts) for the rule and the words that state it. */
import { describe, expect, it } from 'vitest';
import { UNVISITED_CAUTION_SHARE, unvisitedNeedsCaution } from '../../src/core/diagnostics/unvisitedRegion';
import { shareText } from '../../src/core/shareText';
import { unvisitedWarningMessage } from '../../src/pipeline/unvisitedWords';

describe('the unvisited caution', () => {
  it('cautions above UNVISITED_CAUTION_SHARE, and the warning states that same limit', () => {
    expect(unvisitedNeedsCaution(null)).toBe(false);
    expect(unvisitedNeedsCaution(UNVISITED_CAUTION_SHARE)).toBe(false);
    expect(unvisitedNeedsCaution(UNVISITED_CAUTION_SHARE + 0.01)).toBe(true);
    // The words read the constant: the limit they state is the one the rule applies.
    expect(unvisitedWarningMessage(0.62)).toContain(`more than the ${shareText(UNVISITED_CAUTION_SHARE)} at which this is a caution`);
  });
});
