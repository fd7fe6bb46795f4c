/**
 * Where each episode's transitions are, and transition sets built from whole episodes: one
 * episode (for its own sums), or a bootstrap resample materialised as data (episode k repeated
 * c_k times) — the naive form of a resample, for approximators without per-episode sums and for
 * checking the fast linear path against a plain refit.
 *
 * Shapes: n transitions, ds states, m actions, e episodes.
 */
import type { TransitionSet } from '../transitions';
import { BootstrapError } from './episodeMultiplicities';

export interface EpisodeIndex {
  readonly episodes: number; // e
  /** Transitions of episode k are order[offsets[k] .. offsets[k+1]), in data order. */
  readonly offsets: Int32Array; // e+1
  readonly order: Int32Array; // n
}

/** Group transitions by episode (counting sort; keeps data order inside each episode). */
export function indexEpisodes(data: TransitionSet): EpisodeIndex {
  const e = data.episodeCount, n = data.count;
  const offsets = new Int32Array(e + 1);
  for (let i = 0; i < n; i++) {
    const k = data.episode[i];
    if (!(k >= 0 && k < e)) throw new BootstrapError(`transition ${i + 1} (line ${data.sourceLine[i]}): episode ${k} is outside 0–${e - 1}`);
    offsets[k + 1]++;
  }
  for (let k = 0; k < e; k++) offsets[k + 1] += offsets[k];
  const next = offsets.slice(0, e), order = new Int32Array(n);
  for (let i = 0; i < n; i++) order[next[data.episode[i]]++] = i;
  return { episodes: e, offsets, order };
}

/**
 * The transitions of the given episodes, each repeated `repeats[j]` times (default once), as a new
 * set whose episodes are renumbered 0, 1, … in that order. Start states follow their episodes.
 */
export function episodeTransitions(
  data: TransitionSet, index: EpisodeIndex, episodes: ArrayLike<number>, repeats?: ArrayLike<number>,
): TransitionSet {
  const ds = data.stateDim, m = data.actionDim;
  let count = 0, episodeCount = 0;
  for (let j = 0; j < episodes.length; j++) {
    const r = repeats ? repeats[j] : 1;
    count += r * (index.offsets[episodes[j] + 1] - index.offsets[episodes[j]]);
    episodeCount += r;
  }
  const startOf = startRowOfEpisode(data);
  let startCount = 0;
  for (let j = 0; j < episodes.length; j++) if (startOf[episodes[j]] >= 0) startCount += repeats ? repeats[j] : 1;
  const out = emptyLike(data, count, episodeCount, startCount);
  let row = 0, copy = 0, start = 0;
  for (let j = 0; j < episodes.length; j++) {
    const k = episodes[j], s = startOf[k];
    for (let r = 0; r < (repeats ? repeats[j] : 1); r++, copy++) {
      if (s >= 0) {
        out.startStates.set(data.startStates.subarray(s * ds, (s + 1) * ds), start * ds);
        out.startEpisode[start++] = copy;
      }
      for (let p = index.offsets[k]; p < index.offsets[k + 1]; p++, row++) {
        const i = index.order[p];
        out.states.set(data.states.subarray(i * ds, (i + 1) * ds), row * ds);
        out.nextStates.set(data.nextStates.subarray(i * ds, (i + 1) * ds), row * ds);
        out.actions.set(data.actions.subarray(i * m, (i + 1) * m), row * m);
        out.rewards[row] = data.rewards[i];
        out.terminal[row] = data.terminal[i];
        out.sourceLine[row] = data.sourceLine[i];
        out.episode[row] = copy;
      }
    }
  }
  return out.startEpisode.length === episodeCount ? { ...out, startEpisode: undefined } : out;
}

/** Row of each episode's start state in data.startStates, −1 for an episode without one. */
function startRowOfEpisode(data: TransitionSet): Int32Array {
  const startOf = new Int32Array(data.episodeCount).fill(-1);
  const starts = data.startStates.length / data.stateDim;
  for (let s = 0; s < starts; s++) startOf[data.startEpisode ? data.startEpisode[s] : s] = s;
  return startOf;
}

/** A resample as data: episode k repeated multiplicities[k] times (Σ c_k episodes). */
export function resampledTransitions(data: TransitionSet, index: EpisodeIndex, multiplicities: ArrayLike<number>): TransitionSet {
  if (multiplicities.length !== index.episodes) {
    throw new BootstrapError(`multiplicities: expected one per episode (${index.episodes}), got ${multiplicities.length}`);
  }
  return episodeTransitions(data, index, Int32Array.from({ length: index.episodes }, (_, k) => k), multiplicities);
}

function emptyLike(data: TransitionSet, n: number, e: number, starts: number) {
  const ds = data.stateDim, m = data.actionDim;
  return {
    count: n, stateDim: ds, actionDim: m, stateNames: data.stateNames, actionNames: data.actionNames,
    states: new Float64Array(n * ds), actions: new Float64Array(n * m), rewards: new Float64Array(n),
    nextStates: new Float64Array(n * ds), terminal: new Uint8Array(n), episode: new Int32Array(n),
    episodeCount: e, startStates: new Float64Array(starts * ds), startEpisode: new Int32Array(starts), sourceLine: new Int32Array(n),
  };
}
