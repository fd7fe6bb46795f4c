/**
 * The per-episode moments of two regressions in one pass over the data (episodeMoments.ts), when the
 * second's regressors are the first p' of the first's (a lower-degree polynomial on the same inputs:
 * polynomialFeatures.ts leadsPolynomial) and every row enters both. The second's XᵀX is then the
 * leading p'×p' block of the first's, summed by the same products in the same order, so it is
 * copied; only its XᵀY and YᵀY (one target) are summed beside the first's. Each equals what
 * episodeMoments gives for that regression alone, to the last bit.
 *
 * row(i, x, y) fills x (p) and y (q + 1): the first regression's q targets, then the second's one.
 *
 * Shapes: as episodeMoments; first p×q, second p'×1.
 */
import { addChunk, CHUNK_ROWS, dotFrom, mirror, type EpisodeMoments } from './episodeMoments';
import type { EpisodeIndex } from './episodeTransitions';

export function leadingEpisodeMoments(
  index: EpisodeIndex, p: number, q: number, leading: number, row: (i: number, x: Float64Array, y: Float64Array) => void,
): { first: EpisodeMoments; second: EpisodeMoments } {
  const e = index.episodes, stride = p * p + p * q + q * q + 1, strideLeading = leading * leading + leading + 2;
  const sums = new Float64Array(e * stride), sumsLeading = new Float64Array(e * strideLeading);
  const x = new Float64Array(p), y = new Float64Array(q + 1), cx = new Float64Array(p * CHUNK_ROWS), cy = new Float64Array(q * CHUNK_ROWS);
  const cr = new Float64Array(CHUNK_ROWS);
  for (let k = 0; k < e; k++) {
    const o = k * stride, ol = k * strideLeading;
    let size = 0;
    const add = () => {
      addChunk(sums, o, cx, cy, p, q, size);
      addTarget(sumsLeading, ol, leading, cx, cr, size);
      size = 0;
    };
    for (let r = index.offsets[k]; r < index.offsets[k + 1]; r++) {
      row(index.order[r], x, y);
      for (let a = 0; a < p; a++) cx[a * CHUNK_ROWS + size] = x[a];
      for (let a = 0; a < q; a++) cy[a * CHUNK_ROWS + size] = y[a];
      cr[size] = y[q];
      if (++size === CHUNK_ROWS) add();
    }
    if (size > 0) add();
    mirror(sums, o, p, q);
    for (let a = 0; a < leading; a++) for (let b = 0; b < leading; b++) sumsLeading[ol + a * leading + b] = sums[o + a * p + b];
  }
  return { first: { episodes: e, p, q, stride, sums }, second: { episodes: e, p: leading, q: 1, stride: strideLeading, sums: sumsLeading } };
}

/** The second regression's XᵀY and YᵀY for a chunk, added as episodeMoments' addChunk adds them, and its count. */
function addTarget(sums: Float64Array, o: number, p: number, cx: Float64Array, cr: Float64Array, size: number): void {
  for (let a = 0; a < p; a++) sums[o + p * p + a] = dotFrom(sums[o + p * p + a], cx, a * CHUNK_ROWS, cr, 0, size);
  sums[o + p * p + p] = dotFrom(sums[o + p * p + p], cr, 0, cr, 0, size);
  sums[o + p * p + p + 1] += size;
}
