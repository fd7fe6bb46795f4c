/**
 * Which groups of a trend's envelope (signalEnvelope.ts: `rowsPerGroup` consecutive rows each) hold
 * rows of a range of runs left out (data.csv.excludedRuns), so the trend can show them: a group is
 * marked with the first such row's range, so a band drawn over the marked groups reaches every row
 * of the range, at most one group (about a pixel column) past it at each end.
 *
 * inRange: records, 1 + the range's index or 0 (data/runRanges.ts recordsInRunRanges).
 * Returns groups: 1 + the range's index, or 0 for a group with no row left out by label.
 */
export function groupsLeftOut(inRange: Uint16Array, rowsPerGroup: number, groups: number): Uint16Array {
  const marked = new Uint16Array(groups);
  for (let g = 0; g < groups; g++) {
    for (let r = g * rowsPerGroup, last = Math.min(inRange.length, r + rowsPerGroup); r < last; r++) {
      if (inRange[r] > 0) {
        marked[g] = inRange[r];
        break;
      }
    }
  }
  return marked;
}

/** A stretch of consecutive groups of one range: groups [first, last], both included. */
export interface LeftOutStretch {
  readonly range: number; // 0-based index of the range
  readonly first: number;
  readonly last: number;
}

/** The marked groups as stretches of one range each, in group order. marked: groups. */
export function leftOutStretches(marked: Uint16Array): LeftOutStretch[] {
  const out: LeftOutStretch[] = [];
  for (let g = 0; g < marked.length; g++) {
    if (marked[g] === 0) continue;
    const first = g;
    while (g + 1 < marked.length && marked[g + 1] === marked[first]) g++;
    out.push({ range: marked[first] - 1, first, last: g });
  }
  return out;
}
