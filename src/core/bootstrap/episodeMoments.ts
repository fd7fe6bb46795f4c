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

/** Rows gathered per chunk before their products are summed (feature-major, so each sum runs over contiguous memory). */
const CHUNK_ROWS = 256;

/**
 * row(i, x, y) fills x (p) and y (q) for transition i and returns false to leave it out
 * (e.g. a transition into a terminal state has no next state to regress on).
 *
 * Each episode's rows are gathered in chunks into feature-major columns and every entry is summed
 * over a chunk in a register, starting from its running total: the same additions in the same
 * order as adding each row's products straight into the totals, so the same numbers to the last
 * bit, without a load and a store of the total per product.
 */
export function episodeMoments(
  index: EpisodeIndex, p: number, q: number, row: (i: number, x: Float64Array, y: Float64Array) => boolean,
): EpisodeMoments {
  const stride = p * p + p * q + q * q + 1, sums = new Float64Array(index.episodes * stride);
  const x = new Float64Array(p), y = new Float64Array(q), cx = new Float64Array(p * CHUNK_ROWS), cy = new Float64Array(q * CHUNK_ROWS);
  for (let k = 0; k < index.episodes; k++) {
    const o = k * stride;
    let size = 0;
    for (let r = index.offsets[k]; r < index.offsets[k + 1]; r++) {
      if (!row(index.order[r], x, y)) continue;
      for (let a = 0; a < p; a++) cx[a * CHUNK_ROWS + size] = x[a];
      for (let a = 0; a < q; a++) cy[a * CHUNK_ROWS + size] = y[a];
      if (++size === CHUNK_ROWS) { addChunk(sums, o, cx, cy, p, q, size); size = 0; }
    }
    if (size > 0) addChunk(sums, o, cx, cy, p, q, size);
    mirror(sums, o, p, q);
  }
  return { episodes: index.episodes, p, q, stride, sums };
}

/** The chunk's products added to episode totals at sums[o …]: XᵀX and YᵀY on and above the diagonal, XᵀY whole, and the count. */
function addChunk(sums: Float64Array, o: number, cx: Float64Array, cy: Float64Array, p: number, q: number, size: number): void {
  const yy = o + p * p + p * q;
  for (let a = 0; a < p; a++) {
    const xa = a * CHUNK_ROWS;
    for (let b = a; b < p; b++) sums[o + a * p + b] = dotFrom(sums[o + a * p + b], cx, xa, cx, b * CHUNK_ROWS, size);
    for (let b = 0; b < q; b++) sums[o + p * p + a * q + b] = dotFrom(sums[o + p * p + a * q + b], cx, xa, cy, b * CHUNK_ROWS, size);
  }
  for (let a = 0; a < q; a++) for (let b = a; b < q; b++) sums[yy + a * q + b] = dotFrom(sums[yy + a * q + b], cy, a * CHUNK_ROWS, cy, b * CHUNK_ROWS, size);
  sums[o + p * p + p * q + q * q] += size;
}

/** start + Σ_t u[i+t]·v[j+t], added one product at a time in order. */
function dotFrom(start: number, u: Float64Array, i: number, v: Float64Array, j: number, size: number): number {
  let s = start;
  for (let t = 0; t < size; t++) s += u[i + t] * v[j + t];
  return s;
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
  const { episodes, p, q, stride } = moments, count = multiplicities.length;
  for (const c of multiplicities) if (c.length !== episodes) throw new BootstrapError(`multiplicities: expected ${episodes}, got ${c.length}`);
  const packed = packedMoments(moments), width = packed.index.length, out: RegressionMoments[] = [];
  if (!packed.finite) return multiplicities.map((c) => split(rangeTotal(moments, c), p, q, stride));
  for (let first = 0; first < count; first += 4) {
    const block = multiplicities.slice(first, first + 4), totals = addFourScaled(packed.values, width, episodes, block);
    for (let b = 0; b < block.length; b++) {
      const total = new Float64Array(stride);
      for (let j = 0; j < width; j++) total[packed.index[j]] = totals[b * width + j];
      out.push(split(total, p, q, stride));
    }
  }
  return out;
}

/** The summed entries of each episode's moments side by side (e×width), and whether all are finite. */
interface PackedMoments { readonly index: Int32Array; readonly values: Float64Array; readonly finite: boolean }
const packedCache = new WeakMap<EpisodeMoments, PackedMoments>();

function packedMoments(moments: EpisodeMoments): PackedMoments {
  const cached = packedCache.get(moments);
  if (cached) return cached;
  const ranges = summedRanges(moments.p, moments.q), positions: number[] = [];
  for (let r = 0; r < ranges.length; r += 2) for (let j = ranges[r]; j < ranges[r + 1]; j++) positions.push(j);
  const index = Int32Array.from(positions), width = index.length, values = new Float64Array(moments.episodes * width);
  let finite = true;
  for (let k = 0; k < moments.episodes; k++) {
    for (let j = 0; j < width; j++) {
      const v = moments.sums[k * moments.stride + index[j]];
      values[k * width + j] = v;
      if (!Number.isFinite(v)) finite = false;
    }
  }
  const packed = { index, values, finite };
  packedCache.set(moments, packed);
  return packed;
}

/**
 * Σ_k c_k·values_k for up to four resamples at once (4×width, resample-major). A zero multiplicity
 * adds 0·v = 0 to a finite total, which leaves it unchanged, so the sums equal resampleMoments's
 * (which skips such episodes) exactly; callers use this only when every value is finite.
 */
function addFourScaled(values: Float64Array, width: number, episodes: number, block: readonly ArrayLike<number>[]): Float64Array {
  const totals = new Float64Array(4 * width), zero = new Float64Array(episodes);
  const m0 = block[0], m1 = block[1] ?? zero, m2 = block[2] ?? zero, m3 = block[3] ?? zero;
  const o1 = width, o2 = 2 * width, o3 = 3 * width;
  for (let k = 0; k < episodes; k++) {
    const c0 = m0[k], c1 = m1[k], c2 = m2[k], c3 = m3[k];
    if (c0 === 0 && c1 === 0 && c2 === 0 && c3 === 0) continue;
    const o = k * width;
    for (let j = 0; j < width; j++) {
      const v = values[o + j];
      totals[j] += c0 * v; totals[o1 + j] += c1 * v; totals[o2 + j] += c2 * v; totals[o3 + j] += c3 * v;
    }
  }
  return totals;
}

/** One resample's packed total by the summed ranges (the route for moments with a non-finite entry). */
function rangeTotal(moments: EpisodeMoments, c: ArrayLike<number>): Float64Array {
  const total = new Float64Array(moments.stride), ranges = summedRanges(moments.p, moments.q);
  for (let k = 0; k < moments.episodes; k++) if (c[k] !== 0) addScaled(total, c[k], moments.sums, k * moments.stride, ranges);
  return total;
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
