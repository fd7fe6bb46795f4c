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
        for (let b = 0; b < p; b++) sums[o + a * p + b] += x[a] * x[b];
        for (let b = 0; b < q; b++) sums[o + p * p + a * q + b] += x[a] * y[b];
      }
      for (let a = 0; a < q; a++) for (let b = 0; b < q; b++) sums[o + p * p + p * q + a * q + b] += y[a] * y[b];
      sums[o + stride - 1]++;
    }
  }
  return { episodes: index.episodes, p, q, stride, sums };
}

/** Σ_k c_k (moments of episode k); multiplicities default to all 1 (the full data). */
export function resampleMoments(moments: EpisodeMoments, multiplicities?: ArrayLike<number>): RegressionMoments {
  const { episodes, p, q, stride } = moments;
  if (multiplicities && multiplicities.length !== episodes) throw new BootstrapError(`multiplicities: expected ${episodes}, got ${multiplicities.length}`);
  const total = new Float64Array(stride);
  for (let k = 0; k < episodes; k++) {
    const c = multiplicities ? multiplicities[k] : 1;
    if (c === 0) continue;
    for (let j = 0; j < stride; j++) total[j] += c * moments.sums[k * stride + j];
  }
  return {
    xx: total.slice(0, p * p), xy: total.slice(p * p, p * p + p * q), yy: total.slice(p * p + p * q, stride - 1), count: total[stride - 1],
  };
}
