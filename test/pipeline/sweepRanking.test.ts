/**
 * The ranking verdict of a sweep with crossed points (src/pipeline/sweepRanking.ts) and its words
 * (src/figures/charts/sensitivity.ts rankingVerdict): a setting where a J is crossed is left out —
 * the project's own as well, since a ranking read against a J that cannot be right vouches for
 * nothing — and the settings kept are compared with each other. Invented values.
 */
import { describe, expect, it } from 'vitest';
import { sweepRanking } from '../../src/pipeline/sweepRanking';
import { rankingVerdict, sweepsVerdict } from '../../src/figures/charts/sensitivity';
import type { SensitivitySeries } from '../../src/pipeline/assessment';

const settings = [0.9025, 0.934, 0.95, 0.966, 0.975];
const serie = (name: string, values: number[], crossed?: number[]): SensitivitySeries => ({
  name, values, status: values.map(() => 'converged'), ...(crossed ? { beyondPossible: values.map((_, i) => crossed.includes(i)) } : {}),
});

describe('the ranking verdict of a sweep with crossed points', () => {
  it('leaves out the project’s own setting when its J is crossed, and compares the others with each other', () => {
    // Cost sense (sign −1: lower is better). "A" is crossed at the project's setting (index 2), where it alone ranks first.
    const series = [serie('A', [5, 6, 1, 8, 9], [2]), serie('B', [4, 5, 6, 7, 8])];
    const ranking = sweepRanking(settings, series, -1);
    expect(ranking.leftOut).toEqual([2]);
    expect(ranking.rankingStable).toBe(true); // B before A at every setting kept
    const curve = { ...ranking, settings, parameter: 'discount' };
    expect(rankingVerdict(curve)).toBe('the ranking is the same at every setting without a crossed J (left out: 0.95, where a J is crossed)');
    expect(sweepsVerdict([{ ...ranking, series }])).toMatch(/^the ranking is the same at every setting without a crossed J; some J are crossed/);
  });

  it('says the ranking changes where it changes between settings kept', () => {
    const series = [serie('A', [3, 6, 7, 8, 1], [4]), serie('B', [4, 5, 6, 7, 8])];
    const ranking = sweepRanking(settings, series, -1);
    expect(ranking).toEqual({ rankingStable: false, leftOut: [4] });
    expect(rankingVerdict({ ...ranking, settings, parameter: 'discount' })).toBe('the ranking changes between the settings without a crossed J (left out: 0.975, where a J is crossed)');
  });

  it('compares nothing when fewer than two settings are kept, and says so', () => {
    const series = [serie('A', [3, 6, 7, 8, 1], [0, 1, 3, 4]), serie('B', [4, 5, 6, 7, 8])];
    const ranking = sweepRanking(settings, series, -1);
    expect(rankingVerdict({ ...ranking, settings, parameter: 'discount' })).toMatch(/^too few settings without a crossed J to compare the ranking \(left out: 0\.902, 0\.934, 0\.966, 0\.975,/);
  });

  it('without crosses, compares every setting as before', () => {
    const series = [serie('A', [5, 6, 7, 8, 9]), serie('B', [4, 5, 6, 7, 10])];
    expect(sweepRanking(settings, series, -1)).toEqual({ rankingStable: false });
    expect(sweepRanking(settings, series.slice(0, 1), -1)).toEqual({ rankingStable: true });
  });
});
