/**
 * The retune map in the engineer's words: axis labels with their subscripts typeset ("K_c" →
 * K_{c}), the headline (best supported point with its J and interval, and the present
 * controller's J), the progress line, and the name of a map in a chooser. Never a parameter path.
 */
import type { RetuneMapResult } from '../../../../pipeline/retuneMaps';
import type { RetuneMapProgress } from '../../../../shared/workerMessages';
import { formatDuration } from '../../format/numberFormat';
import { tuningValueTexts } from '../../../../figures/parts/tickFormat';
import { shownMap } from '../../../../figures/parts/tuningAxis';
import { subscriptMarkup } from '../../../../figures/parts/richText';
import { valueAtPrecision } from '../../../../figures/parts/uncertainNumber';
import { bestValueText } from '../../../../figures/charts/retuneMapText';

/** "proportional gain K_c (%/°C)" → "proportional gain K_{c} (%/°C)" (the figures' rich-text markup). */
export const richAxisLabel = subscriptMarkup;

/** "proportional gain K_c (%/°C) = 90, integral time T_i (min) = 100" for point p, in the axes' shown units (tuningAxis.ts). */
export function pointText(given: RetuneMapResult, p: number): string {
  const map = shownMap(given), texts = tuningValueTexts(map.axes, map.points[p].coordinates); // as the map's axis labels them
  return map.axes.map((axis, a) => `${axis.label} = ${texts[a]}`).join(', ');
}

/**
 * The map's headline; the best point's J and the present controller's are written at the precision
 * of the best point's interval ("J 6.75, 90 % interval [4.88, 8.88] … J 8.57"), as every J beside its
 * interval, and the interval with its level where the map keeps it.
 */
export function headline(map: RetuneMapResult): string {
  const best = map.best ? map.points[map.best.index] : null, bestInterval = best?.interval ?? null;
  const present = map.presentController === null ? 'The present controller has no value to compare with.' : `Present controller: J ${valueAtPrecision(map.presentController, bestInterval)}.`;
  if (!map.best) return `No point of this map is both converged and supported by the logs. ${present}`;
  return `Best supported point: ${pointText(map, map.best.index)}, J ${bestValueText(map)}. ${present}`; // an interval is read with its level
}

/** "Map 1 of 2, point 37 of 100 (12 s)". */
export function mapProgressLine(progress: RetuneMapProgress | null): string {
  if (!progress) return 'Forming the sums shared by every point…';
  const map = progress.maps > 1 ? `Map ${progress.map + 1} of ${progress.maps}, point` : 'Point';
  return `${map} ${progress.pointsDone.toLocaleString('en-US')} of ${progress.pointsTotal.toLocaleString('en-US')} (${formatDuration(progress.elapsedMs)})…`;
}

export function mapFraction(progress: RetuneMapProgress | null): number {
  if (!progress || progress.pointsTotal === 0) return 0;
  return (progress.map + progress.pointsDone / progress.pointsTotal) / Math.max(1, progress.maps);
}

/** "PI (25 %/K, 30 min): proportional gain × integral time". */
export function mapName(map: RetuneMapResult): string {
  return `${map.candidate}: ${map.axes.map((a) => a.label.replace(/\s*\(.*\)$/, '')).join(' × ')}`;
}
