/**
 * A drag on the trend turned into a time window: the pixel → time map of a linear axis (the
 * two-point line through the plot area's edges), the rounding step, and ends the importer reads
 * back. Expected times are worked by hand and, for dates, taken from Date.UTC (ECMAScript's own
 * calendar arithmetic, independent of the app's date reader).
 */
import { describe, expect, it } from 'vitest';
import { readTimestamp } from '../../../src/data/timestampCell';
import type { PlotFrame } from '../../../src/renderer/src/plots/chartMessages';
import { DRAG_MIN_PX, draggedSpan, draggedWindow, dragStepSeconds, timeAtPixel } from '../../../src/renderer/src/screens/plantLog/trendDrag';

/** 1000 px of plot from x = 100 to 1100 px showing 0 … 10 000 s: 10 s a pixel. */
const FRAME: PlotFrame = { left: 100, right: 1100, top: 20, bottom: 420, xAtLeft: 0, xAtRight: 10_000 };

describe('a pixel on the trend as a time', () => {
  it('maps the plot area linearly and holds pixels outside it at its edges', () => {
    expect(timeAtPixel(FRAME, 100)).toBe(0);
    expect(timeAtPixel(FRAME, 600)).toBe(5000);
    expect(timeAtPixel(FRAME, 1100)).toBe(10_000);
    expect(timeAtPixel(FRAME, 40)).toBe(0);
    expect(timeAtPixel(FRAME, 5000)).toBe(10_000);
  });

  it('rounds to the smallest listed step at least one pixel long: 10 s a pixel → 10 s; 550 s a pixel → 10 min', () => {
    expect(dragStepSeconds(FRAME)).toBe(10);
    expect(dragStepSeconds({ ...FRAME, xAtRight: 550_000 })).toBe(600);
    expect(dragStepSeconds({ ...FRAME, xAtRight: 500 })).toBe(1); // half a second a pixel: whole seconds
  });
});

describe('a drag as a window', () => {
  it('a press and release fewer than DRAG_MIN_PX apart is a click, not a window', () => {
    expect(draggedSpan(FRAME, 300, 300 + DRAG_MIN_PX - 1)).toBeNull();
    expect(draggedSpan(FRAME, 300, 300 + DRAG_MIN_PX)).not.toBeNull();
  });

  it('either direction gives the same window, ends rounded to the step: 301.4 px → 2014 s → 2010 s; 452.6 px → 3526 s → 3530 s', () => {
    expect(draggedSpan(FRAME, 301.4, 452.6)).toEqual({ fromSeconds: 2010, toSeconds: 3530 });
    expect(draggedSpan(FRAME, 452.6, 301.4)).toEqual({ fromSeconds: 2010, toSeconds: 3530 });
  });

  it('a drag past the plot area stops at the log’s end', () => {
    expect(draggedSpan(FRAME, 1000, 1500)).toEqual({ fromSeconds: 9000, toSeconds: 10_000 });
  });

  it('on a calendar clock the ends are written as dates that read back to the same second in either day/month order', () => {
    const from = Date.UTC(2025, 0, 13, 8, 0, 0) / 1000, to = Date.UTC(2025, 0, 13, 8, 59, 0) / 1000;
    const w = draggedWindow({ fromSeconds: from, toSeconds: to }, true, 'valve test');
    expect(w).toEqual({ from: '2025-01-13 08:00:00', to: '2025-01-13 08:59:00', reason: 'valve test' });
    expect(readTimestamp(String(w.from), '.')).toEqual({ dayFirst: from, monthFirst: from });
    expect(readTimestamp(String(w.to), ',')).toEqual({ dayFirst: to, monthFirst: to });
  });

  it('on an elapsed clock the ends are numbers of seconds', () => {
    expect(draggedWindow({ fromSeconds: 0, toSeconds: 600 }, false)).toEqual({ from: 0, to: 600, reason: '' });
  });
});
