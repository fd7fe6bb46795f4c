/** One severity rule, one text: every number a user reads comes from the constants the code applies. */
import { plainNumber } from '../../../src/figures/parts/uncertainNumber';
import { describe, expect, it } from 'vitest';
import { shareText } from '../../../src/core/shareText';
import {
  ACTION_SUPPORT_LIMITS, actionSupportFinding, actionSupportRuleText, EFFECTIVE_SHARE_LIMITS, effectiveShareFinding, effectiveShareRuleText,
  OCCUPANCY_SHIFT_LIMITS, occupancyShiftFinding, occupancyShiftRuleText, severityAbove, severityBelow,
} from '../../../src/core/diagnostics/severity';

describe('severity', () => {
  it('maps values to levels at exactly the stated limits', () => {
    const { caution, serious } = OCCUPANCY_SHIFT_LIMITS;
    expect(severityAbove(caution, OCCUPANCY_SHIFT_LIMITS)).toBeNull();
    expect(severityAbove(caution * 1.0001, OCCUPANCY_SHIFT_LIMITS)).toBe('caution');
    expect(severityAbove(serious, OCCUPANCY_SHIFT_LIMITS)).toBe('caution');
    expect(severityAbove(serious * 1.0001, OCCUPANCY_SHIFT_LIMITS)).toBe('serious');
    expect(severityAbove(NaN, OCCUPANCY_SHIFT_LIMITS)).toBeNull();
    expect(severityBelow(0.5 * EFFECTIVE_SHARE_LIMITS.serious, EFFECTIVE_SHARE_LIMITS)).toBe('serious');
    expect(severityBelow(EFFECTIVE_SHARE_LIMITS.caution, EFFECTIVE_SHARE_LIMITS)).toBeNull();
  });

  it('states the limits it applies in the rule texts', () => {
    expect(occupancyShiftRuleText()).toContain(`caution above ${OCCUPANCY_SHIFT_LIMITS.caution} times that level`);
    expect(occupancyShiftRuleText()).toContain(`serious above ${OCCUPANCY_SHIFT_LIMITS.serious} times`);
    expect(effectiveShareRuleText()).toContain(`caution below ${100 * EFFECTIVE_SHARE_LIMITS.caution}\u00a0%`);
    // Both limits by the one share writer (core/shareText.ts): "caution below 10 %, serious below 1 %", not "1.0 %" beside "10 %".
    expect(effectiveShareRuleText()).toContain(`caution below ${shareText(EFFECTIVE_SHARE_LIMITS.caution)}, serious below ${shareText(EFFECTIVE_SHARE_LIMITS.serious)} `);
    expect(effectiveShareRuleText()).not.toMatch(/\d\.0\u00a0%/);
    expect(actionSupportRuleText()).toContain(`serious above ${100 * ACTION_SUPPORT_LIMITS.serious}\u00a0%`);
  });

  it('writes findings whose level and limit agree with each other', () => {
    expect(occupancyShiftFinding(1.6, 1.0)).toBeNull();
    const caution = occupancyShiftFinding(6, 1.02)!;
    expect(caution.severity).toBe('caution');
    expect(caution.message).toMatch(/^Occupancy shift 6\.00 \(the present controller: 1\.02\), above the caution limit 4\.1: .* about 2\.4 times/);
    expect(occupancyShiftFinding(97, null)!.message).toMatch(/above the serious limit 10/);
    // The shift and the present controller's level at three significant digits, as the coverage sentence beside the warning writes them
    // (plainNumber(v, 3)): the two-valve screen review showed "3787.4 (the present controller: 28.32)" above "3790 … (28.3)".
    expect(occupancyShiftFinding(3787.4, 28.32)!.message).toMatch(/^Occupancy shift 3790 \(the present controller: 28\.3\), above the serious limit 283:/);
    // Where every weight is zero the checks are not applied: the warning says so rather than "rest on a few runs" (heating-loop sample, rate-limited PI).
    expect(effectiveShareFinding(0, 40, 20)!.message).toMatch(/no run’s worth of weight .* cannot be applied\.$/);
    expect(effectiveShareFinding(0, 40, 20)!.message).not.toContain('a few runs');
    expect(effectiveShareFinding(0.04, 40, 20)!.message).toMatch(/rest on less than one run\.$/);
    expect(effectiveShareFinding(3.4512, 40, 33)!.message).toContain(`effective size ${plainNumber(3.4512, 3)} of 40 runs`); // as the coverage sentence and the report's table
    for (const v of [1.234, 17.55, 283.2, 3787.4, 1.5e6]) expect(occupancyShiftFinding(1e9, v)!.message).toContain(`(the present controller: ${plainNumber(v, 3)})`);
    // Read against the present controller's own level when it is above 1 (runs that start away from where they spend their time).
    expect(occupancyShiftFinding(6, 3)).toBeNull();
    expect(occupancyShiftFinding(40, 3)).toMatchObject({ severity: 'serious', message: expect.stringMatching(/above the serious limit 30/) });
    expect(effectiveShareFinding(2, 300, 33)).toMatchObject({ severity: 'serious', topic: 'importanceWeights' });
    expect(effectiveShareFinding(20, 300, 33)!.message).toMatch(/effective size 20 of 300 runs \(below 10\u00a0%\)/);
    expect(effectiveShareFinding(20, 300, 33)!.message).toMatch(/the importance-sampling cross-checks rest on a few runs/);
    expect(actionSupportFinding(0.3, 20, 0.02)!.message).toMatch(/^On average 30\u00a0% .* \(the present controller itself: 2\u00a0%\)/);
  });

  // A shift of tens of thousands is common far from the logs, and a log of 100,000 runs is not rare:
  // their numbers in fixed notation, as the command line's ratioText writes the same shift, never "3.62e+4".
  it('writes large shifts and effective sizes in fixed notation, at the three significant digits of the coverage sentence beside them', () => {
    const shift = occupancyShiftFinding(36_180.4, 1.2)!.message;
    expect(shift).toMatch(/^Occupancy shift 36200 \(the present controller: 1\.20\), above the serious limit /);
    expect(shift).not.toMatch(/e\+/);
    expect(effectiveShareFinding(12_345.6, 1_000_000, 40)!.message).toMatch(/effective size 12300 of 1000000 runs/);
  });
});
