/**
 * J at the END of a log whose plant drifts, forecast from the trend of per-block estimates — after the
 * idea of estimating the value per period and forecasting it (Thomas, Theocharous, Ghavamzadeh, Durugkar &
 * Brunskill, "Predictive off-policy policy evaluation for nonstationary decision problems", AAAI/IAAI 2017;
 * from memory). Here: the runs split in run order into K blocks (runBlocks.ts); each policy's J fitted on each
 * block alone, with its sampling variance from resampling the block's runs (runBlockValues.ts); a straight
 * line (or, `degree` 2, a quadratic) through the K values by weighted least squares, read at the last run
 * (weightedTrendForecast.ts). The
 * difference of each policy from the first (the present controller) is forecast the same way from its
 * paired block differences, for a trial.
 *
 * What it assumes: the drift is close to a straight line in run order (a curve widens the interval through
 * the residual scale, it is not modelled), and each block's fit is good for the block's average plant.
 */
import type { LinearReplicateSetup } from '../bootstrap/linearFqeReplicate';
import { blockSeed, spanValues } from './runBlockValues';
import type { RunBlocks } from './runBlocks';
import { ForecastError, weightedTrendForecast, type WeightedTrendForecast } from './weightedTrendForecast';

export interface TrendSeries {
  readonly blockValues: Float64Array; // K
  readonly blockVariances: Float64Array; // K
  readonly forecast: WeightedTrendForecast;
}

export interface DriftForecast {
  /** One per setup, in order (reward sense). */
  readonly policies: readonly TrendSeries[];
  /** differences[i]: setup i − setup 0 (differences[0] is null). */
  readonly differences: readonly (TrendSeries | null)[];
}

/** Sample variance of the finite values among xs (a resample without a solution is left out). */
function finiteVariance(xs: ArrayLike<number>): number {
  let n = 0, mean = 0, squares = 0;
  for (let r = 0; r < xs.length; r++) {
    const x = xs[r];
    if (!Number.isFinite(x)) continue;
    n++;
    const delta = x - mean;
    mean += delta / n;
    squares += delta * (x - mean); // Welford (1962)
  }
  return n >= 2 ? squares / (n - 1) : NaN;
}

function series(values: Float64Array, variances: Float64Array, blocks: RunBlocks, level: number, degree: number): TrendSeries {
  if (!values.every(Number.isFinite)) throw new ForecastError('a block’s fit has no solution; no trend');
  return { blockValues: values, blockVariances: variances, forecast: weightedTrendForecast(blocks.position, values, variances, blocks.lastRun, level, degree) };
}

/** setups[0] is the reference the differences are taken from; resamples per block; level e.g. 0.9; degree of the trend in position. */
export function driftForecast(setups: readonly LinearReplicateSetup[], blocks: RunBlocks, resamples: number, seed: number, level: number, degree = 1): DriftForecast {
  const k = blocks.first.length, p = setups.length;
  const values = Array.from({ length: p }, () => new Float64Array(k)), variances = Array.from({ length: p }, () => new Float64Array(k));
  const diffValues = Array.from({ length: p }, () => new Float64Array(k)), diffVariances = Array.from({ length: p }, () => new Float64Array(k));
  for (let b = 0; b < k; b++) {
    const span = spanValues(setups, blocks.first[b], blocks.size[b], resamples, blockSeed(seed, b));
    for (let i = 0; i < p; i++) {
      values[i][b] = span.values[i];
      variances[i][b] = finiteVariance(span.replicates[i]);
      diffValues[i][b] = span.values[i] - span.values[0];
      diffVariances[i][b] = finiteVariance(span.replicates[i].map((x, r) => x - span.replicates[0][r]));
    }
  }
  return {
    policies: values.map((v, i) => series(v, variances[i], blocks, level, degree)),
    differences: diffValues.map((v, i) => (i === 0 ? null : series(v, diffVariances[i], blocks, level, degree))),
  };
}
