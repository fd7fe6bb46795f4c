/**
 * J of several policies fitted on one span of runs only, with paired bootstrap replicates: the per-block
 * estimates a drift forecast reads (driftForecast.ts). The linear fit keeps per-episode sums
 * (../bootstrap/episodeBellmanSums.ts), so the fit on a span is the whole log's fit reweighted — multiplicity
 * 1 on the span's runs, 0 elsewhere — solved by the very route of the whole-log fit and its resamples
 * (../bootstrap/linearFqeReplicate.ts): the same features and normalisation, ridge, quadrature and solver.
 * The span's sampling spread: its own runs resampled with replacement (Efron & Tibshirani, "An Introduction
 * to the Bootstrap", 1993, ch. 6; the episode is the unit, as for the whole log), the SAME resamples for every
 * policy, so a difference of two policies has its own paired replicates.
 *
 * Start states are held fixed (startsFollowEpisodes off): every span's J is over the same starts the setups
 * carry (the whole log's run starts), so two spans differ only through their transitions, not their starts.
 */
import { episodeMultiplicities, resampleSeed } from '../bootstrap/episodeMultiplicities';
import { linearFqeReplicateBlock, type LinearReplicateSetup } from '../bootstrap/linearFqeReplicate';

export interface SpanValues {
  /** J of each policy fitted on the span (reward sense; NaN where the span's fit has no solution). */
  readonly values: Float64Array; // p
  /** replicates[i][r]: policy i's J on resample r (NaN where that solve has none). */
  readonly replicates: readonly Float64Array[]; // p × B
}

/** Resamples solved side by side (one read of the sums per group, as the bootstrap does). */
const GROUP = 16;

/**
 * The span runs first … first + size − 1 (0-based episodes of the setups' sums), every setup on the same
 * multiplicities. seed: the span's own stream (resample r is episodeMultiplicities(size, seed, r) laid on the span).
 */
export function spanValues(setups: readonly LinearReplicateSetup[], first: number, size: number, resamples: number, seed: number): SpanValues {
  const episodes = setups[0].sums.episodes;
  if (!(first >= 0 && size >= 1 && first + size <= episodes)) throw new RangeError(`spanValues: runs ${first}–${first + size - 1} outside 0–${episodes - 1}`);
  const fixed = setups.map((s): LinearReplicateSetup => ({ ...s, startsFollowEpisodes: false }));
  const whole = new Uint32Array(episodes).fill(1, first, first + size);
  const scratch = Array.from({ length: GROUP }, () => new Float64Array(setups[0].sums.stride));
  const values = Float64Array.from(fixed, (s) => linearFqeReplicateBlock(s, [whole], scratch)[0].policyValue ?? NaN);
  const replicates = fixed.map(() => new Float64Array(resamples));
  const drawn = new Uint32Array(size);
  for (let from = 0; from < resamples; from += GROUP) {
    const block = Array.from({ length: Math.min(GROUP, resamples - from) }, (_, j) => {
      const c = new Uint32Array(episodes);
      c.set(episodeMultiplicities(size, seed, from + j, drawn), first);
      return c;
    });
    fixed.forEach((s, i) => linearFqeReplicateBlock(s, block, scratch).forEach((r, j) => (replicates[i][from + j] = r.policyValue ?? NaN)));
  }
  return { values, replicates };
}

/** The stream of block b of a run seeded with `seed` (a span's seed for spanValues). */
export function blockSeed(seed: number, block: number): number {
  return resampleSeed(seed, block);
}
