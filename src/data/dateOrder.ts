/**
 * Day-first or month-first for a whole file. "03/04/2024" alone cannot tell; a file can. A cell
 * valid only one way (a day above 12) decides; failing that, the reading whose timestamps run
 * forwards more often wins; failing that, day-first (the order of the dd.mm.yyyy and
 * dd/mm/yyyy forms this tool documents).
 */
export type DateOrder = 'dayFirst' | 'monthFirst';

export interface DateOrderDecision {
  order: DateOrder;
  /** True when some cell reads differently under the two orders. */
  ambiguous: boolean;
  /** Why this order, as a sentence fragment for the import report. */
  reason: string;
}

/** dayFirst, monthFirst: seconds under each reading per row; NaN where a reading is invalid or the cell was bad. */
export function decideDateOrder(dayFirst: Float64Array, monthFirst: Float64Array, lineOf: (row: number) => number): DateOrderDecision {
  let onlyDay = 0, onlyMonth = 0, firstOnlyDay = -1, firstOnlyMonth = -1, differing = 0;
  for (let i = 0; i < dayFirst.length; i++) {
    const d = dayFirst[i], m = monthFirst[i];
    if (Number.isNaN(d) && Number.isNaN(m)) continue;
    if (Number.isNaN(m)) { onlyDay++; if (firstOnlyDay < 0) firstOnlyDay = i; }
    if (Number.isNaN(d)) { onlyMonth++; if (firstOnlyMonth < 0) firstOnlyMonth = i; }
    if (d !== m) differing++;
  }
  if (differing === 0) return { order: 'dayFirst', ambiguous: false, reason: 'no date in the file depends on the day/month order' };
  // Cells that only one order can read outvote the others; the losers become bad cells.
  if (onlyDay > 0 && onlyDay >= onlyMonth) {
    return { order: 'dayFirst', ambiguous: true, reason: `line ${lineOf(firstOnlyDay)} has a day above 12 in first place, so dates read day first (dd/mm/yyyy)` };
  }
  if (onlyMonth > 0) {
    return { order: 'monthFirst', ambiguous: true, reason: `line ${lineOf(firstOnlyMonth)} has a day above 12 in second place, so dates read month first (mm/dd/yyyy)` };
  }
  const forwardDay = forwardSteps(dayFirst), forwardMonth = forwardSteps(monthFirst);
  if (forwardMonth > forwardDay) {
    return { order: 'monthFirst', ambiguous: true, reason: 'every day is 12 or below; timestamps run forwards more often when read month first (mm/dd/yyyy)' };
  }
  const alsoForward = forwardDay > forwardMonth ? ', which also keeps timestamps running forwards' : '';
  return { order: 'dayFirst', ambiguous: true, reason: `every day is 12 or below; dates read day first (dd/mm/yyyy), the documented default${alsoForward}` };
}

function forwardSteps(seconds: Float64Array): number {
  let count = 0, previous = NaN;
  for (let i = 0; i < seconds.length; i++) {
    if (Number.isNaN(seconds[i])) continue;
    if (seconds[i] >= previous) count++;
    previous = seconds[i];
  }
  return count;
}
