/**
 * A time axis in the log's own clock: ticks at round steps of time (10 s, 1 min, 15 min, 1 h,
 * 6 h, 1 d, 7 d …) rather than Chart.js's round numbers of seconds (which would put ticks at
 * 2,000 s, "33 min 20 s"), labelled as a reader writes times: "06:00", "1 Mar 06:00", "3 h".
 */
import { durationText } from '../../core/clockText';

/** Tick steps in seconds, smallest first (a choice: the steps a chart recorder's paper uses). */
const STEPS_SECONDS = [1, 2, 5, 10, 15, 30, 60, 120, 300, 600, 900, 1800, 3600, 7200, 10800, 21600, 43200, 86400, 172800, 604800, 1209600, 2592000];

/** The smallest round step that puts at most `maxTicks` ticks on [min, max]. */
export function timeStepSeconds(min: number, max: number, maxTicks: number): number {
  const span = Math.max(max - min, 1e-9);
  return STEPS_SECONDS.find((step) => span / step <= Math.max(1, maxTicks)) ?? Math.ceil(span / Math.max(1, maxTicks) / 2592000) * 2592000;
}

/** Ticks at whole multiples of the step (on a calendar clock, multiples of the step since midnight UTC of 1 Jan 1970, so 6 h steps fall on 00, 06, 12, 18). */
export function timeTicks(min: number, max: number, maxTicks: number): { values: number[]; stepSeconds: number } {
  const step = timeStepSeconds(min, max, maxTicks);
  const values: number[] = [];
  for (let t = Math.ceil(min / step) * step; t <= max + 1e-9 * step; t += step) values.push(t);
  return { values, stepSeconds: step };
}

const MONTHS = ['Jan', 'Feb', 'Mar', 'Apr', 'May', 'Jun', 'Jul', 'Aug', 'Sep', 'Oct', 'Nov', 'Dec'];
const two = (n: number): string => String(n).padStart(2, '0');

/** A tick's label: on a calendar clock "06:00", "06:00:30", "1 Mar 06:00" or "1 Mar" by step and span; elapsed time as a duration. */
export function timeTickLabel(seconds: number, calendar: boolean, stepSeconds: number, spanSeconds: number): string {
  if (!calendar) return durationText(seconds);
  const d = new Date(Math.round(seconds) * 1000);
  const day = `${d.getUTCDate()} ${MONTHS[d.getUTCMonth()]}`;
  const clock = `${two(d.getUTCHours())}:${two(d.getUTCMinutes())}${stepSeconds < 60 ? `:${two(d.getUTCSeconds())}` : ''}`;
  if (stepSeconds >= 86400) return day;
  return spanSeconds > 86400 ? `${day} ${clock}` : clock;
}
