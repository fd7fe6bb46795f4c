/**
 * Self-normalised per-decision estimators of J(π) from logged episodes and importance weights
 * (importanceWeights.ts), with episode multiplicities c_i so a bootstrap resample costs one O(n)
 * pass and no copy:
 *
 * Weighted per-decision importance sampling (Precup, Sutton & Singh 2000; weighted form as in
 * Thomas & Brunskill, "Data-efficient off-policy policy evaluation for reinforcement learning",
 * ICML 2016, §3):
 *   WPDIS = Σ_t γ^t Σ_i w̄_{i,t} r_{i,t},         w̄_{i,t} = c_i W_{i,t} / Σ_j c_j W_{j,t}
 *
 * Weighted doubly robust (Thomas & Brunskill 2016, eq. 10, the weighted form of the doubly
 * robust estimator of Jiang & Li, "Doubly robust off-policy value evaluation for reinforcement
 * learning", ICML 2016):
 *   WDR = WPDIS − Σ_t γ^t Σ_i ( w̄_{i,t} Q̂(s_{i,t}, a_{i,t}) − w̄_{i,t−1} V̂(s_{i,t}) ),  w̄_{i,−1} = c_i/Σ_j c_j
 *
 * Episodes cut by a time limit: each step t is normalised over the episodes whose log reaches step t
 * (so an episode cut early stops contributing rather than counting as zero reward). Episodes that end
 * in an absorbing state are padded with it instead (below).
 *
 * Time limits. Without tails both estimators cover Σ_{t<T} γ^t r_t only: the part of the return
 * beyond the logged episodes' ends is missing (γ^100 ≈ 5 % of the weight at γ = 0.97, 37 % at 0.99).
 * With tails (an episode that ends on a time limit at T_k, and V̂ the candidate's fitted state value
 * at its last next state s_{T_k}) the missing part is bootstrapped, as in the n-step return
 * G_{0:T} = Σ_{t<T} γ^t r_t + γ^T V̂(s_T) (Sutton & Barto §7.1; Pardo et al., "Time limits in
 * reinforcement learning", ICML 2018):
 *   WDR:   the doubly robust recursion's state term at step T_k, w̄_{k,T_k−1} V̂(s_{k,T_k}), is kept
 *          for the ending episode: the state term at step t averages w_{t−1}V̂(s_t) over every episode
 *          whose state at t is logged (those that act at t and those that end there), so its
 *          telescoping sum Σ_t γ^t(E V̂_t − E Q̂_t + E r_t) = E V̂_0 + Σ_t γ^t E[r_t + γV̂_{t+1} − Q̂_t]
 *          keeps its last term (the recursive form of Jiang & Li 2016, with V̂ past the horizon).
 *   WPDIS: γ^H Σ_k w̄_{k,H−1} V̂(s_{k,H}) over the episodes that end on a time limit at the longest
 *          length H (steps before H are already covered by the episodes that reach them).
 * Episodes that end in a terminal state get no tail.
 *
 * Runs that end in an absorbing state (terminal = 1) are padded with it (Thomas & Brunskill 2016
 * treat runs of unequal length so): from its length T_k on, run k pays 0, has Q̂ = V̂ = 0 and keeps
 * its last weight W_{k,T_k−1} (ρ = 1 there), so it stays in every later step's normaliser. Leaving
 * it out, as for a time limit, would estimate E_π[r_t | the run still going] and drop the factor
 * P_π(still going at t). Per step that adds A_t = Σ_{T_k ≤ t} c_k W_{k,T_k−1} to the weight sums at
 * t and A′_t (the same runs on step t − 1's scale) to the sums before the decision and to the
 * WPDIS tail's normaliser: A′_t = A_{t−1} + Σ_{T_k = t} c_k W_{k,t−1}, A_t = A′_t, each carried on
 * the absorbed runs' own scale and brought to the step's (importanceWeights.ts). On a log without such
 * runs A = A′ = 0 and the sums are unchanged.
 *
 * Padding alone assumes every run would have been logged to H had it not ended. Where runs are cut by
 * a time limit before H (the log's end, a left-out window), an ended run's place in later steps' sums
 * is known only while its own log would have gone on, and padding it regardless over-weights the
 * ended runs: with S(t) = P_π(still going at t), f(u) = P_π(ends at u) and G(t) the chance that a
 * run's log is not cut by t, the step-t share of the runs going tends to G(t)S(t)/(G(t)S(t) +
 * Σ_{u≤t} f(u)G(u−1)) instead of S(t) (too small wherever logs are cut early). The ended runs are
 * therefore weighted by the chance that their log would still go on (inverse probability of
 * censoring weighting, Robins & Rotnitzky 1992; the product-limit form of Kaplan & Meier 1958): at
 * each step the padded sum keeps the share of the runs known to be going there that are not cut there,
 *   κ_t = L_t / (L_t + K_t),   L_t = Σ_{runs acting at t} c W_{t−1},   K_t = Σ_{T_k = t, cut} c W_{k,t−1},
 * so A_t = κ_t · A′_t (each on its step's scale), and the state term's normaliser takes A′_t (L_t + E_t)/(L_t + K_t),
 * E_t the cut runs with a tail (all of them in the pipeline, so the factor is 1 there). With no run cut
 * before H, κ = 1 and the sums are Thomas & Brunskill's. With tails neither estimate is free of the
 * fitted value any more: their agreement with FQE is then partly agreement with itself, in
 * proportion to the tail's weight (report γ^H beside them).
 */
import type { ImportanceWeightTable } from './importanceWeights';

export class ImportanceSamplingError extends Error {
  constructor(message: string) {
    super(message);
    this.name = 'ImportanceSamplingError';
  }
}

/**
 * The table's entries regrouped step by step (all episodes' step 0, then step 1, …), so that each
 * step's sums accumulate in registers: a resample then costs one sequential pass with a gather of
 * the episode multiplicity per entry, instead of scattered updates of per-step totals.
 */
export interface PerDecisionData {
  readonly horizon: number; // H: the longest episode
  readonly episodes: number;
  readonly stepOffsets: Int32Array; // horizon+1: entries of step t at stepOffsets[t] … stepOffsets[t+1]
  readonly episode: Int32Array; // n, step-major
  readonly scaled: Float64Array; // n, step-major W_{i,t} (scaled per step)
  readonly scaledBefore: Float64Array; // n, W_{i,t−1}
  readonly rewards: Float64Array; // n
  readonly actionValues: Float64Array | null; // n, Q̂(s_{i,t}, a_{i,t})
  readonly stateValues: Float64Array | null; // n, V̂(s_{i,t})
  /** Episodes that end on a time limit, grouped by their length T (1 … H): at endOffsets[T] … endOffsets[T+1]. */
  readonly endOffsets: Int32Array; // H+2
  readonly endEpisode: Int32Array; // one per time-limited episode
  readonly endWeight: Float64Array; // W_{k,T−1} scaled as at step T−1
  readonly endValue: Float64Array; // V̂(s_{k,T})
  /** Runs absorbed at their length T (1 … H), grouped by T: at absorbedOffsets[T] … absorbedOffsets[T+1]. */
  readonly absorbedOffsets: Int32Array; // H+2
  readonly absorbedEpisode: Int32Array; // one per absorbed run
  readonly absorbedWeight: Float64Array; // W_{k,T−1} / e^{R_T} (importanceWeights.ts absorbedLargest)
  /** importanceWeights.ts: R_{t−1} to R_t, R_t to step t − 1's scale and to step t's; where some run going at t has a weight. */
  readonly heldCarry: Float64Array; // H+1
  readonly absorbedToBefore: Float64Array; // H+1
  readonly absorbedToStep: Float64Array; // H+1
  readonly liveWeighted: Uint8Array; // H
  /** Runs cut by a time limit (not absorbed, length ≥ 1, tail or not) grouped by length T: at cutOffsets[T] … cutOffsets[T+1]. */
  readonly cutOffsets: Int32Array; // H+2
  readonly cutEpisode: Int32Array; // one per cut run
  readonly cutWeight: Float64Array; // W_{k,T−1} scaled as at step T−1
}

/** What the tails need per episode, in data episode order (e each). */
export interface EpisodeTails {
  /** V̂ of the evaluated policy at each episode's last next state (loggedReturn.ts: episodeEnds(...).finalStates). */
  readonly finalStateValues: ArrayLike<number>;
  /** Non-zero where the episode ends on a time limit (episodeEnds(...).tailWeights); 0 after a terminal state. */
  readonly tailWeights: ArrayLike<number>;
}

/**
 * values: Q̂ and V̂ in the table's episode-major order (n each), or null for importance sampling alone;
 * tails: the bootstrapped value past each time-limited episode's end, or omitted for none.
 */
export function perDecisionData(
  table: ImportanceWeightTable, values: { actionValues: Float64Array; stateValues: Float64Array } | null, tails?: EpisodeTails,
): PerDecisionData {
  const { index, horizon, step } = table, n = step.length;
  if (values) refuseNonFinite(table, values);
  const stepOffsets = new Int32Array(horizon + 1);
  for (let p = 0; p < n; p++) stepOffsets[step[p] + 1]++;
  for (let t = 0; t < horizon; t++) stepOffsets[t + 1] += stepOffsets[t];
  const { from, to, episode } = stepMajorOrder(index, step, stepOffsets);
  const gather = (a: Float64Array) => {
    const out = new Float64Array(n); // a plain loop: Float64Array.from with a map function is several times slower at 10⁶ entries
    for (let q = 0; q < n; q++) out[to[q]] = a[from[q]];
    return out;
  };
  return {
    horizon, episodes: index.episodes, stepOffsets, episode,
    scaled: gather(table.scaled), scaledBefore: gather(table.scaledBefore), rewards: gather(table.rewards),
    actionValues: values && gather(values.actionValues), stateValues: values && gather(values.stateValues),
    ...episodeEndGroups(table, tails), ...absorbedGroups(table), ...cutGroups(table),
  };
}

/** Episodes taken this many at a time when entries are regrouped step by step (stepMajorOrder). */
const EPISODE_CHUNK = 64;

/**
 * Where each entry goes when the episode-major entries are regrouped step-major (step t's entries
 * in episode order, from stepOffsets[t]): entry from[q] goes to to[q], episode[to[q]] its episode.
 * The pairs are listed a chunk of episodes at a time, step by step within the chunk, so a copy that
 * follows them reads a chunk's entries while they are in cache and writes each step's part of the
 * chunk in a row (a blocked transpose) instead of reading one entry per cache line.
 */
function stepMajorOrder(index: ImportanceWeightTable['index'], step: Int32Array, stepOffsets: Int32Array): { from: Int32Array; to: Int32Array; episode: Int32Array } {
  const n = step.length, next = stepOffsets.slice(), from = new Int32Array(n), to = new Int32Array(n), episode = new Int32Array(n), { offsets } = index;
  let q = 0;
  for (let k0 = 0; k0 < index.episodes; k0 += EPISODE_CHUNK) {
    const k1 = Math.min(index.episodes, k0 + EPISODE_CHUNK);
    let longest = 0;
    for (let k = k0; k < k1; k++) longest = Math.max(longest, offsets[k + 1] - offsets[k]);
    for (let t = 0; t < longest; t++) {
      for (let k = k0; k < k1; k++) {
        const p = offsets[k] + t;
        if (p >= offsets[k + 1]) continue;
        if (step[p] !== t) throw new ImportanceSamplingError(`run ${k + 1}: its entries are not numbered step by step from 0`);
        const j = next[t]++; // within a step, episodes in increasing order, as one pass over the episodes would place them
        from[q] = p;
        to[q++] = j;
        episode[j] = k;
      }
    }
  }
  return { from, to, episode };
}

/** A fitted Q̂ or V̂ that is not a finite number would make the doubly robust sum NaN: refuse it, naming the run and step. */
function refuseNonFinite(table: ImportanceWeightTable, values: { actionValues: Float64Array; stateValues: Float64Array }): void {
  for (const [name, a] of [['Q̂', values.actionValues], ['V̂', values.stateValues]] as const) {
    for (let p = 0; p < a.length; p++) {
      if (Number.isFinite(a[p])) continue;
      let k = 0;
      while (table.index.offsets[k + 1] <= p) k++;
      throw new ImportanceSamplingError(`the fitted ${name} at run ${k + 1}, step ${table.step[p] + 1} is not a finite number: the fit broke down there, so the checks that reweight the logged runs cannot use it`);
    }
  }
}

/** The runs of `table` for which `member` holds, grouped by length T: offsets (H+2) and runs. */
function runsByLength(table: ImportanceWeightTable, member: (k: number, length: number) => boolean): { offsets: Int32Array; runs: Int32Array } {
  const { index, horizon } = table, e = index.episodes, length = (k: number) => index.offsets[k + 1] - index.offsets[k];
  const offsets = new Int32Array(horizon + 2);
  for (let k = 0; k < e; k++) if (member(k, length(k))) offsets[length(k) + 1]++;
  for (let t = 0; t <= horizon; t++) offsets[t + 1] += offsets[t];
  const next = offsets.slice(0, horizon + 1), runs = new Int32Array(offsets[horizon + 1]);
  for (let k = 0; k < e; k++) if (member(k, length(k))) runs[next[length(k)]++] = k;
  return { offsets, runs };
}

/** Absorbed runs grouped by length T, with their last weight on the absorbed runs' scale R_T; the table's scales. */
function absorbedGroups(table: ImportanceWeightTable) {
  const { offsets, runs } = runsByLength(table, (k, length) => table.absorbed[k] !== 0 && length > 0);
  const { index, logWeight, absorbedLargest, heldCarry, absorbedToBefore, absorbedToStep, liveWeighted } = table;
  const absorbedWeight = Float64Array.from(runs, (k) => Math.exp(logWeight[index.offsets[k + 1] - 1] - absorbedLargest[index.offsets[k + 1] - index.offsets[k]]));
  return { absorbedOffsets: offsets, absorbedEpisode: runs, absorbedWeight, heldCarry, absorbedToBefore, absorbedToStep, liveWeighted };
}

/** Runs cut by a time limit grouped by length, with their last scaled weight (whether or not they carry a tail). */
function cutGroups(table: ImportanceWeightTable) {
  const { offsets, runs } = runsByLength(table, (k, length) => table.absorbed[k] === 0 && length > 0);
  const cutWeight = Float64Array.from(runs, (k) => table.scaled[table.index.offsets[k + 1] - 1]);
  return { cutOffsets: offsets, cutEpisode: runs, cutWeight };
}

/** Time-limited episodes grouped by length, with their last scaled weight and V̂(s_T). */
function episodeEndGroups(table: ImportanceWeightTable, tails: EpisodeTails | undefined) {
  const { index } = table, e = index.episodes;
  if (tails && (tails.finalStateValues.length !== e || tails.tailWeights.length !== e)) {
    throw new ImportanceSamplingError(`tails: expected one final value and one tail weight per episode (${e}), got ${tails.finalStateValues.length} and ${tails.tailWeights.length}`);
  }
  const { offsets: endOffsets, runs: endEpisode } = runsByLength(table, (k, length) => tails !== undefined && tails.tailWeights[k] !== 0 && length > 0);
  const endWeight = Float64Array.from(endEpisode, (k) => table.scaled[index.offsets[k + 1] - 1]);
  const endValue = Float64Array.from(endEpisode, (k) => tails!.finalStateValues[k]);
  const bad = endValue.findIndex((v) => !Number.isFinite(v));
  if (bad >= 0) throw new ImportanceSamplingError(`tails: the final state value of episode ${endEpisode[bad] + 1} is not a finite number`);
  return { endOffsets, endEpisode, endWeight, endValue };
}

export interface PerDecisionEstimates {
  readonly importanceSampling: number; // WPDIS, reward sense (tail included when the data carry tails)
  readonly doublyRobust: number | null; // WDR; null without Q̂ and V̂
  /** The WPDIS tail γ^H Σ w̄ V̂(s_H) alone (0 without tails): the part that rests on the fitted value. */
  readonly importanceSamplingTail: number;
}

/** WPDIS and, when the data carry Q̂ and V̂, WDR — both from one pass. multiplicities: e, default all 1. */
export function perDecisionEstimates(data: PerDecisionData, discount: number, multiplicities?: ArrayLike<number>): PerDecisionEstimates {
  if (multiplicities && multiplicities.length !== data.episodes) {
    throw new ImportanceSamplingError(`multiplicities: expected one per episode (${data.episodes}), got ${multiplicities.length}`);
  }
  // The inner loop is kept free of branches (V8 does not hoist them): absent inputs become ones and zeros.
  const c = multiplicities ? Float64Array.from(multiplicities) : new Float64Array(data.episodes).fill(1);
  const zeros = data.actionValues && data.stateValues ? null : new Float64Array(data.scaled.length);
  const q = data.actionValues ?? zeros!, v = data.stateValues ?? zeros!;
  const { stepOffsets, episode, scaled, scaledBefore, rewards, endOffsets, endEpisode, endWeight, endValue } = data;
  let is = 0, correction = 0, tail = 0, discountPower = 1, absorbedAt = 0;
  const padded = new Float64Array(3);
  for (let t = 0; t <= data.horizon; t++, discountPower *= discount) {
    let reached = 0, weight = 0, weightBefore = 0, reward = 0, action = 0, state = 0, ending = 0, endingValue = 0;
    const end = t < data.horizon ? stepOffsets[t + 1] : 0;
    for (let j = t < data.horizon ? stepOffsets[t] : 0; j < end; j++) {
      const ck = c[episode[j]], w = ck * scaled[j], before = ck * scaledBefore[j];
      reached += ck;
      weight += w;
      weightBefore += before;
      reward += w * rewards[j];
      action += w * q[j];
      state += before * v[j];
    }
    for (let j = endOffsets[t]; j < endOffsets[t + 1]; j++) {
      const before = c[endEpisode[j]] * endWeight[j];
      ending += before;
      endingValue += before * endValue[j];
    }
    const held = absorbedAt * data.heldCarry[t] + groupSum(data.absorbedOffsets, data.absorbedEpisode, data.absorbedWeight, c, t); // A′_t on R_t
    paddedWeights(held, weightBefore, groupSum(data.cutOffsets, data.cutEpisode, data.cutWeight, c, t), ending, data, t, padded);
    absorbedAt = padded[2];
    if (reached > 0 && !(weight > 0 && weightBefore > 0) && (!data.liveWeighted[t] || !(padded[1] > 0 && padded[0] > 0))) throw zeroWeights(t);
    weight += padded[1];
    weightBefore += padded[0];
    if (reached > 0) is += (discountPower * reward) / weight;
    if (reached > 0) correction -= (discountPower * action) / weight;
    if (weightBefore + ending > 0) correction += (discountPower * (state + endingValue)) / (weightBefore + ending);
    if (t === data.horizon && ending > 0) tail = (discountPower * endingValue) / (weightBefore + ending);
  }
  return { importanceSampling: is + tail, doublyRobust: zeros ? null : is + correction, importanceSamplingTail: tail };
}

export function zeroWeights(t: number): ImportanceSamplingError {
  return new ImportanceSamplingError(`the importance weights are zero at step ${t + 1} in every run still going: the candidate gives the logged actions no probability`);
}

/** Σ c_k W_{k,t−1} over group t of runs grouped by length (absorbed runs on R_t, cut runs on step t − 1's scale): 0 on most steps. */
function groupSum(offsets: Int32Array, runs: Int32Array, weights: Float64Array, c: Float64Array, t: number): number {
  let sum = 0;
  for (let j = offsets[t]; j < offsets[t + 1]; j++) sum += c[runs[j]] * weights[j];
  return sum;
}

/**
 * The padded runs' weight at step t (see the header). held: A′_t on the absorbed runs' own scale R_t
 * (importanceWeights.ts), so that an ended run too small to show beside the runs going when it ended
 * still counts once they fall to its level; liveBefore: L_t; cutting: K_t; ending: E_t (E_t ≤ K_t), on
 * step t − 1's scale. out[0] = A′_t (L_t + E_t)/(L_t + K_t) on step t − 1's scale, for the sums before
 * the decision; out[1] = A_t = A′_t · L_t/(L_t + K_t) on step t's, for the sums at t; out[2] = A_t on R_t,
 * carried to the next step. x/x is exactly 1, so with no run cut at t the factors are exactly 1.
 */
export function paddedWeights(
  held: number, liveBefore: number, cutting: number, ending: number,
  scales: Pick<PerDecisionData, 'absorbedToBefore' | 'absorbedToStep'>, t: number, out: Float64Array,
): void {
  const known = liveBefore + cutting;
  out[0] = (known > 0 ? held * ((liveBefore + ending) / known) : held) * scales.absorbedToBefore[t];
  out[2] = held * notCutShare(liveBefore, cutting);
  out[1] = out[2] * scales.absorbedToStep[t];
}

/** κ_t = L_t/(L_t + K_t): the share of the runs known to be going at t that are not cut there (see the header); exactly 1 where none is cut, or none is known. */
export function notCutShare(liveBefore: number, cutting: number): number {
  const known = liveBefore + cutting;
  return known > 0 ? liveBefore / known : 1;
}
