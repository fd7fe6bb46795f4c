/**
 * Whether a sweep's ranking by J holds over its settings, the settings where some J is crossed
 * (SensitivitySeries.beyondPossible, assessSweepCheck.ts) left out — the project's own setting too:
 * a ranking read against a J that cannot be right would vouch for nothing. The verdict compares the
 * settings kept with each other; with fewer than two kept there is nothing to compare, and
 * figures/charts/sensitivity.ts rankingVerdict says so.
 */
import type { SensitivityCurve, SensitivitySeries } from './assessment';

export function sweepRanking(
  settings: readonly number[], series: readonly SensitivitySeries[], sign: number,
): Pick<SensitivityCurve, 'rankingStable' | 'leftOut'> {
  const orderAt = (i: number) => series.filter((s) => s.values[i] !== null).sort((x, y) => sign * ((y.values[i] as number) - (x.values[i] as number))).map((s) => s.name).join('>');
  const leftOut = settings.flatMap((_, i) => (series.some((s) => s.beyondPossible?.[i]) ? [i] : []));
  const kept = settings.flatMap((_, i) => (leftOut.includes(i) ? [] : [orderAt(i)]));
  return { rankingStable: kept.every((order) => order === kept[0]), ...(leftOut.length ? { leftOut } : {}) };
}
