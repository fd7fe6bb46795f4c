/**
 * The import's statistics table writes a column's min, max, mean and standard deviation at one
 * decimal place (four significant digits on the larger end), so no cell looks less precise than its
 * neighbours. Values from the tank-levels sample's import screen (hand-checked places).
 */
import { describe, expect, it } from 'vitest';
import { statisticsText } from '../../../src/renderer/src/screens/plantLog/columnStatisticsText';

describe('statisticsText', () => {
  it('writes one row at one place: "1.200", not "1.2", beside "1.042"', () => {
    expect(statisticsText(1.042, 1.355, 1.19996, 0.027341)).toEqual(['1.042', '1.355', '1.200', '0.027']);
    expect(statisticsText(29.43, 59.95, 45.0004, 4.083)).toEqual(['29.43', '59.95', '45.00', '4.08']);
    expect(statisticsText(0.0002505, 4.625, 0.3259, 0.331)).toEqual(['0.000', '4.625', '0.326', '0.331']);
    expect(statisticsText(-12.5, 3, -2.25, 4)).toEqual(['−12.50', '3.00', '−2.25', '4.00']);
  });

  it('keeps the plain style where one place would hide the values or run long', () => {
    expect(statisticsText(1e-6, 3e-6, 2e-6, 1e-6)).toEqual(['1\u00a0×\u00a010⁻⁶', '3\u00a0×\u00a010⁻⁶', '2\u00a0×\u00a010⁻⁶', '1\u00a0×\u00a010⁻⁶']);
    expect(statisticsText(0, 0, 0, 0)).toEqual(['0', '0', '0', '0']);
    expect(statisticsText(12345678, 23456789, 2e7, 1e6)).toEqual(['12345678', '23456789', '20000000', '1000000']);
  });
});
