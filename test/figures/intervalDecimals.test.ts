/**
 * One precision for a value read with its interval (figures/parts/tickFormat.ts): the ends to the
 * decimal place that gives the width three significant digits, the value to the same place. The
 * rule is the usual one for a result and its uncertainty (JCGM 100, the GUM, §7.2.2; common
 * practice), applied to an interval's width; the report's tables (pipeline/report/intervalPrecision.ts)
 * and the app's Findings (renderer assessmentWords.ts, intervalText) write the same digits.
 */
import { describe, expect, it } from 'vitest';
import { formatEstimate, formatValueInInterval, intervalDecimals } from '../../src/figures/parts/tickFormat';
import { estimateText } from '../../src/renderer/src/format/numberFormat';
import { intervalAtPrecision, valueAtPrecision, valueWithError } from '../../src/pipeline/report/intervalPrecision';
import { intervalText, valueAtIntervalPrecision } from '../../src/renderer/src/screens/findings/assessmentWords';

describe('numbers at the precision of their interval', () => {
  it('takes the decimal place from three significant digits of the width', () => {
    expect(intervalDecimals([6.581, 10.34])).toBe(2); // width 3.76
    expect(intervalDecimals([-5.682, -5.002])).toBe(3); // width 0.680
    expect(intervalDecimals([11.88, 16.34])).toBe(2);
    expect(intervalDecimals([300, 4800])).toBe(0); // never below the units
    expect(intervalDecimals([1, 1])).toBeNull(); // zero width: the plain style
    expect(intervalDecimals(null)).toBeNull();
    expect(intervalDecimals([2e6, 3e6])).toBeNull(); // exponent form there
  });

  it('writes a figure label, a report cell and an app cell alike', () => {
    const iv: [number, number] = [6.5808, 10.3412];
    expect(formatValueInInterval(8.35823, iv)).toBe('8.36');
    expect(valueAtPrecision(8.35823, iv)).toBe('8.36');
    expect(valueAtIntervalPrecision(8.35823, iv)).toBe('8.36');
    expect(intervalAtPrecision(iv)).toBe('[6.58, 10.34]');
    expect(intervalAtPrecision(iv)).toBe(intervalText(iv));
    expect(valueAtPrecision(-0.77114, [-0.8871, -0.6598])).toBe('\u22120.771');
    expect(formatValueInInterval(44, [37.8, 50.2])).toBe('44.0'); // the trailing zero stays: one precision down a column
  });

  it('keeps a standard error to two significant digits and the value to its place (GUM §7.2.6)', () => {
    expect(valueWithError(13.7183, 1.2123)).toEqual({ value: '13.7', error: '1.2' });
    expect(valueWithError(-0.77114, 0.0756)).toEqual({ value: '\u22120.771', error: '0.076' });
    expect(valueWithError(8.3582, null).value).toBe('8.358'); // no error: four significant digits
  });

  it('writes one J alike on one screen: the ± s.e. table and chart go to the interval\'s place once there is one', () => {
    const iv: [number, number] = [6.5808, 10.3412];
    expect(estimateText(8.35823, 1.0912)).toEqual({ value: '8.4', error: '1.1' }); // no interval yet: the ± rule (GUM §7.2.6)
    expect(estimateText(8.35823, 1.0912, iv)).toEqual({ value: '8.36', error: '1.09' }); // as the answer table writes J
    expect(estimateText(8.35823, 1.0912, iv).value).toBe(valueAtIntervalPrecision(8.35823, iv));
    expect(formatEstimate(8.35823, 1.0912)).toBe('8.4 ± 1.1');
    expect(formatEstimate(8.35823, 1.0912, iv)).toBe('8.36 ± 1.09');
    expect(formatEstimate(-0.77114, 0.0756, [-0.8871, -0.6598])).toBe('\u22120.771 ± 0.076');
    expect(estimateText(8.35823, 1.0912, [1, 1])).toEqual({ value: '8.4', error: '1.1' }); // zero width: no interval rule
  });
});
