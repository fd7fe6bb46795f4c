/**
 * Median of the positive steps between adjacent kept rows of a timestamp column (NaN when there is
 * none): the run rule's sampling period (episodes.ts). Steps across an excluded row are skipped so a
 * hole does not count as a long sample; zero steps (repeated timestamps) are skipped so they cannot
 * make every later step look like a gap.
 *
 * A log sampled on a fixed period has one step value or a few: those are tallied (value, count) in
 * one pass and the median read off the tally, which is the same value selection finds (the k-th
 * smallest of a multiset is where the counts, in ascending value order, pass k). Past
 * TALLIED_STEPS distinct values (a jittery clock) the steps are copied into an array of the
 * records' size and selected there; the tally is there to spare that array, whose fresh memory
 * cost more to fill than the rest of the pass on a million rows.
 */

/** Distinct step values tallied at most before falling back to selection (a choice: fixed-period logs have a handful). */
export const TALLIED_STEPS = 64;

export function medianStepSeconds(t: Float64Array, kept: Uint8Array): number {
  const tally = tallySteps(t, kept);
  return tally ? medianOfTally(tally) : medianBySelection(t, kept);
}

interface StepTally {
  readonly values: Float64Array; // distinct step values, in order of first appearance
  readonly counts: Float64Array;
  readonly distinct: number;
}

/** The positive steps between adjacent kept rows as distinct values and counts, or null past TALLIED_STEPS values. */
function tallySteps(t: Float64Array, kept: Uint8Array): StepTally | null {
  const values = new Float64Array(TALLIED_STEPS), counts = new Float64Array(TALLIED_STEPS);
  let distinct = 0, last = -1;
  for (let r = 1; r < t.length; r++) {
    const step = t[r] - t[r - 1];
    if (!(kept[r] && kept[r - 1] && step > 0)) continue;
    if (last < 0 || values[last] !== step) {
      last = slotOf(values, distinct, step);
      if (last === distinct) {
        if (distinct === TALLIED_STEPS) return null;
        values[distinct++] = step;
      }
    }
    counts[last]++;
  }
  return { values, counts, distinct };
}

/** Index of `step` among values[0..distinct), or `distinct` when it is not there. */
function slotOf(values: Float64Array, distinct: number, step: number): number {
  let i = 0;
  while (i < distinct && values[i] !== step) i++;
  return i;
}

/** The median of the tallied steps: the middle one, or the mean of the two middle ones, as medianBySelection finds them. */
function medianOfTally({ values, counts, distinct }: StepTally): number {
  const order = Array.from({ length: distinct }, (_, i) => i).sort((a, b) => values[a] - values[b]);
  let count = 0;
  for (let i = 0; i < distinct; i++) count += counts[i];
  if (count === 0) return NaN;
  const kth = (k: number): number => {
    let below = 0;
    for (const i of order) {
      below += counts[i];
      if (k < below) return values[i];
    }
    return NaN; // not reached: k < count
  };
  const mid = Math.floor(count / 2), upper = kth(mid);
  return count % 2 ? upper : (kth(mid - 1) + upper) / 2;
}

/** The median by copying the steps into an array of the records' size and selecting in it. */
function medianBySelection(t: Float64Array, kept: Uint8Array): number {
  const steps = new Float64Array(Math.max(0, t.length - 1));
  let count = 0;
  for (let r = 1; r < t.length; r++) {
    const step = t[r] - t[r - 1];
    if (kept[r] && kept[r - 1] && step > 0) steps[count++] = step;
  }
  if (count === 0) return NaN;
  const values = steps.subarray(0, count), mid = count >> 1;
  const upper = selectKth(values, mid);
  return count % 2 ? upper : (maxBelow(values, mid) + upper) / 2;
}

/**
 * The k-th smallest of values (0-based), reordering them so that values[0..k) ≤ values[k]:
 * Hoare's selection (Hoare 1961, "Algorithm 65: FIND"), O(n) on average, with the middle element
 * as pivot (the steps of a log are nearly constant, so no order hurts it).
 */
function selectKth(values: Float64Array, k: number): number {
  let lo = 0, hi = values.length - 1;
  while (lo < hi) {
    const pivot = values[(lo + hi) >> 1];
    let i = lo, j = hi;
    while (i <= j) {
      while (values[i] < pivot) i++;
      while (values[j] > pivot) j--;
      if (i <= j) {
        const swap = values[i]; values[i] = values[j]; values[j] = swap;
        i++; j--;
      }
    }
    if (k <= j) hi = j;
    else if (k >= i) lo = i;
    else break;
  }
  return values[k];
}

/** The largest of values[0..k) (after selectKth(values, k) these are the k smallest). */
function maxBelow(values: Float64Array, k: number): number {
  let best = -Infinity;
  for (let i = 0; i < k; i++) if (values[i] > best) best = values[i];
  return best;
}
