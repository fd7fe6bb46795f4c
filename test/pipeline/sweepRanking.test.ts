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
    const curve = { ...ranking, settings, parameter: 'discount', projectIndex: 2 };
    expect(rankingVerdict(curve)).toBe('the ranking is the same at every setting without a crossed J (left out: 0.95, where a J is crossed)');
    expect(sweepsVerdict([{ ...ranking, series }])).toMatch(/^the ranking is the same at every setting without a crossed J; some J are crossed/);
  });

  it('says the ranking changes where it changes between settings kept', () => {
    const series = [serie('A', [3, 6, 7, 8, 1], [4]), serie('B', [4, 5, 6, 7, 8])];
    const ranking = sweepRanking(settings, series, -1, 2);
    // Kept: 0.902 (A 3 before B 4), 0.934, 0.95, 0.966 (B before A); against the project's 0.95 only 0.902 differs.
    expect(ranking).toEqual({ rankingStable: false, leftOut: [4], rankingChanges: [{ at: 0, swapped: [['A', 'B']] }] });
    expect(rankingVerdict({ ...ranking, settings, parameter: 'discount', projectIndex: 2 })).toBe(
      'the ranking changes between the settings without a crossed J: at 0.902, “A” ranks above “B”; the other way round at the project’s 0.95 (left out: 0.975, where a J is crossed)',
    );
  });

  it('compares nothing when fewer than two settings are kept, and says so', () => {
    const series = [serie('A', [3, 6, 7, 8, 1], [0, 1, 3, 4]), serie('B', [4, 5, 6, 7, 8])];
    const ranking = sweepRanking(settings, series, -1);
    expect(rankingVerdict({ ...ranking, settings, parameter: 'discount', projectIndex: 2 })).toMatch(/^too few settings without a crossed J to compare the ranking \(left out: 0\.902, 0\.934, 0\.966, 0\.975,/);
  });

  it('without crosses, compares every setting as before', () => {
    const series = [serie('A', [5, 6, 7, 8, 9]), serie('B', [4, 5, 6, 7, 10])];
    expect(sweepRanking(settings, series, -1, 2)).toEqual({ rankingStable: false, rankingChanges: [{ at: 4, swapped: [['A', 'B']] }] });
    expect(sweepRanking(settings, series.slice(0, 1), -1, 2)).toEqual({ rankingStable: true });
  });
});

describe('where the ranking changes, named against the project’s setting', () => {
  it('names each setting whose order differs, with the pairs that turn round, for a cost and for a reward', () => {
    // A polynomial-degree sweep 1, 2, 3 with the project at 2 (as in a sample whose degree-1 fit cannot follow a quadratic cost).
    const degrees = [1, 2, 3];
    const series = [serie('Tuned', [6.66, 8.36, 8.38]), serie('Trimmed', [6.46, 9.13, 9.16]), serie('logged return', [13.9, 13.9, 13.9])];
    const cost = sweepRanking(degrees, series, -1, 1);
    expect(cost.rankingChanges).toEqual([{ at: 0, swapped: [['Trimmed', 'Tuned']] }]);
    expect(rankingVerdict({ ...cost, settings: degrees, parameter: 'polynomialDegree', projectIndex: 1 })).toBe(
      'the ranking changes within this range: at 1, “Trimmed” ranks above “Tuned”; the other way round at the project’s 2',
    );
    // The same numbers read as rewards (higher is better): at 2 logged > Trimmed > Tuned, at 1 logged > Tuned > Trimmed.
    expect(sweepRanking(degrees, series, 1, 1)).toEqual({ rankingStable: false, rankingChanges: [{ at: 0, swapped: [['Tuned', 'Trimmed']] }] });
  });

  it('names at most three settings and three pairs each, and counts the rest', () => {
    const five = [1, 2, 3, 4, 5];
    // Project at 1 (index 0): A < B < C < D (cost). Every other setting reverses all four: six pairs turn round at each.
    const series = [serie('A', [1, 9, 9, 9, 9]), serie('B', [2, 8, 8, 8, 8]), serie('C', [3, 7, 7, 7, 7]), serie('D', [4, 6, 6, 6, 6])];
    const ranking = sweepRanking(five, series, -1, 0);
    expect(ranking.rankingChanges).toHaveLength(4);
    expect(ranking.rankingChanges![0].swapped).toHaveLength(6);
    expect(rankingVerdict({ ...ranking, settings: five, parameter: 'polynomialDegree', projectIndex: 0 })).toBe(
      'the ranking changes within this range: at 2, “D” ranks above “C”, “B” and “A” (3 more pairs); at 3, “D” ranks above “C”, “B” and “A” (3 more pairs); '
      + 'at 4, “D” ranks above “C”, “B” and “A” (3 more pairs); and at 1 more setting; each the other way round at the project’s 1',
    );
  });

  it('names the pairs of two candidates before those with the logged return, grouped by the one ranked above', () => {
    // The heating-loop sample's degree sweep as `evaluate --json` gave it (costs, project at degree 2, rounded here): at
    // degree 1 the rate-limited PI comes first, and the PI also passes the schedule. Before, the three pairs named were
    // the rate-limited PI's (the logged return's among them) and the PI over the schedule was counted as "1 more pair".
    const degrees = [1, 2, 3];
    const series = [serie('PI', [3.76, 7.72, 7.14]), serie('Schedule', [4.12, 7.12, 6.83]), serie('Rate-limited PI', [3.23, 10.69, 10.34]),
      { ...serie('logged return', [8.51, 8.51, 8.51]), reference: true }];
    const ranking = sweepRanking(degrees, series, -1, 1);
    expect(ranking.rankingChanges).toEqual([{ at: 0, swapped: [['Rate-limited PI', 'PI'], ['Rate-limited PI', 'Schedule'], ['PI', 'Schedule'], ['Rate-limited PI', 'logged return']] }]);
    expect(rankingVerdict({ ...ranking, settings: degrees, parameter: 'polynomialDegree', projectIndex: 1 })).toBe(
      'the ranking changes within this range: at 1, “Rate-limited PI” ranks above “PI” and “Schedule”, and “PI” above “Schedule” (1 more pair); each the other way round at the project’s 2',
    );
  });

  it('names the setting it compares with where the project’s own is left out', () => {
    // Project at 0.95 (index 2), crossed there; the first setting kept, 0.902, is the reference.
    const series = [serie('A', [3, 6, 1, 8, 9], [2]), serie('B', [4, 5, 6, 7, 8])];
    const ranking = sweepRanking(settings, series, -1, 2);
    expect(ranking.rankingChanges).toEqual([{ at: 1, swapped: [['B', 'A']] }, { at: 3, swapped: [['B', 'A']] }, { at: 4, swapped: [['B', 'A']] }]);
    expect(rankingVerdict({ ...ranking, settings, parameter: 'discount', projectIndex: 2 })).toBe(
      'the ranking changes between the settings without a crossed J: at 0.934, “B” ranks above “A”; at 0.966, “B” ranks above “A”; at 0.975, “B” ranks above “A”; '
      + 'each the other way round at the first setting without a crossed J, 0.902 (left out: 0.95, where a J is crossed)',
    );
  });

  it('holds a number in a name to its unit, so the sentence wraps between words', () => {
    // The heating-loop sample's names: at 1280 px the panel wrapped "PI with a 2 | %/min rate limit" (core/unitGroups.ts).
    const series = [serie('PI (25 %/K, 30 min)', [3.76, 7.72]), serie('PI with a 2 %/min rate limit', [3.23, 10.69])];
    const ranking = sweepRanking([1, 2], series, -1, 1);
    expect(rankingVerdict({ ...ranking, settings: [1, 2], parameter: 'polynomialDegree', projectIndex: 1 })).toBe(
      'the ranking changes within this range: at 1, “PI with a 2\u00a0%/min rate limit” ranks above “PI (25\u00a0%/K, 30\u00a0min)”; the other way round at the project’s 2',
    );
  });
});

describe('a setting where a fit gave no value', () => {
  it('is a gap in the line, not a change of ranking (review: "the ranking changes" where nothing turned round)', () => {
    // B has no J at 0.95 (its fit diverged there); A stays ahead of B wherever both have one.
    const series: SensitivitySeries[] = [
      { name: 'A', values: [4, 5, 6, 7, 8], status: Array(5).fill('converged') },
      { name: 'B', values: [5, 6, null, 8, 9], status: ['converged', 'converged', 'diverged', 'converged', 'converged'] },
    ];
    expect(sweepRanking(settings, series, -1, 2)).toEqual({ rankingStable: true });
    // Where B does turn round at another setting, it is a change, named against the project's setting's order (A alone there).
    const turned = series.map((s) => (s.name === 'B' ? { ...s, values: [3, 6, null, 8, 9] } : s));
    expect(sweepRanking(settings, turned, -1, 2).rankingStable).toBe(false);
  });
});

describe('two J equal at a setting (core/limits.ts RANKING_TIE_RELATIVE)', () => {
  // The degree sweep of the named-changes test above, with "Tuned" and "Trimmed" equal at the project's degree 2.
  const degrees = [1, 2, 3];
  const words = (ranking: ReturnType<typeof sweepRanking>) => rankingVerdict({ ...ranking, settings: degrees, parameter: 'polynomialDegree', projectIndex: 1 });

  it('names no turn where the two are exactly equal at the project’s setting', () => {
    const series = [serie('Tuned', [6.66, 7, 8.38]), serie('Trimmed', [6.46, 7, 8.2])];
    const ranking = sweepRanking(degrees, series, -1, 1);
    expect(ranking).toEqual({ rankingStable: true });
    expect(words(ranking)).toBe('the ranking is the same at every setting');
  });

  it('names no turn where they differ only by rounding (0.1 + 0.2 against 0.3, 7.000000000000001 against 7)', () => {
    // 0.1 + 0.2 = 0.30000000000000004 in binary64 (IEEE 754): one unit in the last place from 0.3, a relative 1.9e−16.
    const sum = [serie('Tuned', [6.66, 0.1 + 0.2, 8.38]), serie('Trimmed', [6.46, 0.3, 8.2])];
    expect(sweepRanking(degrees, sum, -1, 1)).toEqual({ rankingStable: true });
    // Before the rule, Trimmed (7) stood ahead of Tuned (7.000000000000001) at 2 and behind it nowhere else: a turn was
    // named at 1 and 3 only because the sort put one of two equal values first.
    const ulp = [serie('Tuned', [6.46, 7.000000000000001, 8.2]), serie('Trimmed', [6.66, 7, 8.38])];
    const ranking = sweepRanking(degrees, ulp, -1, 1);
    expect(ranking).toEqual({ rankingStable: true });
    expect(words(ranking)).toBe('the ranking is the same at every setting');
    // The same at a non-project setting: a tie at 3 is no turn against the project's order either.
    expect(sweepRanking(degrees, [serie('Tuned', [6.66, 8.36, 9.000000000000002]), serie('Trimmed', [6.46, 9.13, 9])], -1, 1).rankingChanges)
      .toEqual([{ at: 0, swapped: [['Trimmed', 'Tuned']] }]);
  });

  it('still names a real turn, one just above the rule', () => {
    // A relative 1e−7 gap, a hundred times the rule: Tuned is the cheaper at 2, Trimmed at 1 and 3.
    const series = [serie('Tuned', [6.66, 7, 8.38]), serie('Trimmed', [6.46, 7 * (1 + 1e-7), 8.2])];
    const ranking = sweepRanking(degrees, series, -1, 1);
    expect(ranking.rankingChanges).toEqual([{ at: 0, swapped: [['Trimmed', 'Tuned']] }, { at: 2, swapped: [['Trimmed', 'Tuned']] }]);
    expect(words(ranking)).toBe('the ranking changes within this range: at 1, “Trimmed” ranks above “Tuned”; at 3, “Trimmed” ranks above “Tuned”; each the other way round at the project’s 2');
  });
});

describe('two J near 0 at a setting (core/rankingTie.ts: the tie scale cannot vanish)', () => {
  const degrees = [1, 2, 3];
  // A reward project whose gains and costs cancel: J near 0. The logged rewards' mean magnitude 0.2 over 1/(1 − 0.9): S = 2 at every setting.
  const scales = [2, 2, 2];

  it('names no turn where two J equal to 0 differ only by rounding, one each side of 0', () => {
    // IEEE 754 binary64: (0.1 + 0.2) − 0.3 = 5.55e−17 and 0.1 + (0.2 − 0.3) − 5.55e−17 < 0: the same 0 by two sums.
    const zeroA = (0.1 + 0.2) - 0.3, zeroB = 0.1 + (0.2 - 0.3) - zeroA;
    // Reward sense: Tuned ahead at 1 and 3; at 2 the two are the same 0, Trimmed's rounded up and Tuned's down.
    const series = [serie('Tuned', [0.5, zeroB, 0.3]), serie('Trimmed', [0.4, zeroA, 0.2])];
    expect(sweepRanking(degrees, series, 1, 1, scales)).toEqual({ rankingStable: true });
    // Relative to max(|J|) alone, rounding of 1e−17 was a gap: a turn was named at 1 and 3.
    expect(sweepRanking(degrees, series, 1, 1).rankingChanges).toEqual([{ at: 0, swapped: [['Tuned', 'Trimmed']] }, { at: 2, swapped: [['Tuned', 'Trimmed']] }]);
  });

  it('still names a real turn near 0 and of mixed sign (−0.0004 against +0.0003), and ties two zeros', () => {
    const series = [serie('Tuned', [0.5, -0.0004, 0.3]), serie('Trimmed', [0.4, 0.0003, 0.2])];
    expect(sweepRanking(degrees, series, 1, 1, scales).rankingChanges).toEqual([{ at: 0, swapped: [['Tuned', 'Trimmed']] }, { at: 2, swapped: [['Tuned', 'Trimmed']] }]);
    expect(sweepRanking(degrees, [serie('Tuned', [0.5, 0, 0.3]), serie('Trimmed', [0.4, 0, 0.2])], 1, 1, scales)).toEqual({ rankingStable: true });
  });
});

describe('a tie at the project’s setting between two that turn round elsewhere', () => {
  it('still reads as a change: the tie names no pair against the project’s order, but the two settings either side differ', () => {
    // Cost sense. "Tuned" and "Trimmed" are equal at the project's degree 2; Trimmed is the cheaper at 1, Tuned at 3.
    const degrees = [1, 2, 3];
    const ranking = sweepRanking(degrees, [serie('Tuned', [6.66, 7, 8.2]), serie('Trimmed', [6.46, 7, 8.38])], -1, 1);
    expect(ranking.rankingStable).toBe(false);
    expect(ranking.rankingChanges).toBeUndefined();
    expect(rankingVerdict({ ...ranking, settings: degrees, parameter: 'polynomialDegree', projectIndex: 1 })).toBe('the ranking changes within this range');
  });
});
