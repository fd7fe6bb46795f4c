/**
 * The retune map's words, shared by its heat map and its curve: what a point's support means,
 * which way is better, the line under the title, and the readout of one point.
 */
import type { MapSupport, RetuneMapData } from './figureData';
import { PRESENT_CONTROLLER, type Theme } from '../parts/plotTheme';
import { plainText } from '../parts/richText';
import { formatValueInInterval, tuningValueTexts } from '../parts/tickFormat';
import { shownMap } from '../parts/tuningAxis';
import { intervalAtPrecision, TRUE_MINUS, valueInLevelledInterval, type Minus } from '../parts/uncertainNumber';

export interface RetuneMapPlotProps {
  map: RetuneMapData;
  /** What J is, with units, for the colour bar or value axis (e.g. "J, discounted cost (kWh)"). */
  valueLabel: string;
  sense: 'cost' | 'reward';
  title: string;
  theme: Theme;
}

/** The props with the map's tuning values in their shown units (tuningAxis.ts shownMap: an integral time in minutes from 10 min). */
export function shownProps(props: RetuneMapPlotProps): RetuneMapPlotProps {
  const map = shownMap(props.map);
  return map === props.map ? props : { ...props, map };
}

/** The words for a point's support, the same levels as the candidates' (src/core/diagnostics/severity.ts). */
export function supportWords(support: MapSupport): string {
  if (support === null) return 'supported by the logs';
  if (support === 'caution') return 'thin logs (caution)';
  if (support === 'serious') return 'beyond the logs (serious)';
  return 'support not known (no shift measure)';
}

export function betterWords(sense: 'cost' | 'reward'): string {
  return sense === 'cost' ? 'lower is better' : 'higher is better';
}

/**
 * The best supported point's J with its interval and the interval's level, "6.74, 90 % interval [4.88, 8.88]"
 * (valueInLevelledInterval): the one writer of the map's headline J for the app, the figure's text, the
 * report and the command line (which passes its ASCII minus); null without a best point.
 */
export function bestValueText(map: RetuneMapData, minus: Minus = TRUE_MINUS): string | null {
  return map.best ? valueInLevelledInterval(map.best.value, map.points[map.best.index].interval, map.level, minus) : null;
}

/**
 * The present controller's J at the precision of the best supported point's interval, so the two read
 * side by side at one precision (the report's caption and the command line use the same); without a
 * best point, four significant digits.
 */
export function presentValueText(map: RetuneMapData): string {
  return map.presentController === null ? '' : formatValueInInterval(map.presentController, map.best ? map.points[map.best.index].interval : null);
}

/** The line under the title: what the colour or line means, and the present controller's J. */
export function mapSubtitle(props: RetuneMapPlotProps, what: 'Colour' | 'Line'): string {
  const present = props.map.presentController;
  return `${what}: ${plainText(props.valueLabel)}, ${betterWords(props.sense)}`
    + (present === null ? '' : `; ${PRESENT_CONTROLLER}: ${presentValueText(props.map)}${what === 'Colour' ? ' (dashed on the colour bar)' : ' (dashed)'}`);
}

/** The readout of point p: its coordinates, J with its interval, its support and, when not converged, its fit status. */
export function pointReadout(props: RetuneMapPlotProps, p: number): string[] {
  const point = props.map.points[p];
  const texts = tuningValueTexts(props.map.axes, point.coordinates), lines = props.map.axes.map((axis, a) => `${plainText(axis.label)}: ${texts[a]}`);
  const interval = point.interval ? ` ${intervalAtPrecision(point.interval)}` : '';
  lines.push(point.value === null ? 'J: no solution' : `J: ${formatValueInInterval(point.value, point.interval)}${interval}`, supportWords(point.support));
  if (point.status !== 'converged') lines.push(`fit: ${point.status}`);
  if (props.map.best?.index === p) lines.push('best supported point');
  return lines;
}
