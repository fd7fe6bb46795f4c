/**
 * The per-decision estimators (perDecisionEstimators.ts: weighted per-decision importance sampling,
 * Precup, Sutton & Singh 2000; weighted doubly robust, Thomas & Brunskill, ICML 2016, eq. 10) on a
 * block of bootstrap resamples, for the present controller weighed against itself — every weight
 * exactly 1 (rankedEntries.ts, unitWeight) — on a log where no run is absorbed in an end state.
 *
 * Why: with unit weights and no absorbed runs, step t's weight sums are the count N_t = Σ c_i of the
 * runs that reach t (no padded weights: perDecisionEstimators.ts pads only absorbed runs), and a
 * step's estimate is a sum over those runs divided by N_t. On a span of steps reached by the same
 * runs (the same m_t: runs are ranked longest first, so the runs reaching t are ranks 0 … m_t − 1)
 * N_t is one number, so the span's terms add up per run first:
 *   Σ_{t∈span} γ^t Σ_i c_i r_{i,t} / N = Σ_i c_i (Σ_{t∈span} γ^t r_{i,t}) / N,
 * and likewise for the doubly robust correction −γ^t Q̂(s_{i,t}, a_{i,t}) + γ^t V̂(s_{i,t}) — save at
 * the span's first step, where the runs that ended there on a time limit join the V̂ term's
 * denominator (N + E_t) with their tails; those are kept apart. The per-run totals are formed once
 * (unitWeightSpans); a resample then reads one number per run and span for each of three tables
 * instead of one per logged entry: e·(spans) instead of n. Every run of the peer bench's log
 * (bench/peerBench.ts) has the same length: one span, 20,000 runs instead of 10^6 entries.
 *
 * The sums are the same terms added in another order, so the estimates equal the stepwise ones
 * (perDecisionResamples.ts, perDecisionEstimates) up to rounding: each is within γ_k·Σ|terms| of the
 * exact sum, k the longest chain of additions (Higham, "Accuracy and Stability of Numerical
 * Algorithms", 2nd ed., §3.1, §4.2); the test checks the two routes against that bound.
 *
 * Shapes: per-run totals span-major in rank order (span s at offsets[s] + rank); e runs; H = horizon.
 */
import type { PerDecisionEstimates } from './perDecisionEstimators';
import type { RankedEntries } from './rankedEntries';

export interface UnitWeightSpans {
  /** The discount the totals were formed with. */
  readonly discount: number;
  /** Span s covers steps first[s] … first[s + 1] − 1, all reached by ranks 0 … m_{first[s]} − 1; step H (reached by none) is a span of its own. */
  readonly first: Int32Array; // spans + 1
  /** Span s's per-run totals at offsets[s] … offsets[s + 1] − 1 (one per run reaching it). */
  readonly offsets: Int32Array; // spans + 1
  /** Σ_{t∈span} γ^t r_{i,t}. */
  readonly reward: Float64Array;
  /** Σ_{t∈span, t>first} γ^t V̂(s_{i,t}) − Σ_{t∈span} γ^t Q̂(s_{i,t}, a_{i,t}); null without Q̂ and V̂. */
  readonly correction: Float64Array | null;
  /** V̂(s_{i,t}) at the span's first step; null without Q̂ and V̂. */
  readonly firstState: Float64Array | null;
  /** γ^t, t = 0 … H, formed by repeated multiplication as the stepwise routes form it. */
  readonly power: Float64Array; // H+1
}

/**
 * The per-run span totals of ranked entries at this discount, or null where the route does not apply
 * (a weight other than 1, an absorbed run, or a time-limit end inside a span, which the ranking rules out).
 */
export function unitWeightSpans(entries: RankedEntries, discount: number): UnitWeightSpans | null {
  const { reaching, offsets: stepAt, weightedReward: wr, weightedAction: wq, weightedState: wv, data } = entries, horizon = reaching.length - 1;
  if (!entries.unitWeight || entries.absorbedRank.length > 0) return null;
  const starts = [0];
  for (let t = 1; t <= horizon; t++) if (reaching[t] !== reaching[t - 1]) starts.push(t);
  if (starts[starts.length - 1] !== horizon) return null; // step H is reached by no run, so it starts a span unless the log is empty
  for (let s = 0; s < starts.length; s++) {
    const to = s + 1 < starts.length ? starts[s + 1] : horizon + 1;
    for (let t = starts[s] + 1; t < to; t++) if (data.endOffsets[t + 1] > data.endOffsets[t]) return null;
  }
  starts.push(horizon + 1);
  const first = Int32Array.from(starts), spans = first.length - 1, offsets = new Int32Array(spans + 1);
  for (let s = 0; s < spans; s++) offsets[s + 1] = offsets[s] + reaching[first[s]];
  const power = new Float64Array(horizon + 1);
  for (let t = 0, p = 1; t <= horizon; t++, p *= discount) power[t] = p;
  const total = offsets[spans], reward = new Float64Array(total);
  const withValues = wq !== null && wv !== null, correction = withValues ? new Float64Array(total) : null, firstState = withValues ? new Float64Array(total) : null;
  for (let s = 0; s < spans; s++) {
    const o = offsets[s], m = offsets[s + 1] - o;
    for (let t = first[s]; t < first[s + 1] && m > 0; t++) {
      const at = stepAt[t], g = power[t];
      for (let r = 0; r < m; r++) reward[o + r] += g * wr[at + r];
      if (!correction || !firstState) continue;
      for (let r = 0; r < m; r++) correction[o + r] -= g * wq![at + r];
      if (t === first[s]) for (let r = 0; r < m; r++) firstState[o + r] = wv![at + r];
      else for (let r = 0; r < m; r++) correction[o + r] += g * wv![at + r];
    }
  }
  return { discount, first, offsets, reward, correction, firstState, power };
}

/**
 * WPDIS and WDR on each resample of the block from the span totals: as perDecisionEstimates adds
 * them, span by span. With unit weights every step reached by a resample's runs has a positive
 * weight sum, so no resample lacks an estimate.
 */
export function unitSpanResamples(entries: RankedEntries, spans: UnitWeightSpans, multiplicities: readonly Uint32Array[]): PerDecisionEstimates[] {
  const { rankOf, endRank, endWeightedValue } = entries, { endOffsets, endWeight } = entries.data, e = rankOf.length;
  const { first, offsets, reward, correction, firstState, power } = spans, horizon = power.length - 1, ranked = new Float64Array(e);
  return multiplicities.map((c) => {
    for (let k = 0; k < e; k++) ranked[rankOf[k]] = c[k];
    let is = 0, corrected = 0, tail = 0;
    for (let s = 0; s + 1 < first.length; s++) {
      const t = first[s], o = offsets[s], m = offsets[s + 1] - o;
      let reached = 0, rewards = 0, corrections = 0, states = 0, ending = 0, endingValue = 0;
      for (let r = 0; r < m; r++) {
        const cr = ranked[r];
        reached += cr;
        rewards += cr * reward[o + r];
      }
      if (correction && firstState) {
        for (let r = 0; r < m; r++) {
          corrections += ranked[r] * correction[o + r];
          states += ranked[r] * firstState[o + r];
        }
      }
      for (let j = endOffsets[t]; j < endOffsets[t + 1]; j++) {
        const before = ranked[endRank[j]] * endWeight[j];
        ending += before;
        endingValue += ranked[endRank[j]] * endWeightedValue[j];
      }
      if (reached > 0) is += rewards / reached;
      if (reached > 0) corrected += corrections / reached;
      if (reached + ending > 0) corrected += (power[t] * (states + endingValue)) / (reached + ending);
      if (t === horizon && ending > 0) tail = (power[t] * endingValue) / (reached + ending);
    }
    return { importanceSampling: is + tail, doublyRobust: correction ? is + corrected : null, importanceSamplingTail: tail };
  });
}

/** The buffers of the span totals, for a host that transfers them. */
export function spanBuffers(spans: UnitWeightSpans | null): ArrayBufferLike[] {
  return spans ? [spans.first, spans.offsets, spans.reward, spans.correction, spans.firstState, spans.power].flatMap((a) => (a ? [a.buffer] : [])) : [];
}
