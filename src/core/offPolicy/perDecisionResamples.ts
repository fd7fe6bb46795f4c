/**
 * The per-decision estimators of perDecisionEstimators.ts — weighted per-decision importance
 * sampling (Precup, Sutton & Singh 2000; weighted form as in Thomas & Brunskill, ICML 2016, §3) and
 * weighted doubly robust (Thomas & Brunskill 2016, eq. 10; Jiang & Li, ICML 2016), with the same
 * time-limit tails — on a block of bootstrap resamples at once.
 *
 * Why: each estimate needs, per step t, sums Σ_i c_i x_{i,t} over the episodes that reach t (and the
 * padded runs that ended in an end state, a few numbers per step: perDecisionEstimators.ts) (the
 * per-step normalisation makes it a ratio per step, so no per-episode total can stand in for
 * them): for R resamples that is the product of an R×e matrix of multiplicities with e×H tables,
 * R·n multiply-adds per table however it is arranged. What this file saves is the constant:
 *   - four tables instead of six (rankedEntries.ts: the count is a prefix sum of the ranked
 *     multiplicities, the weight before the decision a partial sum of the step before's weight);
 *   - the entries ranked so a step's episodes are a prefix, read in order with the multiplicities
 *     of four resamples side by side (no gather by episode index);
 *   - a step's entries (a few hundred kilobytes) read from memory once for RESAMPLE_BLOCK
 *     resamples, four at a time while they are still in cache;
 *   - where every weight is exactly 1 (the present controller weighed against itself), three
 *     tables: the weight sums are then the counts (rankedEntries.ts, unitWeight); and where,
 *     besides, no run is absorbed in an end state, per-run totals over spans of steps reached by
 *     the same runs (unitWeightSpans.ts), equal to rounding, when the entries were prepared with
 *     the discount.
 * The sums are the same sums, added in rank order rather than episode order: the result equals
 * perDecisionEstimates(data, γ, c) up to rounding; the test compares the two.
 *
 * Shapes: multiplicities one Uint32Array of e per resample, at most RESAMPLE_BLOCK.
 */
import { ImportanceSamplingError, paddedWeights, zeroWeights, type PerDecisionEstimates } from './perDecisionEstimators';
import { rankEntries, type RankedEntries } from './rankedEntries';
import { unitSpanResamples, unitWeightSpans, type UnitWeightSpans } from './unitWeightSpans';

/** Resamples summed in one read of the entries from memory. */
export const RESAMPLE_BLOCK = 8;
/** Resamples summed side by side in registers (the inner loops are written out for this many). */
const LANES = 4;

export interface ResampleEntries extends RankedEntries {
  /** The unit-weight span totals at the discount given to prepareResampleEntries (unitWeightSpans.ts); null where they do not apply or none was given. */
  readonly spans: UnitWeightSpans | null;
}

/** The entries ranked (rankedEntries.ts) and, given the discount, the unit-weight span totals where they apply. */
export function prepareResampleEntries(data: Parameters<typeof rankEntries>[0], discount?: number): ResampleEntries {
  const ranked = rankEntries(data);
  return { ...ranked, spans: discount === undefined ? null : unitWeightSpans(ranked, discount) };
}

/** One step's sums per resample: LANES × FIELDS per group, resample-major within the group. */
const FIELDS = 10;
const REACHED = 0, WEIGHT = 1, BEFORE = 2, REWARD = 3, ACTION = 4, STATE = 5, ENDING = 6, ENDING_VALUE = 7, PADDED = 8, PADDED_BEFORE = 9;

/** The running totals of one resample across the steps. */
interface Running {
  is: number;
  correction: number;
  tail: number;
  failure: ImportanceSamplingError | null;
}

/**
 * WPDIS and WDR on each resample of the block (at most RESAMPLE_BLOCK); an ImportanceSamplingError
 * in place of the estimates where a resample has none, as perDecisionEstimates would throw.
 */
export function perDecisionResamples(entries: ResampleEntries, discount: number, multiplicities: readonly Uint32Array[]): (PerDecisionEstimates | ImportanceSamplingError)[] {
  const { data } = entries, e = data.episodes, count = multiplicities.length, horizon = data.horizon;
  if (count < 1 || count > RESAMPLE_BLOCK) throw new RangeError(`perDecisionResamples: 1 to ${RESAMPLE_BLOCK} resamples per block, got ${count}`);
  for (const c of multiplicities) {
    if (c.length !== e) throw new ImportanceSamplingError(`multiplicities: expected one per episode (${e}), got ${c.length}`);
  }
  if (entries.spans && entries.spans.discount === discount) return unitSpanResamples(entries, entries.spans, multiplicities);
  const groups = Math.ceil(count / LANES), lanes = Array.from({ length: groups }, (_, g) => rankedLanes(entries, multiplicities, g));
  const reached = lanes.map((c) => reachedCounts(entries, c));
  const running: Running[] = Array.from({ length: count }, () => ({ is: 0, correction: 0, tail: 0, failure: null }));
  const sums = new Float64Array(groups * LANES * FIELDS), before = new Float64Array(groups * LANES), pair = new Float64Array(2 * LANES);
  const absorbedAt = new Float64Array(groups * LANES), padded = new Float64Array(3); // A_t per resample (perDecisionEstimators.ts)
  for (let g = 0; g < groups; g++) for (let l = 0; l < LANES; l++) before[g * LANES + l] = reached[g][l]; // W_{i,−1} = 1
  let discountPower = 1;
  for (let t = 0; t <= horizon; t++, discountPower *= discount) {
    for (let g = 0; g < groups; g++) {
      const s = sums.subarray(g * LANES * FIELDS, (g + 1) * LANES * FIELDS);
      for (let l = 0; l < LANES; l++) {
        s[l * FIELDS + REACHED] = reached[g][t * LANES + l];
        s[l * FIELDS + BEFORE] = before[g * LANES + l];
      }
      if (entries.unitWeight) unitWeightSums(entries, lanes[g], t, s, pair);
      else {
        weightSums(entries, lanes[g], t, s, before.subarray(g * LANES, (g + 1) * LANES), pair);
        valueSums(entries, lanes[g], t, s, pair);
      }
      endingSums(entries, lanes[g], t, s);
      absorbedSums(entries, lanes[g], t, s, absorbedAt.subarray(g * LANES, (g + 1) * LANES), padded);
    }
    for (let b = 0; b < count; b++) finishStep(running[b], sums.subarray(b * FIELDS, (b + 1) * FIELDS), t, horizon, discountPower, data.liveWeighted);
  }
  return running.map((r) => r.failure ?? {
    importanceSampling: r.is + r.tail, doublyRobust: entries.weightedAction ? r.is + r.correction : null, importanceSamplingTail: r.tail,
  });
}

/** Group g's multiplicities in rank order, LANES per rank (lanes past the block's end are 0), written a rank's four at a time. */
function rankedLanes(entries: ResampleEntries, multiplicities: readonly Uint32Array[], g: number): Float64Array {
  const { rankOf } = entries, e = rankOf.length, c = new Float64Array(e * LANES), first = g * LANES;
  if (multiplicities.length - first < LANES) {
    for (let l = 0; first + l < multiplicities.length; l++) for (let k = 0; k < e; k++) c[rankOf[k] * LANES + l] = multiplicities[first + l][k];
    return c;
  }
  const m0 = multiplicities[first], m1 = multiplicities[first + 1], m2 = multiplicities[first + 2], m3 = multiplicities[first + 3];
  for (let k = 0; k < e; k++) {
    const o = rankOf[k] * LANES;
    c[o] = m0[k]; c[o + 1] = m1[k]; c[o + 2] = m2[k]; c[o + 3] = m3[k];
  }
  return c;
}

/** Σ_{rank < m_t} c per lane and step (H+1)×LANES: the episodes that reach each step, counted with their multiplicities. */
function reachedCounts(entries: ResampleEntries, c: Float64Array): Float64Array {
  const { reaching } = entries, horizon = reaching.length - 1, out = new Float64Array((horizon + 1) * LANES);
  let n0 = 0, n1 = 0, n2 = 0, n3 = 0;
  for (let t = horizon, r = 0; t >= 0; t--) {
    for (; r < reaching[t]; r++) {
      n0 += c[r * 4]; n1 += c[r * 4 + 1]; n2 += c[r * 4 + 2]; n3 += c[r * 4 + 3];
    }
    out[t * 4] = n0; out[t * 4 + 1] = n1; out[t * 4 + 2] = n2; out[t * 4 + 3] = n3;
  }
  return out;
}

/**
 * Σ c W and Σ c W r at step t for one group's four resamples; the weight sum over the ranks that
 * also reach t + 1 is kept in `before` as the next step's Σ c W_{t}·[reaches t + 1].
 */
function weightSums(entries: ResampleEntries, c: Float64Array, t: number, s: Float64Array, before: Float64Array, pair: Float64Array): void {
  const { weight: w, weightedReward: wr, offsets, reaching } = entries;
  const base = offsets[t], split = base + (reaching[t + 1] ?? 0), end = base + reaching[t];
  pair.fill(0);
  pairedLaneSums(w, wr, c, base, split, 0, pair);
  before.set(pair.subarray(0, LANES));
  pairedLaneSums(w, wr, c, split, end, (split - base) * LANES, pair);
  storeLanes(s, WEIGHT, REWARD, pair);
}

/** Σ c W Q̂ and Σ c W_{t−1} V̂ at step t (0 without Q̂ and V̂). */
function valueSums(entries: ResampleEntries, c: Float64Array, t: number, s: Float64Array, pair: Float64Array): void {
  const { weightedAction: wq, weightedState: wv, offsets, reaching } = entries;
  pair.fill(0);
  if (wq && wv) pairedLaneSums(wq, wv, c, offsets[t], offsets[t] + reaching[t], 0, pair);
  storeLanes(s, ACTION, STATE, pair);
}

/**
 * weightSums and valueSums where every weight is 1 (rankedEntries.ts, unitWeight): both weight sums
 * at t are the count of the runs that reach t — each c·1 = c exactly, and a sum of counts is exact
 * in any order — so only W·r, W·Q̂ and W_{t−1}·V̂ are read, each added in the same rank order.
 */
function unitWeightSums(entries: ResampleEntries, c: Float64Array, t: number, s: Float64Array, pair: Float64Array): void {
  const { weightedReward: wr, weightedAction: wq, weightedState: wv, offsets, reaching } = entries;
  const from = offsets[t], to = from + reaching[t];
  pair.fill(0);
  if (wq && wv) {
    pairedLaneSums(wr, wq, c, from, to, 0, pair);
    storeLanes(s, REWARD, ACTION, pair);
    pair.fill(0);
    laneSums(wv, c, from, to, pair);
    storeLanes(s, STATE, STATE, pair);
  } else {
    laneSums(wr, c, from, to, pair);
    storeLanes(s, REWARD, REWARD, pair);
    for (let l = 0; l < LANES; l++) s[l * FIELDS + ACTION] = s[l * FIELDS + STATE] = 0;
  }
  for (let l = 0; l < LANES; l++) s[l * FIELDS + WEIGHT] = s[l * FIELDS + BEFORE] = s[l * FIELDS + REACHED];
}

/**
 * pair[l] += Σ_j c_{j,l}·x_j and pair[LANES + l] += Σ_j c_{j,l}·y_j for the four lanes l, over the
 * entries j in [from, to), whose multiplicities start at c[o0] (LANES per entry). The eight sums are
 * carried in locals through the loop and added in entry order from pair's values, so a range split
 * in two gives the same sums to the last bit as one pass.
 */
function pairedLaneSums(x: Float64Array, y: Float64Array, c: Float64Array, from: number, to: number, o0: number, pair: Float64Array): void {
  let x0 = pair[0], x1 = pair[1], x2 = pair[2], x3 = pair[3], y0 = pair[4], y1 = pair[5], y2 = pair[6], y3 = pair[7];
  for (let j = from, o = o0; j < to; j++, o += LANES) {
    const a = x[j], b = y[j], c0 = c[o], c1 = c[o + 1], c2 = c[o + 2], c3 = c[o + 3];
    x0 += c0 * a; x1 += c1 * a; x2 += c2 * a; x3 += c3 * a;
    y0 += c0 * b; y1 += c1 * b; y2 += c2 * b; y3 += c3 * b;
  }
  pair[0] = x0; pair[1] = x1; pair[2] = x2; pair[3] = x3; pair[4] = y0; pair[5] = y1; pair[6] = y2; pair[7] = y3;
}

/** pairedLaneSums for one table: pair[l] = Σ_j c_{j,l}·x_j over [from, to), from 0 (pair[LANES + l] the same sums). */
function laneSums(x: Float64Array, c: Float64Array, from: number, to: number, pair: Float64Array): void {
  let x0 = 0, x1 = 0, x2 = 0, x3 = 0;
  for (let j = from, o = 0; j < to; j++, o += LANES) {
    const a = x[j];
    x0 += c[o] * a; x1 += c[o + 1] * a; x2 += c[o + 2] * a; x3 += c[o + 3] * a;
  }
  pair[0] = pair[4] = x0; pair[1] = pair[5] = x1; pair[2] = pair[6] = x2; pair[3] = pair[7] = x3;
}

/** The lanes' x sums into field fx and their y sums into field fy of each resample's FIELDS. */
function storeLanes(s: Float64Array, fx: number, fy: number, pair: Float64Array): void {
  for (let l = 0; l < LANES; l++) {
    s[l * FIELDS + fx] = pair[l];
    s[l * FIELDS + fy] = pair[LANES + l];
  }
}

/** The time-limited episodes that end at step t: Σ c W_{T−1} and Σ c W_{T−1} V̂(s_T), per lane in the ends' order, carried in locals. */
function endingSums(entries: ResampleEntries, c: Float64Array, t: number, s: Float64Array): void {
  const { endOffsets, endWeight } = entries.data, { endRank, endWeightedValue } = entries;
  let w0 = 0, w1 = 0, w2 = 0, w3 = 0, v0 = 0, v1 = 0, v2 = 0, v3 = 0;
  for (let j = endOffsets[t]; j < endOffsets[t + 1]; j++) {
    const o = endRank[j] * LANES, w = endWeight[j], v = endWeightedValue[j], c0 = c[o], c1 = c[o + 1], c2 = c[o + 2], c3 = c[o + 3];
    w0 += c0 * w; w1 += c1 * w; w2 += c2 * w; w3 += c3 * w;
    v0 += c0 * v; v1 += c1 * v; v2 += c2 * v; v3 += c3 * v;
  }
  s[ENDING] = w0; s[FIELDS + ENDING] = w1; s[2 * FIELDS + ENDING] = w2; s[3 * FIELDS + ENDING] = w3;
  s[ENDING_VALUE] = v0; s[FIELDS + ENDING_VALUE] = v1; s[2 * FIELDS + ENDING_VALUE] = v2; s[3 * FIELDS + ENDING_VALUE] = v3;
}

/**
 * The absorbed runs' weights for step t's sums, as perDecisionEstimates adds them (paddedWeights):
 * A′_t = A_{t−1} + Σ_{T_k = t} c_k W_{k,t−1}, kept in PADDED_BEFORE (times the share of the runs
 * known to be going at t that carry on or have a tail) and A_t in PADDED; `held` carries A per lane
 * from step to step. Reads the step's BEFORE and ENDING sums, so it runs after them.
 */
function absorbedSums(entries: ResampleEntries, c: Float64Array, t: number, s: Float64Array, held: Float64Array, out: Float64Array): void {
  const { absorbedOffsets, absorbedWeight, cutOffsets, cutWeight, heldCarry } = entries.data;
  for (let l = 0; l < LANES; l++) {
    let joining = 0, cutting = 0;
    for (let j = absorbedOffsets[t]; j < absorbedOffsets[t + 1]; j++) joining += c[entries.absorbedRank[j] * LANES + l] * absorbedWeight[j];
    for (let j = cutOffsets[t]; j < cutOffsets[t + 1]; j++) cutting += c[entries.cutRank[j] * LANES + l] * cutWeight[j];
    paddedWeights(held[l] * heldCarry[t] + joining, s[l * FIELDS + BEFORE], cutting, s[l * FIELDS + ENDING], entries.data, t, out);
    held[l] = out[2];
    s[l * FIELDS + PADDED] = out[1];
    s[l * FIELDS + PADDED_BEFORE] = out[0];
  }
}

/** The step's contribution, exactly as perDecisionEstimates adds it. s: one resample's FIELDS. */
function finishStep(r: Running, s: Float64Array, t: number, horizon: number, discountPower: number, liveWeighted: Uint8Array): void {
  if (r.failure) return;
  const reached = s[REACHED], ending = s[ENDING];
  if (reached > 0 && !(s[WEIGHT] > 0 && s[BEFORE] > 0) && (!liveWeighted[t] || !(s[PADDED] > 0 && s[PADDED_BEFORE] > 0))) {
    r.failure = zeroWeights(t);
    return;
  }
  const weight = s[WEIGHT] + s[PADDED], weightBefore = s[BEFORE] + s[PADDED_BEFORE];
  if (reached > 0) r.is += (discountPower * s[REWARD]) / weight;
  if (reached > 0) r.correction -= (discountPower * s[ACTION]) / weight;
  if (weightBefore + ending > 0) r.correction += (discountPower * (s[STATE] + s[ENDING_VALUE])) / (weightBefore + ending);
  if (t === horizon && ending > 0) r.tail = (discountPower * s[ENDING_VALUE]) / (weightBefore + ending);
}
