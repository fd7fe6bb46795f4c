/**
 * An interval for the network's J, and for the linear estimate beside it, by resampling whole
 * episodes (Efron & Tibshirani, "An Introduction to the Bootstrap", 1993, ch. 6; for fitted
 * Q-evaluation, Hao et al., "Bootstrapping Fitted Q-Evaluation for Off-Policy Inference", ICML
 * 2021) and re-solving the last layer on each resample. The last-layer system is a sum of
 * per-episode sums (networkLastLayerSums.ts), so a resample drawing episode k c_k times has the
 * system Σ_k c_k S_k / Σ_k c_k n_k: O(e·d²) to form and O(d³) to solve, no pass over the data —
 * the same device as the linear bootstrap (../bootstrap/episodeBellmanSums.ts).
 *
 * What it covers: the sampling variability of the last-layer solve given the learned hidden
 * features, i.e. which episodes happened to be logged. Not covered: that the features were learned
 * on the same data, the randomness of the network's training, and the approximation error of the
 * function class. Where the network and the linear estimate disagree beyond resampling, the fit
 * adds an allowance for the function class's error to the network's interval (classErrorAllowance.ts).
 * The battery measures how often the interval holds the truth anyway (`npm run bench -- battery`).
 *
 * The same resamples give the linear estimate's replicates (the comparator of networkComparator.ts:
 * the linear approximator's default class on the same episodes) and the paired difference
 * network − linear, whose interval is what the agreement rule reads
 * (approximatorAgreement.ts): both estimates come from the same episodes, so their sampling
 * errors are strongly correlated and the difference is far better determined than either value.
 *
 * Intervals are percentile intervals (Davison & Hinkley 1997, eq. 5.18, via bootstrapInterval).
 */
import { bootstrapInterval, type BootstrapInterval } from '../bootstrap/bootstrapInterval';
import { episodeMultiplicities } from '../bootstrap/episodeMultiplicities';
import { combineSums, type LastLayerSums } from './networkLastLayerSums';
import type { HigherTermRidge } from './networkHigherTermRidge';
import { solveLastLayer } from './networkLastLayer';
import { meanRow } from './networkValueRows';

export interface EpisodeSystems {
  /** Per training episode: the joint system (network) and the comparator's (linear; networkComparator.ts). */
  readonly joint: LastLayerSums;
  readonly linear: LastLayerSums;
  /** Episode index (into the data's episodes and start states) of each range. */
  readonly ids: Int32Array;
  readonly hiddenRidge: number;
  /** The ridge on the polynomial part's terms above degree 2 (networkHigherTermRidge.ts); absent: none. */
  readonly higherTermRidge?: HigherTermRidge;
}

export interface IntervalRequest {
  /** ξ(s0) rows of the start set, count×d (joint features). */
  readonly startRows: Float64Array;
  /** The comparator's E_a φ₂(s0, a) rows of the same start set, count×d2 (networkComparator.ts). */
  readonly linearStartRows: Float64Array;
  /** True when start row k is the first state of an episode (episode k's, or startEpisode[k]'s), so it is resampled with its episode. */
  readonly startsFollowEpisodes: boolean;
  /**
   * Episode of each start row when some episode has none (TransitionSet.startEpisode: its first row
   * was excluded); absent: start row k is episode k's. The linear bootstrap maps its start weights
   * through the same array (../bootstrap/startMultiplicities.ts), so both weigh a start by its own run.
   */
  readonly startEpisode?: Int32Array;
  readonly level: number;
  readonly resamples: number;
  readonly seed: number;
  /**
   * The data's run count, when the resamples must be the assessment's own: resample b then draws
   * every run of the data as episodeMultiplicities(runs, seed, b) does for the linear bootstrap, and
   * each training episode takes its run's count, so replicate b pairs with every other estimate's
   * replicate b (a paired difference with the present controller, a ranking). Absent: the draws are
   * over the training episodes alone (the fit's own interval).
   */
  readonly runs?: number;
}

export interface ValueReplicates {
  readonly network: BootstrapInterval;
  readonly linear: BootstrapInterval;
  /** network − linear, paired by resample. */
  readonly difference: BootstrapInterval;
  /** Resamples whose system could not be solved (left out of the intervals). */
  readonly failed: number;
  /** The network's J on each resample in order, null where it could not be solved. */
  readonly values: readonly (number | null)[];
  /** The linear comparator's J on the same resamples, null where either could not be solved (pairs with `values`). */
  readonly linearValues: readonly (number | null)[];
}

/** estimates: the full-data J of the network and of the linear part over the same start set. */
export function valueReplicates(systems: EpisodeSystems, request: IntervalRequest, estimates: { network: number; linear: number }): ValueReplicates {
  const { joint, linear, ids } = systems, d = joint.dim, d1 = joint.linearDim, d2 = linear.dim, e = joint.ranges;
  const starts = request.startRows.length / d, linearStartRows = request.linearStartRows;
  const net: number[] = [], lin: number[] = [], diff: number[] = [], values: (number | null)[] = [], linearValues: (number | null)[] = [];
  const jointScratch = new Float64Array(joint.stride), linearScratch = new Float64Array(linear.stride);
  const c = new Uint32Array(e), startWeights = new Float64Array(starts).fill(1), runs = request.runs;
  const all = runs === undefined ? null : new Uint32Array(runs), runOf = (k: number) => (request.startEpisode ? request.startEpisode[k] : k);
  // Training range of each start's run, −1 for a held-out run (its start keeps weight 1 in the fit's own draws).
  const rangeOfRun = new Map<number, number>(), rangeOfStart = new Int32Array(starts);
  for (let r = 0; r < e; r++) rangeOfRun.set(ids[r], r);
  for (let k = 0; k < starts; k++) rangeOfStart[k] = rangeOfRun.get(runOf(k)) ?? -1;
  let failed = 0;
  for (let b = 0; b < request.resamples; b++) {
    if (all) {
      // The assessment's draw over every run; a start state goes with its run, a training episode takes its run's count.
      episodeMultiplicities(runs!, request.seed, b, all);
      for (let r = 0; r < e; r++) c[r] = all[ids[r]];
      if (request.startsFollowEpisodes) for (let k = 0; k < starts; k++) startWeights[k] = runOf(k) < runs! ? all[runOf(k)] : 1;
    } else {
      episodeMultiplicities(e, request.seed, b, c);
      if (request.startsFollowEpisodes) for (let k = 0; k < starts; k++) if (rangeOfStart[k] >= 0) startWeights[k] = c[rangeOfStart[k]];
    }
    const v = solveLastLayer(combineSums(joint, c, jointScratch), d, d1, systems.hiddenRidge, systems.higherTermRidge);
    const w = solveLastLayer(combineSums(linear, c, linearScratch), d2, d2, 0);
    if ('failure' in v || 'failure' in w || startWeights.every((x) => x === 0) || c.every((x) => x === 0)) {
      failed++;
      values.push(null);
      linearValues.push(null);
      continue;
    }
    const jn = dotRow(meanRow(request.startRows, d, startWeights), v.weights), jl = dotRow(meanRow(linearStartRows, d2, startWeights), w.weights);
    net.push(jn);
    lin.push(jl);
    diff.push(jn - jl);
    values.push(jn);
    linearValues.push(jl);
  }
  return {
    values, linearValues,
    network: bootstrapInterval(estimates.network, net, request.level),
    linear: bootstrapInterval(estimates.linear, lin, request.level),
    difference: bootstrapInterval(estimates.network - estimates.linear, diff, request.level),
    failed,
  };
}

function dotRow(a: Float64Array, b: Float64Array): number {
  let s = 0;
  for (let i = 0; i < a.length; i++) s += a[i] * b[i];
  return s;
}
