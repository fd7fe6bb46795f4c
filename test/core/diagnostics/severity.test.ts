/** One severity rule, one text: every number a user reads comes from the constants the code applies. */
import { describe, expect, it } from 'vitest';
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
    expect(effectiveShareRuleText()).toContain(`caution below ${100 * EFFECTIVE_SHARE_LIMITS.caution} %`);
    expect(effectiveShareRuleText()).toContain(`serious below ${(100 * EFFECTIVE_SHARE_LIMITS.serious).toFixed(1)} %`);
    expect(actionSupportRuleText()).toContain(`serious above ${100 * ACTION_SUPPORT_LIMITS.serious} %`);
  });

  it('writes findings whose level and limit agree with each other', () => {
    expect(occupancyShiftFinding(1.6, 1.0)).toBeNull();
    const caution = occupancyShiftFinding(6, 1.02)!;
    expect(caution.severity).toBe('caution');
    expect(caution.message).toMatch(/^Occupancy shift 6\.0 \(the present controller: 1\.02\), above the caution limit 4\.1: .* about 2\.4 times/);
    expect(occupancyShiftFinding(97, null)!.message).toMatch(/above the serious limit 10/);
    // Read against the present controller's own level when it is above 1 (runs that start away from where they spend their time).
    expect(occupancyShiftFinding(6, 3)).toBeNull();
    expect(occupancyShiftFinding(40, 3)).toMatchObject({ severity: 'serious', message: expect.stringMatching(/above the serious limit 30/) });
    expect(effectiveShareFinding(2, 300, 33)).toMatchObject({ severity: 'serious', topic: 'importanceWeights' });
    expect(effectiveShareFinding(20, 300, 33)!.message).toMatch(/effective size 20\.0 of 300 runs \(below 10 %\)/);
    expect(effectiveShareFinding(20, 300, 33)!.message).toMatch(/the importance-sampling cross-checks rest on a few runs/);
    expect(actionSupportFinding(0.3, 20, 0.02)!.message).toMatch(/^On average 30 % .* \(the present controller itself: 2\.0 %\)/);
  });

  // A shift of tens of thousands is common far from the logs, and a log of 100,000 runs is not rare:
  // their numbers in fixed notation, as the command line's ratioText writes the same shift, never "3.62e+4".
  it('writes large shifts and effective sizes in fixed notation', () => {
    const shift = occupancyShiftFinding(36_180.4, 1.2)!.message;
    expect(shift).toMatch(/^Occupancy shift 36180 \(the present controller: 1\.20\), above the serious limit /);
    expect(shift).not.toMatch(/e\+/);
    expect(effectiveShareFinding(12_345.6, 1_000_000, 40)!.message).toMatch(/effective size 12346 of 1000000 runs/);
  });
});
