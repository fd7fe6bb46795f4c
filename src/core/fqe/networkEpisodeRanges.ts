/**
 * The training rows of a network fit grouped by episode (a stable counting sort on the episode
 * index; rows of an episode keep their file order), so that every episode is one contiguous range
 * of rows and the per-episode sums of the last-layer system — the units the bootstrap resamples
 * (networkInterval.ts) — are sums over ranges.
 */
import type { TransitionSet } from '../transitions';
import type { EpisodeSplit } from './networkEpisodeSplit';

export interface EpisodeRanges {
  readonly ranges: Int32Array; // [start, end) per training episode, flattened
  readonly ids: Int32Array; // the episode index of each range
}

export type OrderedSplit = EpisodeSplit & { readonly trainingEpisodes: EpisodeRanges };

export function episodeOrder(split: EpisodeSplit, data: TransitionSet): OrderedSplit {
  const training = split.order.subarray(0, split.trainingCount), e = data.episodeCount;
  const counts = new Int32Array(e + 1);
  for (const i of training) counts[data.episode[i] + 1]++;
  for (let k = 0; k < e; k++) counts[k + 1] += counts[k];
  const starts = counts.slice(0, e);
  const sorted = new Int32Array(training.length), cursor = starts.slice();
  for (const i of training) sorted[cursor[data.episode[i]]++] = i;
  const ranges: number[] = [], ids: number[] = [];
  for (let k = 0; k < e; k++) {
    if (counts[k + 1] > counts[k]) {
      ranges.push(counts[k], counts[k + 1]);
      ids.push(k);
    }
  }
  const order = Int32Array.from(split.order);
  order.set(sorted, 0);
  return { ...split, order, trainingEpisodes: { ranges: Int32Array.from(ranges), ids: Int32Array.from(ids) } };
}
