/** The readable table of a retune map for the terminal: J, its interval and the support of every point, the best supported point marked. */
import type { RetuneMapResult } from '../pipeline/retuneMaps';
import { textTable } from './textTable';
import { tuningValueTexts } from '../figures/parts/tickFormat';
import { shownMap } from '../figures/parts/tuningAxis';
import { atDecimals, intervalText, ratioText, rowDecimals } from './uncertainNumberText';
import { shareText } from '../core/shareText';
import { valueColumnHead } from '../pipeline/valueUnitWords';
import { bestValueText } from '../figures/charts/retuneMapText';
import { ASCII_MINUS } from '../figures/parts/uncertainNumber';

/** A point's grid coordinates (a gain, an integral time) as the map's axes label them (figures/parts/tickFormat.ts tuningValueTexts), with the terminal's ASCII minus. */
const coordinatesText = (map: RetuneMapResult, coordinates: readonly number[]): string[] => tuningValueTexts(map.axes, coordinates).map((t) => t.replace(/\u2212/g, '-'));
const SUPPORT = { null: 'supported', caution: 'thin logs (caution)', serious: 'beyond the logs (serious)', unknown: 'unknown' } as const;

export function formatRetuneMap(given: RetuneMapResult, level: number, unit = ''): string {
  const map = shownMap(given); // tuning values in the units the figure shows (an integral time in minutes); --json keeps the project's seconds
  const rows = [[...map.axes.map((a) => a.label), valueColumnHead('J', unit), `${shareText(level)} interval`, 'occupancy shift', 'support', '']];
  map.points.forEach((p, i) => rows.push([
    ...coordinatesText(map, p.coordinates), p.value === null ? `no value (${p.status})` : atDecimals(p.value, rowDecimals(p.interval)),
    intervalText(p.interval), ratioText(p.occupancyShift), SUPPORT[String(p.support) as keyof typeof SUPPORT],
    map.best?.index === i ? '◀ best supported' : '',
  ]));
  // the present controller's J at the best point's precision, so the two read side by side
  const bestDecimals = map.best ? rowDecimals(map.points[map.best.index].interval) : null;
  const best = map.best ? `Best supported point: ${coordinatesText(map, map.best.coordinates).map((t, a) => `${map.axes[a].label} = ${t}`).join(', ')}, J ${bestValueText({ ...map, level: map.level ?? level }, ASCII_MINUS)}.`
    : 'No point is both converged and supported by the logs.';
  return [
    `Retune map of "${map.candidate}" (${map.points.length} points; ${map.features}):`,
    textTable(rows, false, true),
    best + (map.presentController === null ? '' : ` Present controller: J ${atDecimals(map.presentController, bestDecimals)}.`),
    ...map.notes.map((n) => `  ${n}`),
    '',
  ].join('\n');
}
