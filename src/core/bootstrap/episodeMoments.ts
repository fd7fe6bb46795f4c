/**
 * Per-episode cross-product moments of a regression, XᵀX, XᵀY and YᵀY, so that a least-squares
 * fit on any bootstrap resample is formed from Σ_k c_k (moments of episode k) without touching the
 * data again (as episodeBellmanSums.ts does for fitted Q-evaluation).
 *
 * Shapes: rows x_i (p) and y_i (q) come from a callback; per episode the packed block is
 * [XᵀX p×p | XᵀY p×q | YᵀY q×q | count], stride p² + pq + q² + 1.
 */
import { BootstrapError } from './episodeMultiplicities';
import type { EpisodeIndex } from './episodeTransitions';

export interface EpisodeMoments {
  readonly episodes: number;
  readonly p: number;
  readonly q: number;
  readonly stride: number;
  readonly sums: Float64Array; // episodes×stride
}

export interface RegressionMoments {
  readonly xx: Float64Array; // p×p
  readonly xy: Float64Array; // p×q
  readonly yy: Float64Array; // q×q
  readonly count: number;
}

/**
 * row(i, x, y) fills x (p) and y (q) for transition i and returns false to leave it out
 * (e.g. a transition into a terminal state has no next state to regress on).
 */
export function episodeMoments(
  index: EpisodeIndex, p: number, q: number, row: (i: number, x: Float64Array, y: Float64Array) => boolean,
): EpisodeMoments {
  const stride = p * p + p * q + q * q + 1, sums = new Float64Array(index.episodes * stride);
  const x = new Float64Array(p), y = new Float64Array(q);
  for (let k = 0; k < index.episodes; k++) {
    const o = k * stride;
    for (let r = index.offsets[k]; r < index.offsets[k + 1]; r++) {
      if (!row(index.order[r], x, y)) continue;
      for (let a = 0; a < p; a++) {
        for (let b = a; b < p; b++) sums[o + a * p + b] += x[a] * x[b];
        for (let b = 0; b < q; b++) sums[o + p * p + a * q + b] += x[a] * y[b];
      }
      for (let a = 0; a < q; a++) for (let b = a; b < q; b++) sums[o + p * p + p * q + a * q + b] += y[a] * y[b];
      sums[o + stride - 1]++;
    }
    mirror(sums, o, p, q);
  }
  return { episodes: index.episodes, p, q, stride, sums };
}

/**
 * XᵀX and YᵀY are symmetric, and x_a·x_b = x_b·x_a exactly in floating point, so only the entries
 * on and above their diagonals are summed (here and in the resample sums) and the rest copied:
 * the same numbers for about half the work.
 */
function mirror(sums: Float64Array, o: number, p: number, q: number): void {
  for (let a = 1; a < p; a++) for (let b = 0; b < a; b++) sums[o + a * p + b] = sums[o + b * p + a];
  const y = o + p * p + p * q;
  for (let a = 1; a < q; a++) for (let b = 0; b < a; b++) sums[y + a * q + b] = sums[y + b * q + a];
}

/** The [from, to) ranges of a packed block that are summed: XᵀX and YᵀY on and above the diagonal, XᵀY and the count whole. */
function summedRanges(p: number, q: number): Int32Array {
  const ranges: number[] = [];
  const add = (from: number, to: number) => {
    if (ranges.length > 0 && ranges[ranges.length - 1] === from) ranges[ranges.length - 1] = to;
    else ranges.push(from, to);
  };
  for (let a = 0; a < p; a++) add(a * p + a, a * p + p);
  add(p * p, p * p + p * q);
  for (let a = 0; a < q; a++) add(p * p + p * q + a * q + a, p * p + p * q + a * q + q);
  add(p * p + p * q + q * q, p * p + p * q + q * q + 1);
  return Int32Array.from(ranges);
}

/** Σ_k c_k (moments of episode k); multiplicities default to all 1 (the full data). */
export function resampleMoments(moments: EpisodeMoments, multiplicities?: ArrayLike<number>): RegressionMoments {
  const { episodes, p, q, stride } = moments;
  if (multiplicities && multiplicities.length !== episodes) throw new BootstrapError(`multiplicities: expected ${episodes}, got ${multiplicities.length}`);
  const total = new Float64Array(stride), ranges = summedRanges(p, q);
  for (let k = 0; k < episodes; k++) {
    const c = multiplicities ? multiplicities[k] : 1;
    if (c === 0) continue;
    addScaled(total, c, moments.sums, k * stride, ranges);
  }
  return split(total, p, q, stride);
}

/**
 * resampleMoments for several resamples in one read of the per-episode moments: the same sums
 * Σ_k c_k (moments of episode k), in the same order, so each equals resampleMoments(moments, c)
 * exactly; the moments (e×stride) are read once for the block rather than once per resample, which
 * is what a resample's cost is bound by (memory traffic, not arithmetic).
 */
export function resampleMomentsBlock(moments: EpisodeMoments, multiplicities: readonly ArrayLike<number>[]): RegressionMoments[] {
  const { episodes, p, q, stride, sums } = moments, count = multiplicities.length;
  for (const c of multiplicities) if (c.length !== episodes) throw new BootstrapError(`multiplicities: expected ${episodes}, got ${c.length}`);
  const totals = multiplicities.map(() => new Float64Array(stride)), ranges = summedRanges(p, q);
  for (let k = 0; k < episodes; k++) {
    for (let b = 0; b < count; b++) {
      const c = multiplicities[b][k];
      if (c !== 0) addScaled(totals[b], c, sums, k * stride, ranges);
    }
  }
  return totals.map((total) => split(total, p, q, stride));
}

/** total[j] += c·sums[o + j] over the summed ranges. */
function addScaled(total: Float64Array, c: number, sums: Float64Array, o: number, ranges: Int32Array): void {
  for (let r = 0; r < ranges.length; r += 2) {
    for (let j = ranges[r]; j < ranges[r + 1]; j++) total[j] += c * sums[o + j];
  }
}

/** The packed total as matrices, the lower triangles copied from the upper. */
function split(total: Float64Array, p: number, q: number, stride: number): RegressionMoments {
  mirror(total, 0, p, q);
  return {
    xx: total.slice(0, p * p), xy: total.slice(p * p, p * p + p * q), yy: total.slice(p * p + p * q, stride - 1), count: total[stride - 1],
  };
}
