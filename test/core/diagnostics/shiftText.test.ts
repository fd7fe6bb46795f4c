/**
 * One writer for an occupancy shift (core/diagnostics/shiftText.ts): three significant digits with
 * trailing zeros kept (the common practice of writing a measured figure at a fixed count of
 * significant digits), so the present controller's shift reads "4.40" in the coverage sentence, the
 * warning and the retune map's note alike. Values by hand.
 */
import { describe, expect, it } from 'vitest';
import { shiftText } from '../../../src/core/diagnostics/shiftText';
import { occupancyShiftFinding } from '../../../src/core/diagnostics/severity';

describe('shiftText', () => {
  it('writes three significant digits with the trailing zeros, fixed notation', () => {
    expect(shiftText(4.4)).toBe('4.40');
    expect(shiftText(4.894)).toBe('4.89');
    expect(shiftText(17.6)).toBe('17.6');
    expect(shiftText(44)).toBe('44.0');
    expect(shiftText(1)).toBe('1.00');
    expect(shiftText(0.5)).toBe('0.500');
    expect(shiftText(3787.4)).toBe('3790');
    expect(shiftText(36_180)).toBe('36200');
  });

  it('rounds before it counts the places (9.996 is "10.0", not "10.00")', () => {
    expect(shiftText(9.996)).toBe('10.0');
    expect(shiftText(99.96)).toBe('100');
  });

  it('writes a dash for no value', () => {
    expect(shiftText(null)).toBe('—');
    expect(shiftText(Number.NaN)).toBe('—');
  });

  it('is the warning’s writer too: the present controller’s 4.4 reads "4.40" there', () => {
    expect(occupancyShiftFinding(20, 4.4)!.message).toMatch(/^Occupancy shift 20\.0 \(the present controller: 4\.40\), above the caution limit 17\.6/);
  });
});
