/**
 * Whether a sweep's ranking by J holds over its settings, the settings where some J is crossed
 * (SensitivitySeries.beyondPossible, assessSweepCheck.ts) left out — the project's own setting too:
 * a ranking read against a J that cannot be right would vouch for nothing. The verdict compares the
 * settings kept with each other, pair by pair among the J that exist (a missing J is not a change, nor
 * is a pair tied at either setting: core/rankingTie.ts); with fewer than two kept there
 * is nothing to compare, and
 * figures/charts/sensitivity.ts rankingVerdict says so.
 */
import type { RankingChange, SensitivityCurve, SensitivitySeries } from './assessment';
import { tiedValues } from '../core/rankingTie';

/**
 * projectIndex: the project's own setting, against whose order the changes are named (rankingChanges);
 * where it is left out, the first setting kept. sign: +1 where a larger J is better (a reward), −1 for a cost.
 * termScales: per setting, the size of the terms its J sum (core/rankingTie.ts rewardTermScale), below which
 * the tie rule's scale does not shrink; absent (hand-made series): the relative rule alone.
 */
export function sweepRanking(
  settings: readonly number[], series: readonly SensitivitySeries[], sign: number, projectIndex = 0, termScales: readonly number[] = [],
): Pick<SensitivityCurve, 'rankingStable' | 'leftOut' | 'rankingChanges'> {
  const orderAt = (i: number) => series.filter((s) => s.values[i] !== null).sort((x, y) => sign * ((y.values[i] as number) - (x.values[i] as number)));
  const leftOut = settings.flatMap((_, i) => (series.some((s) => s.beyondPossible?.[i]) ? [i] : []));
  const kept = settings.flatMap((_, i) => (leftOut.includes(i) ? [] : [i]));
  // Stable when no two policies stand the other way round at two kept settings, among the J each has: a fit with no value
  // at one setting (its status says why) leaves a gap in the line, not a change of ranking.
  const orders = new Map(kept.map((i) => [i, orderAt(i)]));
  const swapped = (i: number, j: number) => swappedPairs(orders.get(i)!, i, j, sign, termScales);
  const rankingStable = kept.every((i) => kept.every((j) => j <= i || swapped(i, j).length === 0));
  const reference = kept.includes(projectIndex) ? projectIndex : kept[0];
  // The pairs of two candidates first, those with the logged return's reference line after: the words name the first
  // few and count the rest, and on the heating-loop sample the one pair of candidates a degree-1 fit turns round was
  // the one counted, behind a pair with the logged return.
  const isReference = new Set(series.filter((s) => s.reference).map((s) => s.name));
  const withReference = ([a, b]: [string, string]) => (isReference.has(a) || isReference.has(b) ? 1 : 0);
  const rankingChanges = rankingStable || reference === undefined ? [] : kept.flatMap((i) => {
    const pairs = swapped(i, reference).sort((x, y) => withReference(x) - withReference(y));
    return pairs.length ? [{ at: i, swapped: pairs }] : [];
  });
  return { rankingStable, ...(leftOut.length ? { leftOut } : {}), ...(rankingChanges.length ? { rankingChanges } : {}) };
}

/**
 * The pairs [ahead, behind] as ranked in `order` (the series with a J at `at`, best first) whose two stand
 * the other way round at `reference`; a pair tied at either setting, or without a J at the reference, is no turn.
 */
function swappedPairs(order: readonly SensitivitySeries[], at: number, reference: number, sign: number, termScales: readonly number[]): RankingChange['swapped'] {
  return order.flatMap((ahead, k) => order.slice(k + 1).flatMap((behind): [string, string][] => (
    standing(ahead, behind, at, sign, termScales) > 0 && standing(ahead, behind, reference, sign, termScales) < 0 ? [[ahead.name, behind.name]] : [])));
}

/**
 * +1 where `a` ranks above `b` at setting i, −1 below, 0 where either has no J or the two are tied: within
 * RANKING_TIE_RELATIVE of the larger magnitude, or of the setting's term scale where that is larger
 * (core/rankingTie.ts says why), so that a pair equal at one setting up to rounding reads as neither order
 * there — near 0 too — and a sort that put one of two equal J first turns nothing round.
 */
function standing(a: SensitivitySeries, b: SensitivitySeries, i: number, sign: number, termScales: readonly number[]): number {
  const x = a.values[i], y = b.values[i];
  if (x === null || y === null || tiedValues(x, y, termScales[i] ?? 0)) return 0;
  return Math.sign(sign * (x - y));
}
