/**
 * One writer for a value read with its uncertainty (figures/parts/uncertainNumber.ts), which the
 * figures, the app's tables, the report and the command line all call: an interval's ends to the
 * decimal place that gives its width three significant digits, the value to the same place; a
 * standard error to two significant digits and its value to that place (JCGM 100, the GUM, §7.2.2
 * and §7.2.6; common practice). The place is set by the uncertainty, never by the value's size, so a
 * value of a million or more stays in fixed notation on every host. Numbers worked by hand.
 */
import { describe, expect, it } from 'vitest';
import { formatEstimate, formatTick, formatValue, formatValueInInterval } from '../../src/figures/parts/tickFormat';
import { ASCII_MINUS, intervalAtPrecision, intervalDecimals, plainNumber, valueAtPrecision, valueInInterval, valueWithError } from '../../src/figures/parts/uncertainNumber';
import { valueInIntervalText } from '../../src/cli/uncertainNumberText';
import { estimateCells } from '../../src/pipeline/report/reportComparison';
import { intervalDetail } from '../../src/renderer/src/screens/findings/assessmentWords';
import type { IntervalEstimate } from '../../src/pipeline/assessment';
import { intervalText as cliInterval, atDecimals as cliAt, errorDecimals } from '../../src/cli/uncertainNumberText';
import { formatNumber as appNumber } from '../../src/renderer/src/format/numberFormat';
import { formatNumber as reportNumber } from '../../src/pipeline/report/htmlText';

describe('numbers at the precision of their interval', () => {
  it('takes the decimal place from three significant digits of the width', () => {
    expect(intervalDecimals([6.581, 10.34])).toBe(2); // width 3.76
    expect(intervalDecimals([-5.682, -5.002])).toBe(3); // width 0.680
    expect(intervalDecimals([11.88, 16.34])).toBe(2);
    expect(intervalDecimals([300, 4800])).toBe(0); // never below the units
    expect(intervalDecimals([1, 1])).toBeNull(); // zero width: the plain style
    expect(intervalDecimals(null)).toBeNull();
    expect(intervalDecimals([2e6, 2.0005e6])).toBe(0); // width 500: the value's size does not matter
    expect(intervalDecimals([2e6, 3e6])).toBeNull(); // an uncertainty of a million: the plain style
  });

  it('writes a figure label, a report or app cell and a terminal cell alike (the terminal with an ASCII minus)', () => {
    const iv: [number, number] = [6.5808, 10.3412];
    expect(formatValueInInterval(8.35823, iv)).toBe('8.36');
    expect(valueAtPrecision(8.35823, iv)).toBe('8.36');
    expect(intervalAtPrecision(iv)).toBe('[6.58, 10.34]');
    expect(valueAtPrecision(-0.77114, [-0.8871, -0.6598])).toBe('\u22120.771');
    expect(cliInterval([-0.8871, -0.6598])).toBe(intervalAtPrecision([-0.8871, -0.6598]).replace(/\u2212/g, '-'));
    expect(formatValueInInterval(44, [37.8, 50.2])).toBe('44.0'); // the trailing zero stays: one precision down a column
  });

  it('keeps a standard error to two significant digits and the value to its place (GUM §7.2.6)', () => {
    expect(valueWithError(13.7183, 1.2123)).toEqual({ value: '13.7', error: '1.2' });
    expect(valueWithError(-0.77114, 0.0756)).toEqual({ value: '\u22120.771', error: '0.076' });
    expect(valueWithError(8.3582, null).value).toBe('8.358'); // no error: four significant digits
  });

  it('writes one J alike on one screen: the ± s.e. table and chart go to the interval\'s place once there is one', () => {
    const iv: [number, number] = [6.5808, 10.3412];
    expect(valueWithError(8.35823, 1.0912)).toEqual({ value: '8.4', error: '1.1' }); // no interval yet: the ± rule (GUM §7.2.6)
    expect(valueWithError(8.35823, 1.0912, iv)).toEqual({ value: '8.36', error: '1.09' }); // as the answer table writes J
    expect(formatEstimate(8.35823, 1.0912)).toBe('8.4 ± 1.1');
    expect(formatEstimate(8.35823, 1.0912, iv)).toBe('8.36 ± 1.09');
    expect(formatEstimate(-0.77114, 0.0756, [-0.8871, -0.6598])).toBe('\u22120.771 ± 0.076');
    expect(valueWithError(8.35823, 1.0912, [1, 1])).toEqual({ value: '8.4', error: '1.1' }); // zero width: no interval rule
  });

  // A cost summed over a long horizon reaches millions (J = 1,234,567.9 ± 3.2). GUM §7.2.2 puts the
  // value at the error's place whatever its size; exponent form (1.235e6) would round by thousands.
  it('keeps a value of a million or more in fixed notation in the figures, the app and the report, as on the terminal', () => {
    expect(formatEstimate(1234567.891, 3.2)).toBe('1234567.9 ± 3.2');
    expect(valueWithError(1234567.891, 3.2)).toEqual({ value: '1234567.9', error: '3.2' });
    expect(cliAt(1234567.891, errorDecimals(3.2))).toBe('1234567.9');
    expect(intervalAtPrecision([1234500.2, 1234600.7])).toBe('[1234500, 1234601]');
    expect(formatValueInInterval(1234555.55, [1234500.2, 1234600.7])).toBe('1234556');
    expect(formatValue(1234567)).toBe('1,235,000'); // four significant digits, thousands grouped (a text, not an interval)
    expect(formatValue(-2.5e7)).toBe('\u221225,000,000');
    expect([appNumber(1234567), reportNumber(1234567, 4), plainNumber(1234567)]).toEqual(['1235000', '1235000', '1235000']);
    expect(formatTick(2500000, 0)).toBe('2,500,000'); // a tick label stays readable: grouped
    expect(formatTick(2.5e9, 0)).toBe('2.50\u00a0×\u00a010⁹'); // past eleven characters: exponent form (the stated width)
    expect(plainNumber(1.23456e-5)).toBe('1.235\u00a0×\u00a010⁻⁵');
  });
});

// The one writer of "a value with its interval" (valueInInterval): the rule in its doc comment, worked by hand.
describe('a value with its interval, by one writer', () => {
  it('puts the value and both ends at the place where the width has three significant digits (worked examples)', () => {
    // width 3.7604 → 3.76 at two decimals
    expect(valueInInterval(8.35823, [6.5808, 10.3412])).toEqual({ value: '8.36', interval: '[6.58, 10.34]', text: '8.36 [6.58, 10.34]' });
    // width 0.6702 → 0.670 at three decimals: a paired difference, known more closely than J, keeps its third decimal
    expect(valueInInterval(-5.3612, [-5.7031, -5.0329]).text).toBe('\u22125.361 [\u22125.703, \u22125.033]');
    // width 100.5 → the units: never fewer decimals than none, never exponent form
    expect(valueInInterval(1234555.55, [1234500.2, 1234600.7]).text).toBe('1234556 [1234500, 1234601]');
    // width 0.000412 → 0.000412 at six decimals
    expect(valueInInterval(0.0123456, [0.0121234, 0.0125354]).text).toBe('0.012346 [0.012123, 0.012535]');
  });

  it('writes ends that differ wherever the rule applies (its promise: at least 100 units of the last digit apart)', () => {
    for (const width of [1.1e-8, 3.3e-7, 0.00999, 0.0101, 0.5, 0.999, 1, 7.77, 99.9, 123, 98765]) {
      const [lo, hi] = valueInInterval(1, [1 - width / 3, 1 + (2 * width) / 3]).interval.slice(1, -1).split(', ');
      expect(lo, `width ${width}`).not.toBe(hi);
    }
    // Past ten decimals the plain style (four significant digits) takes over, and an interval of J near 1 that narrow reads as one number: left as it is.
    expect(valueInInterval(1, [1 - 1e-9, 1 + 1e-9]).interval).toBe('[1, 1]');
  });

  it('says the value alone without an interval, and the terminal writes the same digits with its ASCII minus', () => {
    expect(valueInInterval(8.35823, null)).toEqual({ value: '8.358', interval: '—', text: '8.358' });
    expect(valueInIntervalText(-5.3612, [-5.7031, -5.0329])).toBe('-5.361 [-5.703, -5.033]');
    expect(valueInInterval(-5.3612, [-5.7031, -5.0329], ASCII_MINUS).text).toBe(valueInIntervalText(-5.3612, [-5.7031, -5.0329]));
  });

  it('writes a bootstrap s.e. beside its interval alike in the app\'s tooltip, the report and on the terminal', () => {
    // The rate-limit candidate of the heating-loop sample, rounded: the report wrote "1.8" where the app and the terminal wrote "1.83".
    const e: IntervalEstimate = { value: 10.6912, standardError: 1.8314, percentile: [7.7312, 13.8587], basic: [7.5237, 13.6512], replicates: 1000, failedReplicates: 0, covers: '' };
    expect(valueWithError(e.value, e.standardError, e.percentile)).toEqual({ value: '10.69', error: '1.83' });
    expect(intervalDetail(e, 0.9)).toContain('bootstrap s.e. 1.83;');
    expect(estimateCells(e).html).toMatch(/>10\.69<\/td><td class="num">1\.83<\/td>/);
  });
});
