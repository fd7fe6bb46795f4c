/**
 * Seeded hold-out of whole episodes. Transitions of one episode are serially correlated, so
 * holding out single rows would leak their neighbours into training and flatter the held-out
 * error; holding out whole blocks is common practice for dependent data (blocked
 * cross-validation; Roberts et al., "Cross-validation strategies for data with temporal, spatial,
 * hierarchical, or phylogenetic structure", Ecography 2017).
 */
import type { RandomSource } from '../random';
import type { TransitionSet } from '../transitions';
import { FqeOptionsError } from './fqeErrors';

export interface EpisodeSplit {
  /** Transition indices, training transitions first (in data order), then held-out ones. */
  readonly order: Int32Array; // n
  readonly trainingCount: number;
  readonly heldOutCount: number;
  readonly heldOutEpisodes: number;
}

/**
 * Hold out round(fraction·e) episodes (at least 1 when fraction > 0), chosen by a seeded
 * Fisher–Yates shuffle (Knuth, TAOCP Vol. 2, §3.4.2, Algorithm P).
 */
export function splitEpisodes(data: TransitionSet, heldOutFraction: number, rng: RandomSource): EpisodeSplit {
  const n = data.count, e = data.episodeCount;
  if (heldOutFraction === 0) return { order: Int32Array.from({ length: n }, (_, i) => i), trainingCount: n, heldOutCount: 0, heldOutEpisodes: 0 };
  if (e < 2) {
    throw new FqeOptionsError(`heldOutFraction: ${heldOutFraction} holds out whole episodes, but the data have ${e} episode; set heldOutFraction to 0 or log more episodes`);
  }
  const heldOutEpisodes = Math.min(e - 1, Math.max(1, Math.round(heldOutFraction * e)));
  const episodes = Int32Array.from({ length: e }, (_, i) => i);
  for (let i = e - 1; i > 0; i--) {
    const j = rng.integer(i + 1);
    const swap = episodes[i];
    episodes[i] = episodes[j];
    episodes[j] = swap;
  }
  const heldOut = new Uint8Array(e);
  for (let i = 0; i < heldOutEpisodes; i++) heldOut[episodes[i]] = 1;
  const order = new Int32Array(n);
  let front = 0;
  for (let i = 0; i < n; i++) if (!heldOut[data.episode[i]]) order[front++] = i;
  let back = front;
  for (let i = 0; i < n; i++) if (heldOut[data.episode[i]]) order[back++] = i;
  if (front === 0) throw new FqeOptionsError('heldOutFraction: every transition fell in held-out episodes; lower heldOutFraction');
  return { order, trainingCount: front, heldOutCount: n - front, heldOutEpisodes };
}
