/**
 * First-order (delta-method) standard errors of the per-decision checks: the derivative of weighted
 * per-decision importance sampling (WPDIS) and weighted doubly robust (WDR) with respect to each
 * run's multiplicity c_k, at the full data (c = 1), in one pass over the entries.
 *
 * Both estimators (perDecisionEstimators.ts) are smooth functions of per-step sums that are linear
 * in c — Σ c W, Σ c W_{t−1}, Σ c W r, Σ c W Q̂, Σ c W_{t−1} V̂, the ending, absorbed and cut runs'
 * sums — through ratios and the padded runs' recursion. The derivative g_k = ∂J/∂c_k is therefore
 * Σ over run k's entries of (∂J/∂sum)·(entry's term), with ∂J/∂sum formed once per step by reverse
 * accumulation (the chain rule taken from the output back, so all e derivatives cost one pass, not
 * e passes). This is the delta method for a ratio estimator applied step by step (Owen, "Monte Carlo
 * theory, methods and examples", §9.2 on the self-normalised importance sampler's variance; common
 * practice), i.e. the infinitesimal jackknife (Efron, "The Jackknife, the Bootstrap and Other
 * Resampling Plans", 1982, §6): the influence value of run k is e·g_k.
 *
 * Use. Each estimator is homogeneous of degree 0 in c (every step's term is a ratio of sums linear in
 * c), so Σ_k g_k = 0 (Euler), and a bootstrap resample with multiplicities c is, to first order,
 *   J_c ≈ J + Σ_k (c_k − 1) g_k                                   (linearisedPerDecision)
 * which pairs with any other estimator's replicates drawn on the same c. Under multinomial
 * resampling of e runs, Cov(c_k, c_l) = δ_kl − 1/e, so the linearised bootstrap's standard error is
 *   SE = √(Σ_k (g_k − ḡ)²)                                          (firstOrderStandardError)
 * = sd(e·g) / √e with the plug-in divisor e (Efron & Tibshirani 1993, §21.3). For every weight 1,
 * no tail and runs of one length, WPDIS is the mean discounted return of the runs and this is the
 * plain sample standard deviation of the runs' returns over √e (the test checks it).
 * Cost: O(n + H) per policy, against O(B·n) for B resampled recomputations. What is left out is of
 * second order, O(1/e): it matters where a few runs carry most of the weight — which is also where
 * the checks' weakness rule (crossCheckVerdict.ts) calls them uninformative.
 */
import { ImportanceSamplingError, paddedWeights, zeroWeights, type PerDecisionData, type PerDecisionEstimates } from './perDecisionEstimators';

export interface PerDecisionDerivatives {
  /** ∂WPDIS/∂c_k at c = 1, per run in data episode order. */
  readonly importanceSampling: Float64Array; // e
  /** ∂WDR/∂c_k at c = 1; null without Q̂ and V̂. */
  readonly doublyRobust: Float64Array | null; // e
}

/** The per-step sums of perDecisionEstimates at c = 1 and the padded weights formed from them, each H+1. */
interface StepSums {
  reached: Float64Array; weight: Float64Array; before: Float64Array; reward: Float64Array; action: Float64Array; state: Float64Array;
  ending: Float64Array; endingValue: Float64Array; held: Float64Array; cutting: Float64Array; paddedBefore: Float64Array; padded: Float64Array;
}

/** ∂J/∂(each per-step sum), H+1 each: the weights of the entries' terms in g_k. */
interface StepAdjoints {
  weight: Float64Array; before: Float64Array; reward: Float64Array; action: Float64Array; state: Float64Array;
  ending: Float64Array; endingValue: Float64Array; joining: Float64Array; cutting: Float64Array;
}

export function perDecisionDerivatives(data: PerDecisionData, discount: number): PerDecisionDerivatives {
  const sums = stepSums(data), withValues = data.actionValues !== null && data.stateValues !== null;
  // WPDIS = is + tail, WDR = is + correction (perDecisionEstimates): the output's weights on the three accumulators.
  const importanceSampling = gatherDerivatives(data, stepAdjoints(data, sums, discount, { is: 1, correction: 0, tail: 1 }));
  const doublyRobust = withValues ? gatherDerivatives(data, stepAdjoints(data, sums, discount, { is: 1, correction: 1, tail: 0 })) : null;
  return { importanceSampling, doublyRobust };
}

/** The forward pass of perDecisionEstimates with every c_k = 1, keeping each step's sums. */
function stepSums(data: PerDecisionData): StepSums {
  const H = data.horizon, make = () => new Float64Array(H + 1);
  const s: StepSums = {
    reached: make(), weight: make(), before: make(), reward: make(), action: make(), state: make(), ending: make(), endingValue: make(),
    held: make(), cutting: make(), paddedBefore: make(), padded: make(),
  };
  const { stepOffsets, scaled, scaledBefore, rewards, actionValues: q, stateValues: v, endOffsets, endWeight, endValue } = data;
  const padded = new Float64Array(3);
  let absorbedAt = 0;
  for (let t = 0; t <= H; t++) {
    const from = t < H ? stepOffsets[t] : 0, to = t < H ? stepOffsets[t + 1] : 0;
    let weight = 0, before = 0, reward = 0, action = 0, state = 0, ending = 0, endingValue = 0;
    for (let j = from; j < to; j++) {
      weight += scaled[j];
      before += scaledBefore[j];
      reward += scaled[j] * rewards[j];
      if (q && v) {
        action += scaled[j] * q[j];
        state += scaledBefore[j] * v[j];
      }
    }
    for (let j = endOffsets[t]; j < endOffsets[t + 1]; j++) {
      ending += endWeight[j];
      endingValue += endWeight[j] * endValue[j];
    }
    const held = absorbedAt * data.heldCarry[t] + rangeSum(data.absorbedWeight, data.absorbedOffsets, t), cutting = rangeSum(data.cutWeight, data.cutOffsets, t);
    paddedWeights(held, before, cutting, ending, data, t, padded);
    absorbedAt = padded[2];
    if (to > from && !(weight > 0 && before > 0) && (!data.liveWeighted[t] || !(padded[1] > 0 && padded[0] > 0))) throw zeroWeights(t);
    s.reached[t] = to - from; s.weight[t] = weight; s.before[t] = before; s.reward[t] = reward; s.action[t] = action; s.state[t] = state;
    s.ending[t] = ending; s.endingValue[t] = endingValue; s.held[t] = held; s.cutting[t] = cutting; s.paddedBefore[t] = padded[0]; s.padded[t] = padded[1];
  }
  return s;
}

function rangeSum(values: Float64Array, offsets: Int32Array, t: number): number {
  let sum = 0;
  for (let j = offsets[t]; j < offsets[t + 1]; j++) sum += values[j];
  return sum;
}

/**
 * Reverse accumulation over the steps, last first: the padded runs' weight A_t is carried to step
 * t + 1 (held_{t+1} = A_t·heldCarry[t+1] + joining), so its adjoint comes back from there.
 * seed: the output's weight on each accumulator of perDecisionEstimates.
 */
function stepAdjoints(data: PerDecisionData, s: StepSums, discount: number, seed: { is: number; correction: number; tail: number }): StepAdjoints {
  const H = data.horizon, make = () => new Float64Array(H + 1);
  const g: StepAdjoints = { weight: make(), before: make(), reward: make(), action: make(), state: make(), ending: make(), endingValue: make(), joining: make(), cutting: make() };
  let carried = 0; // ∂J/∂A_t (on the absorbed runs' scale), from step t + 1
  for (let t = H; t >= 0; t--) {
    const p = discount ** t, weight = s.weight[t] + s.padded[t], denominator = s.before[t] + s.paddedBefore[t] + s.ending[t];
    let dWeight = 0, dDenominator = 0;
    if (s.reached[t] > 0) {
      g.reward[t] = (seed.is * p) / weight;
      g.action[t] = (-seed.correction * p) / weight;
      dWeight = (p * (seed.correction * s.action[t] - seed.is * s.reward[t])) / (weight * weight);
    }
    if (denominator > 0) {
      const valueSum = s.state[t] + s.endingValue[t], tail = t === H && s.ending[t] > 0 ? seed.tail : 0;
      g.state[t] = (seed.correction * p) / denominator;
      g.endingValue[t] = ((seed.correction + tail) * p) / denominator;
      dDenominator = -(p * (seed.correction * valueSum + tail * s.endingValue[t])) / (denominator * denominator);
    }
    g.weight[t] = dWeight;
    g.before[t] = dDenominator;
    g.ending[t] = dDenominator;
    carried = paddedAdjoint(data, s, t, dDenominator, dWeight * data.absorbedToStep[t] + carried, g);
  }
  return g;
}

/**
 * Through paddedWeights at step t: out0 = A′(L+E)/(L+K)·toBefore, A = A′·L/(L+K) (A′ and A without the
 * factors where L + K = 0). dBefore: ∂J/∂out0; dHeld: ∂J/∂A. Adds to g.before, g.ending, sets
 * g.joining and g.cutting; returns ∂J/∂A_{t−1} (A′_t = A_{t−1}·heldCarry[t] + joining).
 */
function paddedAdjoint(data: PerDecisionData, s: StepSums, t: number, dBefore: number, dHeld: number, g: StepAdjoints): number {
  const h = s.held[t], L = s.before[t], K = s.cutting[t], E = s.ending[t], known = L + K, toBefore = data.absorbedToBefore[t];
  let dHeldIn: number;
  if (known > 0) {
    const k2 = known * known;
    dHeldIn = dBefore * toBefore * ((L + E) / known) + dHeld * (L / known);
    g.before[t] += (dBefore * toBefore * h * (K - E)) / k2 + (dHeld * h * K) / k2;
    g.cutting[t] = -(dBefore * toBefore * h * (L + E)) / k2 - (dHeld * h * L) / k2;
    g.ending[t] += (dBefore * toBefore * h) / known;
  } else {
    dHeldIn = dBefore * toBefore + dHeld;
  }
  g.joining[t] = dHeldIn;
  return dHeldIn * data.heldCarry[t];
}

/** g_k = Σ over run k's entries of each step sum's adjoint times the entry's term. */
function gatherDerivatives(data: PerDecisionData, g: StepAdjoints): Float64Array {
  const out = new Float64Array(data.episodes), { stepOffsets, episode, scaled, scaledBefore, rewards, actionValues: q, stateValues: v } = data;
  for (let t = 0; t < data.horizon; t++) {
    const gw = g.weight[t], gb = g.before[t], gr = g.reward[t], ga = g.action[t], gs = g.state[t];
    for (let j = stepOffsets[t]; j < stepOffsets[t + 1]; j++) {
      const w = scaled[j], wb = scaledBefore[j];
      out[episode[j]] += w * (gw + gr * rewards[j] + (q ? ga * q[j] : 0)) + wb * (gb + (v ? gs * v[j] : 0));
    }
  }
  for (let t = 0; t <= data.horizon; t++) {
    for (let j = data.endOffsets[t]; j < data.endOffsets[t + 1]; j++) out[data.endEpisode[j]] += data.endWeight[j] * (g.ending[t] + g.endingValue[t] * data.endValue[j]);
    for (let j = data.absorbedOffsets[t]; j < data.absorbedOffsets[t + 1]; j++) out[data.absorbedEpisode[j]] += g.joining[t] * data.absorbedWeight[j];
    for (let j = data.cutOffsets[t]; j < data.cutOffsets[t + 1]; j++) out[data.cutEpisode[j]] += g.cutting[t] * data.cutWeight[j];
  }
  return out;
}

/** J + Σ_k (c_k − 1) g_k: the resample's first-order value. */
function linearised(point: number, g: Float64Array, c: ArrayLike<number>): number {
  let shift = 0;
  for (let k = 0; k < g.length; k++) shift += (c[k] - 1) * g[k];
  return point + shift;
}

/** A resample's per-decision estimates to first order (the tail held at the full data's). c: e multiplicities. */
export function linearisedPerDecision(point: PerDecisionEstimates, d: PerDecisionDerivatives, c: ArrayLike<number>): PerDecisionEstimates {
  if (c.length !== d.importanceSampling.length) throw new ImportanceSamplingError(`multiplicities: expected one per episode (${d.importanceSampling.length}), got ${c.length}`);
  return {
    importanceSampling: linearised(point.importanceSampling, d.importanceSampling, c),
    doublyRobust: point.doublyRobust === null || d.doublyRobust === null ? null : linearised(point.doublyRobust, d.doublyRobust, c),
    importanceSamplingTail: point.importanceSamplingTail,
  };
}

/**
 * The linearised bootstrap's standard error of Σ_k c_k x_k under multinomial resampling of the runs:
 * √(Σ_k (x_k − x̄)²). For a paired difference pass x = g_check − g_other (derivatives on the same runs).
 */
export function firstOrderStandardError(x: ArrayLike<number>): number {
  let mean = 0;
  for (let k = 0; k < x.length; k++) mean += x[k];
  mean /= x.length;
  let sum = 0;
  for (let k = 0; k < x.length; k++) sum += (x[k] - mean) ** 2;
  return Math.sqrt(sum);
}
