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
export const CHUNK_ROWS = 256;

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
export function addChunk(sums: Float64Array, o: number, cx: Float64Array, cy: Float64Array, p: number, q: number, size: number): void {
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
export function dotFrom(start: number, u: Float64Array, i: number, v: Float64Array, j: number, size: number): number {
  let s = start;
  for (let t = 0; t < size; t++) s += u[i + t] * v[j + t];
  return s;
}

/**
 * XᵀX and YᵀY are symmetric, and x_a·x_b = x_b·x_a exactly in floating point, so only the entries
 * on and above their diagonals are summed (here and in the resample sums) and the rest copied:
 * the same numbers for about half the work.
 */
export function mirror(sums: Float64Array, o: number, p: number, q: number): void {
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
    const block = multiplicities.slice(first, first + 4), totals = addFourScaled(packed.columns, width, episodes, block);
    for (let b = 0; b < block.length; b++) {
      const total = new Float64Array(stride);
      for (let j = 0; j < width; j++) total[packed.index[j]] = totals[b * width + j];
      out.push(split(total, p, q, stride));
    }
  }
  return out;
}

/** The summed entries of the episodes' moments, entry by entry (width×e: entry j of every episode in a row), and whether all are finite. */
interface PackedMoments { readonly index: Int32Array; readonly columns: Float64Array; readonly finite: boolean }
const packedCache = new WeakMap<EpisodeMoments, PackedMoments>();

function packedMoments(moments: EpisodeMoments): PackedMoments {
  const cached = packedCache.get(moments);
  if (cached) return cached;
  const ranges = summedRanges(moments.p, moments.q), positions: number[] = [], e = moments.episodes;
  for (let r = 0; r < ranges.length; r += 2) for (let j = ranges[r]; j < ranges[r + 1]; j++) positions.push(j);
  const index = Int32Array.from(positions), width = index.length, columns = new Float64Array(width * e);
  let finite = true;
  for (let k = 0; k < e; k++) {
    for (let j = 0; j < width; j++) {
      const v = moments.sums[k * moments.stride + index[j]];
      columns[j * e + k] = v;
      if (!Number.isFinite(v)) finite = false;
    }
  }
  const packed = { index, columns, finite };
  packedCache.set(moments, packed);
  return packed;
}

/**
 * Episodes per chunk of addFourScaled: the chunk's four multiplicities side by side (4 × 8 bytes
 * each, 64 KiB) stay in the second-level cache while every entry's run of values passes over them
 * (our choice; 512 to 20,000 measured alike within the noise of a shared machine).
 */
const CHUNK_EPISODES = 2048;

/**
 * Σ_k c_k·values_k for up to four resamples at once (4×width, resample-major). Episodes are taken
 * in chunks; within a chunk two entries at a time are summed over the chunk's episodes in eight
 * registers (two entries × four resamples), starting from their running totals, so each total
 * receives the same products in the same order (k ascending) as adding them one at a time — the
 * same numbers to the last bit — with one load of each value and none of a total per product.
 * A zero multiplicity adds 0·v = ±0 to a finite total, which leaves it unchanged (a total that
 * starts at +0 never becomes −0 in round-to-nearest), so the sums equal resampleMoments's (which
 * skips such episodes) exactly; callers use this only when every value is finite.
 */
function addFourScaled(columns: Float64Array, width: number, episodes: number, block: readonly ArrayLike<number>[]): Float64Array {
  const totals = new Float64Array(4 * width), lanes = new Float64Array(4 * CHUNK_EPISODES);
  for (let from = 0; from < episodes; from += CHUNK_EPISODES) {
    const size = Math.min(CHUNK_EPISODES, episodes - from);
    interleaveLanes(block, from, size, lanes);
    let j = 0;
    for (; j + 1 < width; j += 2) addEntryPair(columns, j * episodes + from, (j + 1) * episodes + from, size, lanes, totals, width, j);
    if (j < width) addEntry(columns, j * episodes + from, size, lanes, totals, width, j);
  }
  return totals;
}

/** lanes[4t + l] = block[l][from + t] for t < size (0 for a lane the block does not have). */
function interleaveLanes(block: readonly ArrayLike<number>[], from: number, size: number, lanes: Float64Array): void {
  for (let l = 0; l < 4; l++) {
    const c = block[l];
    if (c === undefined) for (let t = 0; t < size; t++) lanes[4 * t + l] = 0;
    else for (let t = 0; t < size; t++) lanes[4 * t + l] = c[from + t];
  }
}

/** totals[b·width + j + i] += Σ_t lanes[4t + b]·columns[(i ? y : x) + t] for b < 4, i ∈ {0, 1}, t in order. */
function addEntryPair(columns: Float64Array, x: number, y: number, size: number, lanes: Float64Array, totals: Float64Array, width: number, j: number): void {
  const o1 = width + j, o2 = 2 * width + j, o3 = 3 * width + j;
  let a0 = totals[j], a1 = totals[o1], a2 = totals[o2], a3 = totals[o3];
  let b0 = totals[j + 1], b1 = totals[o1 + 1], b2 = totals[o2 + 1], b3 = totals[o3 + 1];
  for (let t = 0; t < size; t++) {
    const u = columns[x + t], v = columns[y + t], l = 4 * t;
    const c0 = lanes[l], c1 = lanes[l + 1], c2 = lanes[l + 2], c3 = lanes[l + 3];
    a0 += c0 * u; a1 += c1 * u; a2 += c2 * u; a3 += c3 * u;
    b0 += c0 * v; b1 += c1 * v; b2 += c2 * v; b3 += c3 * v;
  }
  totals[j] = a0; totals[o1] = a1; totals[o2] = a2; totals[o3] = a3;
  totals[j + 1] = b0; totals[o1 + 1] = b1; totals[o2 + 1] = b2; totals[o3 + 1] = b3;
}

/** addEntryPair for one entry (the last of an odd width). */
function addEntry(columns: Float64Array, x: number, size: number, lanes: Float64Array, totals: Float64Array, width: number, j: number): void {
  const o1 = width + j, o2 = 2 * width + j, o3 = 3 * width + j;
  let a0 = totals[j], a1 = totals[o1], a2 = totals[o2], a3 = totals[o3];
  for (let t = 0; t < size; t++) {
    const u = columns[x + t], l = 4 * t;
    a0 += lanes[l] * u; a1 += lanes[l + 1] * u; a2 += lanes[l + 2] * u; a3 += lanes[l + 3] * u;
  }
  totals[j] = a0; totals[o1] = a1; totals[o2] = a2; totals[o3] = a3;
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
