/**
 * Which data point the keyboard cursor moves to: arrow keys step through the values (a list), or
 * across the grid as seen on a heat map (up is increasing y, the next row of values); Home and End
 * go to the ends. Null leaves the cursor where it is (the key is not ours).
 */
import type { KeyNavigation } from './chartMessages';

export type KeyStep = (key: string, current: number, count: number) => number | null;

export const stepThroughIndex: KeyStep = (key, current, count) => {
  if (key === 'ArrowRight' || key === 'ArrowDown') return Math.min(count - 1, current + 1);
  if (key === 'ArrowLeft' || key === 'ArrowUp') return Math.max(0, current - 1);
  if (key === 'Home') return 0;
  if (key === 'End') return count - 1;
  return null;
};

/** Values in rows of nx (index iy·nx + ix), row iy drawn at increasing height. */
export function gridStep(nx: number): KeyStep {
  return (key, current, count) => {
    const ix = current % nx, iy = Math.floor(current / nx), ny = count / nx;
    if (key === 'ArrowRight') return iy * nx + Math.min(nx - 1, ix + 1);
    if (key === 'ArrowLeft') return iy * nx + Math.max(0, ix - 1);
    if (key === 'ArrowUp') return Math.min(ny - 1, iy + 1) * nx + ix;
    if (key === 'ArrowDown') return Math.max(0, iy - 1) * nx + ix;
    if (key === 'Home') return 0;
    if (key === 'End') return count - 1;
    return null;
  };
}

export function keyStepOf(keys: KeyNavigation): KeyStep {
  return keys.kind === 'grid' ? gridStep(keys.columns) : stepThroughIndex;
}

/** Keys the figure handles (the page stops their default scrolling). */
export const NAVIGATION_KEYS: ReadonlySet<string> = new Set(['ArrowRight', 'ArrowLeft', 'ArrowUp', 'ArrowDown', 'Home', 'End', 'Escape']);
