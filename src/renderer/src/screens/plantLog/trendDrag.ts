/**
 * A time window dragged on the trend: a pointer's horizontal position on the drawn plot area turned
 * into a time on the log's clock, and the two ends of a drag into a window the project can keep
 * (data.csv.excludedTimes), written as the form would write it. Pure, so the rules are tested
 * without a page; TrendWindowDrag.tsx is the gesture.
 *
 * The ends are rounded to a step no finer than one pixel of the plot (a "nice" step from
 * DRAG_STEPS_SECONDS), so a dragged window reads "08:10 to 09:00", not "08:09:47 to 08:59:13":
 * a pixel is all the pointer can say, and a rounder time is as true as a finer one.
 */
import { dateEntryText } from '../../../../core/clockText';
import type { ExcludedTime } from '../../../../project/schema';
import type { PlotFrame } from '../../plots/chartMessages';

/** Steps a dragged end is rounded to, in seconds (1 s to a week; a choice). */
export const DRAG_STEPS_SECONDS = [1, 2, 5, 10, 15, 30, 60, 120, 300, 600, 900, 1800, 3600, 7200, 10800, 21600, 43200, 86400, 604800] as const;

/** A press and release closer than this (CSS px) is a click, not a window (a choice: a hand's jitter). */
export const DRAG_MIN_PX = 4;

/** The pixel held inside the plot area. */
export function clampToFrame(frame: PlotFrame, px: number): number {
  return Math.min(frame.right, Math.max(frame.left, px));
}

/** The value on the x axis at a pixel of the plot area (clamped to it); the axis is linear. */
export function timeAtPixel(frame: PlotFrame, px: number): number {
  const width = frame.right - frame.left;
  if (!(width > 0)) return frame.xAtLeft;
  return frame.xAtLeft + ((clampToFrame(frame, px) - frame.left) / width) * (frame.xAtRight - frame.xAtLeft);
}

/** The smallest listed step at least as long as one pixel of the plot (the longest listed when a pixel is longer still). */
export function dragStepSeconds(frame: PlotFrame): number {
  const perPixel = Math.abs(frame.xAtRight - frame.xAtLeft) / Math.max(1, frame.right - frame.left);
  return DRAG_STEPS_SECONDS.find((step) => step >= perPixel) ?? DRAG_STEPS_SECONDS[DRAG_STEPS_SECONDS.length - 1];
}

/** A dragged window in seconds on the log's clock, ends rounded to the step; null for a click. */
export function draggedSpan(frame: PlotFrame, startPx: number, endPx: number): { fromSeconds: number; toSeconds: number } | null {
  const [a, b] = [clampToFrame(frame, startPx), clampToFrame(frame, endPx)].sort((p, q) => p - q);
  if (b - a < DRAG_MIN_PX) return null;
  const step = dragStepSeconds(frame);
  const from = Math.round(timeAtPixel(frame, a) / step) * step;
  const to = Math.max(from + step, Math.round(timeAtPixel(frame, b) / step) * step);
  return { fromSeconds: from, toSeconds: to };
}

/**
 * A window's end as the project keeps it: a date and time the importer reads back on a calendar
 * clock ("2025-01-13 08:00:00", ISO 8601 with a space, read the same whatever the file's day/month
 * order), else a plain number of seconds on the column's clock.
 */
export function windowEnd(seconds: number, calendar: boolean): number | string {
  return calendar ? dateEntryText(seconds) : Math.round(seconds * 1000) / 1000;
}

/** The window the project keeps for a drag: ends as the form would write them, no reason yet. */
export function draggedWindow(span: { fromSeconds: number; toSeconds: number }, calendar: boolean, reason = ''): ExcludedTime {
  return { from: windowEnd(span.fromSeconds, calendar), to: windowEnd(span.toSeconds, calendar), reason };
}
