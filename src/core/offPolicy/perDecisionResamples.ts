/**
 * The per-decision estimators of perDecisionEstimators.ts — weighted per-decision importance
 * sampling (Precup, Sutton & Singh 2000; weighted form as in Thomas & Brunskill, ICML 2016, §3) and
 * weighted doubly robust (Thomas & Brunskill 2016, eq. 10; Jiang & Li, ICML 2016), with the same
 * time-limit tails — on a block of bootstrap resamples at once.
 *
 * Why: each estimate needs, per step t, the sums Σ_i c_i x_{i,t} of five quantities over the
 * episodes that reach t (the per-step normalisation makes it a ratio per step, so no per-episode
 * total can stand in for them): one pass over all n entries per resample, which is bound by memory
 * traffic (six arrays of n numbers). Here the entries are read once per block of RESAMPLE_BLOCK
 * resamples, and the products W·r, W·Q̂ and W_{t−1}·V̂ are formed once (prepareResampleEntries), so a
 * resample costs a quarter of the reading. The sums are the same sums: the result equals
 * perDecisionEstimates(data, γ, c) up to rounding in the order of multiplication (c·(W·r) against
 * (c·W)·r); the test compares the two.
 *
 * Shapes: entries step-major as in PerDecisionData (n each); multiplicities one Uint32Array of e per resample.
 */
import { ImportanceSamplingError, type PerDecisionData, type PerDecisionEstimates } from './perDecisionEstimators';

/** Resamples summed in one read of the entries (the inner loop is written out for this many). */
export const RESAMPLE_BLOCK = 4;

/** The per-entry products, formed once for every resample. */
export interface ResampleEntries {
  readonly data: PerDecisionData;
  readonly weightedReward: Float64Array; // n: W_{i,t} r_{i,t}
  readonly weightedAction: Float64Array; // n: W_{i,t} Q̂(s_{i,t}, a_{i,t}) (0 without Q̂)
  readonly weightedState: Float64Array; // n: W_{i,t−1} V̂(s_{i,t}) (0 without V̂)
  readonly endWeightedValue: Float64Array; // W_{k,T−1} V̂(s_{k,T}) per time-limited episode
}

export function prepareResampleEntries(data: PerDecisionData): ResampleEntries {
  const n = data.scaled.length, q = data.actionValues, v = data.stateValues;
  const weightedReward = new Float64Array(n), weightedAction = new Float64Array(n), weightedState = new Float64Array(n);
  for (let j = 0; j < n; j++) {
    weightedReward[j] = data.scaled[j] * data.rewards[j];
    if (q && v) {
      weightedAction[j] = data.scaled[j] * q[j];
      weightedState[j] = data.scaledBefore[j] * v[j];
    }
  }
  const endWeightedValue = Float64Array.from(data.endWeight, (w, j) => w * data.endValue[j]);
  return { data, weightedReward, weightedAction, weightedState, endWeightedValue };
}

/** The running totals of one resample across the steps. */
interface Running {
  is: number;
  correction: number;
  tail: number;
  failure: ImportanceSamplingError | null;
}

/** One step's sums for one resample (as in perDecisionEstimates). */
interface StepSums {
  reached: number;
  weight: number;
  weightBefore: number;
  reward: number;
  action: number;
  state: number;
  ending: number;
  endingValue: number;
}

/**
 * WPDIS and WDR on each resample of the block (at most RESAMPLE_BLOCK); an ImportanceSamplingError
 * in place of the estimates where a resample has none, as perDecisionEstimates would throw.
 */
export function perDecisionResamples(entries: ResampleEntries, discount: number, multiplicities: readonly Uint32Array[]): (PerDecisionEstimates | ImportanceSamplingError)[] {
  const { data } = entries, e = data.episodes, count = multiplicities.length;
  if (count < 1 || count > RESAMPLE_BLOCK) throw new RangeError(`perDecisionResamples: 1 to ${RESAMPLE_BLOCK} resamples per block, got ${count}`);
  for (const c of multiplicities) {
    if (c.length !== e) throw new ImportanceSamplingError(`multiplicities: expected one per episode (${e}), got ${c.length}`);
  }
  // Episode-major multiplicities, RESAMPLE_BLOCK per episode (missing resamples repeat the first).
  const c = new Float64Array(e * RESAMPLE_BLOCK);
  for (let k = 0; k < e; k++) for (let b = 0; b < RESAMPLE_BLOCK; b++) c[k * RESAMPLE_BLOCK + b] = multiplicities[b < count ? b : 0][k];
  const running: Running[] = Array.from({ length: RESAMPLE_BLOCK }, () => ({ is: 0, correction: 0, tail: 0, failure: null }));
  const sums: StepSums[] = Array.from({ length: RESAMPLE_BLOCK }, () => emptySums());
  let discountPower = 1;
  for (let t = 0; t <= data.horizon; t++, discountPower *= discount) {
    stepSums(entries, c, t, sums);
    for (let b = 0; b < count; b++) finishStep(running[b], sums[b], t, data.horizon, discountPower);
  }
  return running.slice(0, count).map((r) => r.failure ?? {
    importanceSampling: r.is + r.tail, doublyRobust: data.actionValues && data.stateValues ? r.is + r.correction : null, importanceSamplingTail: r.tail,
  });
}

function emptySums(): StepSums {
  return { reached: 0, weight: 0, weightBefore: 0, reward: 0, action: 0, state: 0, ending: 0, endingValue: 0 };
}

/**
 * Step t's sums for the block's resamples: the step's entries read twice, three quantities for four
 * resamples at a time (twelve running sums fit the registers; twenty-four spill), each sum added in
 * entry order as before.
 */
function stepSums(entries: ResampleEntries, c: Float64Array, t: number, out: StepSums[]): void {
  const { data, weightedReward: wr, weightedAction: wq, weightedState: wv } = entries, { episode, scaled, scaledBefore } = data;
  const start = t < data.horizon ? data.stepOffsets[t] : 0, end = t < data.horizon ? data.stepOffsets[t + 1] : 0;
  let n0 = 0, w0 = 0, p0 = 0, n1 = 0, w1 = 0, p1 = 0, n2 = 0, w2 = 0, p2 = 0, n3 = 0, w3 = 0, p3 = 0;
  for (let j = start; j < end; j++) {
    const o = episode[j] * 4, w = scaled[j], p = scaledBefore[j];
    const c0 = c[o], c1 = c[o + 1], c2 = c[o + 2], c3 = c[o + 3];
    n0 += c0; w0 += c0 * w; p0 += c0 * p;
    n1 += c1; w1 += c1 * w; p1 += c1 * p;
    n2 += c2; w2 += c2 * w; p2 += c2 * p;
    n3 += c3; w3 += c3 * w; p3 += c3 * p;
  }
  let r0 = 0, a0 = 0, s0 = 0, r1 = 0, a1 = 0, s1 = 0, r2 = 0, a2 = 0, s2 = 0, r3 = 0, a3 = 0, s3 = 0;
  for (let j = start; j < end; j++) {
    const o = episode[j] * 4, r = wr[j], a = wq[j], s = wv[j];
    const c0 = c[o], c1 = c[o + 1], c2 = c[o + 2], c3 = c[o + 3];
    r0 += c0 * r; a0 += c0 * a; s0 += c0 * s;
    r1 += c1 * r; a1 += c1 * a; s1 += c1 * s;
    r2 += c2 * r; a2 += c2 * a; s2 += c2 * s;
    r3 += c3 * r; a3 += c3 * a; s3 += c3 * s;
  }
  setSums(out[0], n0, w0, p0, r0, a0, s0);
  setSums(out[1], n1, w1, p1, r1, a1, s1);
  setSums(out[2], n2, w2, p2, r2, a2, s2);
  setSums(out[3], n3, w3, p3, r3, a3, s3);
  for (const s of out) s.ending = s.endingValue = 0;
  for (let j = data.endOffsets[t]; j < data.endOffsets[t + 1]; j++) {
    const o = data.endEpisode[j] * 4;
    for (let b = 0; b < RESAMPLE_BLOCK; b++) {
      out[b].ending += c[o + b] * data.endWeight[j];
      out[b].endingValue += c[o + b] * entries.endWeightedValue[j];
    }
  }
}

function setSums(s: StepSums, reached: number, weight: number, weightBefore: number, reward: number, action: number, state: number): void {
  s.reached = reached;
  s.weight = weight;
  s.weightBefore = weightBefore;
  s.reward = reward;
  s.action = action;
  s.state = state;
}

/** The step's contribution, exactly as perDecisionEstimates adds it. */
function finishStep(r: Running, s: StepSums, t: number, horizon: number, discountPower: number): void {
  if (r.failure) return;
  if (s.reached > 0 && !(s.weight > 0 && s.weightBefore > 0)) {
    r.failure = new ImportanceSamplingError(`the importance weights are zero at step ${t + 1} in every run: the candidate gives the logged actions no probability`);
    return;
  }
  if (s.reached > 0) r.is += (discountPower * s.reward) / s.weight;
  if (s.reached > 0) r.correction -= (discountPower * s.action) / s.weight;
  if (s.weightBefore + s.ending > 0) r.correction += (discountPower * (s.state + s.endingValue)) / (s.weightBefore + s.ending);
  if (t === horizon && s.ending > 0) r.tail = (discountPower * s.endingValue) / s.ending;
}
