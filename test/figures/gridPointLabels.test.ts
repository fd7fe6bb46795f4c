import { describe, expect, it } from 'vitest';
import { gridPointLabels } from '../../src/figures/parts/tickFormat';

// The retune map's axes label grid points, often spaced by a constant ratio (integral times 300 s to
// 7,200 s). The screen review saw "583.8" beside "1,136" and "4,301" on one axis: one count of
// decimals per axis is common practice in engineering tables and plots (a column of one precision).
describe('gridPointLabels: one precision per grid axis', () => {
  const ratioGrid = (first: number, last: number, n: number) => Array.from({ length: n }, (_, k) => first * (last / first) ** (k / (n - 1)));

  it('writes integral times spaced by ratio with no decimals once the smallest has three digits', () => {
    const labels = gridPointLabels(ratioGrid(300, 7200, 11));
    expect(labels[0]).toBe('300');
    expect(labels[3]).toBe('778'); // 300 × 24^0.3 = 778.37 (worked by hand)
    expect(labels.every((l) => !l.includes('.'))).toBe(true);
    expect(labels.at(-1)).toBe('7,200');
  });

  it('gives every label the same decimals, enough that the smallest is within half a unit of its third digit', () => {
    const labels = gridPointLabels([0.5, 1, 2, 4, 8]);
    expect(labels).toEqual(['0.5', '1.0', '2.0', '4.0', '8.0']);
  });

  it('keeps neighbours apart on a fine grid', () => {
    const labels = gridPointLabels([100, 100.2, 100.4, 100.6]);
    expect(new Set(labels).size).toBe(4);
    expect(labels).toEqual(['100.0', '100.2', '100.4', '100.6']);
  });

  it('gains from 10 to 100 % per °C read as whole numbers', () => {
    expect(gridPointLabels([10, 20, 30, 40, 50, 60, 70, 80, 90, 100])).toEqual(['10', '20', '30', '40', '50', '60', '70', '80', '90', '100']);
  });
});
