/**
 * Whether a sweep's ranking by J holds over its settings, the settings where some J is crossed
 * (SensitivitySeries.beyondPossible, assessSweepCheck.ts) left out — the project's own setting too:
 * a ranking read against a J that cannot be right would vouch for nothing. The verdict compares the
 * settings kept with each other, pair by pair among the J that exist (a missing J is not a change);
 * with fewer than two kept there is nothing to compare, and
 * figures/charts/sensitivity.ts rankingVerdict says so.
 */
import type { RankingChange, SensitivityCurve, SensitivitySeries } from './assessment';

/**
 * projectIndex: the project's own setting, against whose order the changes are named (rankingChanges);
 * where it is left out, the first setting kept. sign: +1 where a larger J is better (a reward), −1 for a cost.
 */
export function sweepRanking(
  settings: readonly number[], series: readonly SensitivitySeries[], sign: number, projectIndex = 0,
): Pick<SensitivityCurve, 'rankingStable' | 'leftOut' | 'rankingChanges'> {
  const orderAt = (i: number) => series.filter((s) => s.values[i] !== null).sort((x, y) => sign * ((y.values[i] as number) - (x.values[i] as number))).map((s) => s.name);
  const leftOut = settings.flatMap((_, i) => (series.some((s) => s.beyondPossible?.[i]) ? [i] : []));
  const kept = settings.flatMap((_, i) => (leftOut.includes(i) ? [] : [i]));
  // Stable when no two policies stand the other way round at two kept settings, among the J each has: a fit with no value
  // at one setting (its status says why) leaves a gap in the line, not a change of ranking.
  const orders = new Map(kept.map((i) => [i, orderAt(i)]));
  const rankingStable = kept.every((i) => kept.every((j) => j <= i || swappedPairs(orders.get(i)!, orders.get(j)!).length === 0));
  const reference = kept.includes(projectIndex) ? projectIndex : kept[0];
  // The pairs of two candidates first, those with the logged return's reference line after: the words name the first
  // few and count the rest, and on the heating-loop sample the one pair of candidates a degree-1 fit turns round was
  // the one counted, behind a pair with the logged return.
  const isReference = new Set(series.filter((s) => s.reference).map((s) => s.name));
  const withReference = ([a, b]: [string, string]) => (isReference.has(a) || isReference.has(b) ? 1 : 0);
  const rankingChanges = rankingStable || reference === undefined ? [] : kept.flatMap((i) => {
    const swapped = swappedPairs(orders.get(reference)!, orders.get(i)!).sort((x, y) => withReference(x) - withReference(y));
    return swapped.length ? [{ at: i, swapped }] : [];
  });
  return { rankingStable, ...(leftOut.length ? { leftOut } : {}), ...(rankingChanges.length ? { rankingChanges } : {}) };
}

/** The pairs [ahead, behind] as ranked in `order` whose two stand the other way round in `reference` (both ranked in each). */
function swappedPairs(reference: readonly string[], order: readonly string[]): RankingChange['swapped'] {
  const place = new Map(reference.map((name, i) => [name, i]));
  const ranked = order.filter((name) => place.has(name));
  return ranked.flatMap((ahead, i) => ranked.slice(i + 1).flatMap((behind): [string, string][] => (place.get(ahead)! > place.get(behind)! ? [[ahead, behind]] : [])));
}
