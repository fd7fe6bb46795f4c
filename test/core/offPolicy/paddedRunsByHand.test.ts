/**
 * The padded per-decision estimators (perDecisionEstimators.ts: runs that end in an absorbing state
 * stay in every later step's normaliser with their last weight; Thomas & Brunskill, ICML 2016, §3 and
 * eq. 10) on logs small enough to write the estimator out by hand, and the block route
 * (perDecisionResamples.ts) against the one-pass route on random logs that mix time limits, absorbed
 * runs, runs of length 0 and unequal lengths.
 *
 * Also the weights behind the effective size at a step (paddedHorizonWeights.ts), and the refusal of a
 * fitted value that is not a finite number.
 *
 * The importance ratio of a logged move a between N(0.5, 0.7²) and N(0, 1) is written out here from
 * the normal density (common practice): ρ(a) = exp(−(a − 0.5)²/(2·0.49) + a²/2)/0.7.
 */
import { describe, expect, it } from 'vitest';
import { episodeMultiplicities } from '../../../src/core/bootstrap/episodeMultiplicities';
import { indexEpisodes } from '../../../src/core/bootstrap/episodeTransitions';
import { effectiveSampleSizeFromLogs } from '../../../src/core/diagnostics/effectiveSampleSize';
import { importanceWeightTable } from '../../../src/core/offPolicy/importanceWeights';
import { paddedLogWeightsAtStep } from '../../../src/core/offPolicy/paddedHorizonWeights';
import { ImportanceSamplingError, perDecisionData, perDecisionEstimates, type PerDecisionEstimates } from '../../../src/core/offPolicy/perDecisionEstimators';
import { perDecisionResamples, prepareResampleEntries, RESAMPLE_BLOCK } from '../../../src/core/offPolicy/perDecisionResamples';
import { createGaussianPolicy } from '../../../src/core/policy';
import { createRandom } from '../../../src/core/random';
import type { TransitionSet } from '../../../src/core/transitions';

const behaviour = createGaussianPolicy({ offset: [0], gain: [[0]], std: [1] }, 1);
const candidate = createGaussianPolicy({ offset: [0.5], gain: [[0]], std: [0.7] }, 1);
const ratio = (a: number) => Math.exp(-((a - 0.5) ** 2) / (2 * 0.49) + (a * a) / 2) / 0.7;

interface Run { actions: number[]; rewards: number[]; absorbed: boolean }

/** A log of one-state runs (the state is 0 throughout); `empty` runs of length 0 are appended as episode numbers without rows. */
function logOf(runs: Run[], empty = 0): TransitionSet {
  const actions: number[] = [], rewards: number[] = [], terminal: number[] = [], episode: number[] = [];
  runs.forEach((run, k) => run.actions.forEach((a, t) => {
    actions.push(a);
    rewards.push(run.rewards[t]);
    terminal.push(run.absorbed && t === run.actions.length - 1 ? 1 : 0);
    episode.push(k);
  }));
  const n = actions.length, zeros = new Float64Array(n), e = runs.length + empty;
  return {
    count: n, stateDim: 1, actionDim: 1, stateNames: ['level'], actionNames: ['move'], states: zeros, nextStates: zeros,
    actions: Float64Array.from(actions), rewards: Float64Array.from(rewards), terminal: Uint8Array.from(terminal),
    episode: Int32Array.from(episode), episodeCount: e, startStates: new Float64Array(e), sourceLine: Int32Array.from({ length: n }, (_, i) => i + 2),
  };
}

const close = (x: number, y: number) => expect(Math.abs(x - y)).toBeLessThanOrEqual(1e-12 * Math.max(1, Math.abs(y)));

describe('padded per-decision estimators against a hand computation (3 runs, 2 steps)', () => {
  // Run A: 2 steps, then a time limit (V̂ past it −5); run B: 1 step into the end state; run C: 2 steps, the second into the end state.
  const runs: Run[] = [
    { actions: [0.3, -0.4], rewards: [-1.2, -0.7], absorbed: false },
    { actions: [1.1], rewards: [-2.0], absorbed: true },
    { actions: [-0.6, 0.9], rewards: [-0.5, -1.5], absorbed: true },
  ];
  const q = [[-4, -3.5], [-2.5], [-4.2, -1.9]], v = [[-4.4, -3.9], [-3.0], [-4.1, -2.2]], past = -5, discount = 0.9;
  const data = logOf(runs), index = indexEpisodes(data), table = importanceWeightTable(data, index, candidate, behaviour);
  const values = { actionValues: Float64Array.from(q.flat()), stateValues: Float64Array.from(v.flat()) };
  const tails = { finalStateValues: [past, 0, 0], tailWeights: [discount ** 2, 0, 0] };

  /** The padded estimators written out term by term: B keeps W_B0 at step 1 and C keeps W_C1 at step 2; both pay 0 and have V̂ = 0 there. */
  function byHand(c: number[]) {
    const [cA, cB, cC] = c, g = discount;
    const wA0 = ratio(0.3), wA1 = wA0 * ratio(-0.4), wB0 = ratio(1.1), wC0 = ratio(-0.6), wC1 = wC0 * ratio(0.9);
    const d0 = cA * wA0 + cB * wB0 + cC * wC0, d1 = cA * wA1 + cB * wB0 + cC * wC1, n = cA + cB + cC;
    const is0 = (cA * wA0 * -1.2 + cB * wB0 * -2.0 + cC * wC0 * -0.5) / d0, is1 = (cA * wA1 * -0.7 + cC * wC1 * -1.5) / d1;
    const tail = (g * g * cA * wA1 * past) / d1; // at H = 2 the normaliser is step 1's: A's W_A1, C's W_C1 (absorbed at 2), B's W_B0
    const state0 = (cA * -4.4 + cB * -3.0 + cC * -4.1) / n, action0 = (cA * wA0 * -4 + cB * wB0 * -2.5 + cC * wC0 * -4.2) / d0;
    const state1 = (cA * wA0 * -3.9 + cC * wC0 * -2.2) / d0, action1 = (cA * wA1 * -3.5 + cC * wC1 * -1.9) / d1;
    const state2 = (cA * wA1 * past) / d1;
    const is = is0 + g * is1;
    return { importanceSampling: is + tail, doublyRobust: is + state0 - action0 + g * (state1 - action1) + g * g * state2, tail };
  }

  it.each([[[1, 1, 1]], [[2, 1, 3]], [[0, 2, 1]], [[3, 0, 0]]])('one-pass and block routes equal the hand computation to 1e-12 (multiplicities %j)', (c) => {
    const prepared = perDecisionData(table, values, tails), hand = byHand(c);
    const plain = perDecisionEstimates(prepared, discount, c);
    close(plain.importanceSampling, hand.importanceSampling);
    close(plain.doublyRobust!, hand.doublyRobust);
    close(plain.importanceSamplingTail, hand.tail);
    const fast = perDecisionResamples(prepareResampleEntries(prepared), discount, [Uint32Array.from(c)])[0];
    if (fast instanceof Error) throw fast;
    close(fast.importanceSampling, hand.importanceSampling);
    close(fast.doublyRobust!, hand.doublyRobust);
  });
});

/**
 * Runs cut by a time limit before the longest length, beside runs that end in the end state. The
 * chain (invented for this test): a run that is still going pays 1 per step and, after each step,
 * ends in the end state with probability 1/2; the log of each run is cut after 1 or 2 steps with
 * probability 1/2 each, independently of the chain (an ordinary time limit). The log below holds
 * these outcomes in their exact proportions (8 runs), so a consistent estimator returns its limit on
 * it exactly. The candidate is the logged controller (every weight is 1). By hand:
 *   E[r_0] = 1, E[r_1 · still going at 1] = 1/2, E[V(s_2) · still going at 2] = V/4, V = 1/(1 − γ/2),
 * so over the 2 logged steps WPDIS → 1 + γ/2, and with V past the limit WPDIS → 1 + γ/2 + γ²V/4 = V
 * (the geometric series; common practice).
 * Among the runs known to be still going at step 1 — the 2 that act there and the 2 cut there — half
 * ended; a normaliser that keeps the 4 ended runs but drops the 2 cut ones gives 2/6 instead.
 */
describe('padded estimators on a log that mixes early time limits with end states', () => {
  const discount = 0.9, value = 1 / (1 - discount / 2);
  const one = (absorbed: boolean): Run => ({ actions: [0], rewards: [1], absorbed });
  const two = (absorbed: boolean): Run => ({ actions: [0, 0], rewards: [1, 1], absorbed });
  const runs = [one(true), one(true), one(false), one(false), one(true), one(true), two(true), two(false)];
  const data = logOf(runs), index = indexEpisodes(data), table = importanceWeightTable(data, index, behaviour, behaviour);

  it('weighted importance sampling over the logged steps is 1 + γ/2', () => {
    close(perDecisionEstimates(perDecisionData(table, null), discount).importanceSampling, 1 + discount / 2);
  });

  it('with V past the time limits, weighted importance sampling is V and doubly robust with exact Q̂ = V̂ = V is V', () => {
    const n = data.count, values = { actionValues: new Float64Array(n).fill(value), stateValues: new Float64Array(n).fill(value) };
    const tails = { finalStateValues: runs.map(() => value), tailWeights: runs.map((r) => (r.absorbed ? 0 : discount ** r.actions.length)) };
    const estimates = perDecisionEstimates(perDecisionData(table, values, tails), discount);
    close(estimates.importanceSampling, value);
    close(estimates.doublyRobust!, value);
  });
});

/** A random log: lengths 0–9, about a third of the runs ending in the end state, moves from N(0, 1.3²). */
function randomLog(seed: number): { data: TransitionSet; runs: Run[] } {
  const rng = createRandom(seed), runs: Run[] = [];
  for (let k = 0; k < 40; k++) {
    const length = Math.floor(rng.uniform() * 10), actions = Array.from({ length }, () => 1.3 * rng.normal());
    runs.push({ actions, rewards: actions.map((a) => -1 - a * a), absorbed: length > 0 && rng.uniform() < 0.35 });
  }
  return { data: logOf(runs, 3), runs };
}

function expectSame(fast: PerDecisionEstimates | ImportanceSamplingError, plain: PerDecisionEstimates): void {
  if (fast instanceof ImportanceSamplingError) throw fast;
  close(fast.importanceSampling, plain.importanceSampling);
  close(fast.importanceSamplingTail, plain.importanceSamplingTail);
  if (plain.doublyRobust === null) expect(fast.doublyRobust).toBeNull();
  else close(fast.doublyRobust!, plain.doublyRobust);
}

describe('block route and one-pass route on logs mixing time limits, end states and runs of length 0', () => {
  it.each([1, 2, 3])('agree resample by resample for every block size, with and without Q̂, V̂ and tails (seed %i)', (seed) => {
    const { data, runs } = randomLog(seed), index = indexEpisodes(data), table = importanceWeightTable(data, index, candidate, behaviour);
    const rng = createRandom(100 + seed), n = data.count, discount = 0.93;
    const values = { actionValues: Float64Array.from({ length: n }, () => -3 + rng.normal()), stateValues: Float64Array.from({ length: n }, () => -3 + rng.normal()) };
    const e = data.episodeCount, tails = {
      finalStateValues: Array.from({ length: e }, () => -4 + rng.normal()),
      tailWeights: Array.from({ length: e }, (_, k) => (k < runs.length && !runs[k].absorbed && runs[k].actions.length > 0 ? discount ** runs[k].actions.length : 0)),
    };
    for (const prepared of [perDecisionData(table, values, tails), perDecisionData(table, null), perDecisionData(table, values), perDecisionData(table, null, tails)]) {
      expect(prepared.absorbedEpisode.length).toBeGreaterThan(0);
      const entries = prepareResampleEntries(prepared);
      for (let size = 1; size <= RESAMPLE_BLOCK; size++) {
        const block = Array.from({ length: size }, (_, b) => episodeMultiplicities(e, 23 + seed, 10 * size + b));
        perDecisionResamples(entries, discount, block).forEach((fast, b) => expectSame(fast, perDecisionEstimates(prepared, discount, block[b])));
      }
    }
  });
});

describe('padded estimators at the edges of the number range', () => {
  it('refuse a candidate that gives every run still going zero weight at a step, even where an ended run keeps its weight', () => {
    // The logged controller is clipped at ±1, so a move logged at 1 has a point mass the unclipped candidate gives probability 0
    // (importanceRatio.ts): at step 1 both runs still going (A and C) logged 1, while B ended after step 0 with a positive weight.
    const clipped = createGaussianPolicy({ offset: [0], gain: [[0]], std: [1], bounds: { lo: [-1], hi: [1], mode: 'clip' } }, 1);
    const data = logOf([
      { actions: [0.3, 1], rewards: [-1.2, -0.7], absorbed: false },
      { actions: [0.8], rewards: [-2.0], absorbed: true },
      { actions: [-0.6, 1], rewards: [-0.5, -1.5], absorbed: true },
    ]);
    const prepared = perDecisionData(importanceWeightTable(data, indexEpisodes(data), candidate, clipped), null);
    expect(() => perDecisionEstimates(prepared, 0.9)).toThrow(/zero at step 2/);
    expect(perDecisionResamples(prepareResampleEntries(prepared), 0.9, [new Uint32Array([1, 1, 1])])[0]).toBeInstanceOf(ImportanceSamplingError);
  });

  it('keep an ended run whose weight was e^−800 of the largest when it ended, once the runs going fall to its level', () => {
    // Candidate N(20, 1) against N(0, 1): log ρ(a) = 20a − 200, so run A's log W is 800, 0, −800 and run B's (ended after one step) is 0.
    // By hand: step 0 gives −1 (A's weight is e^800 times B's), step 1 (−2·1)/(1 + 1) = −1, step 2 (−3·e^−800)/(e^−800 + 1) = −3e^−800.
    const wide = createGaussianPolicy({ offset: [20], gain: [[0]], std: [1] }, 1), discount = 0.9;
    const data = logOf([{ actions: [50, -30, -30], rewards: [-1, -2, -3], absorbed: false }, { actions: [10], rewards: [-4], absorbed: true }]);
    const prepared = perDecisionData(importanceWeightTable(data, indexEpisodes(data), wide, behaviour), null);
    const estimate = perDecisionEstimates(prepared, discount).importanceSampling;
    close(estimate, -1 - discount);
    const fast = perDecisionResamples(prepareResampleEntries(prepared), discount, [new Uint32Array([1, 1])])[0];
    if (fast instanceof Error) throw fast;
    close(fast.importanceSampling, -1 - discount);
  });
});

/**
 * The weights behind the effective size at a step (paddedHorizonWeights.ts) against a hand computation
 * of the padded estimators' normaliser there. Run A acts at steps 0–3; B ends in the end state after
 * step 0; C is cut by a time limit after step 1; D ends in the end state after step 1. At h = 2:
 *   κ_1 = 1 (nothing is cut at 1), κ_2 = W_A1/(W_A1 + W_C1) (A goes on, C is cut: Kaplan & Meier's
 *   share of the runs known to be going that are not cut), so A weighs W_A2, B W_B0·κ_1·κ_2, D W_D1·κ_2.
 * The estimators give step 2's rewards exactly these weights: with reward 1 at A's step 2 and 0
 * elsewhere, WPDIS is γ² W_A2 / (their sum).
 */
describe('the effective size at a step uses the weights the padded estimators give there', () => {
  const discount = 0.9, moves = { A: [0.3, -0.4, 1.2, 0.1], B: [1.1], C: [-0.6, 0.9], D: [0.7, -1.3] };
  const runsOf = (atStepTwo: number): Run[] => [
    { actions: moves.A, rewards: [0, 0, atStepTwo, 0], absorbed: false },
    { actions: moves.B, rewards: [0], absorbed: true },
    { actions: moves.C, rewards: [0, 0], absorbed: false },
    { actions: moves.D, rewards: [0, 0], absorbed: true },
  ];
  const product = (a: number[], upTo: number) => a.slice(0, upTo + 1).reduce((w, x) => w * ratio(x), 1);
  const wA2 = product(moves.A, 2), wA1 = product(moves.A, 1), wB0 = product(moves.B, 0), wC1 = product(moves.C, 1), wD1 = product(moves.D, 1);
  const kappa2 = wA1 / (wA1 + wC1), hand = [wA2, wB0 * kappa2, wD1 * kappa2];

  it('A, B and D carry W_A2, W_B0·κ_2 and W_D1·κ_2 (1e-12), and Kish’s effective size follows', () => {
    const data = logOf(runsOf(1)), table = importanceWeightTable(data, indexEpisodes(data), candidate, behaviour);
    const weights = paddedLogWeightsAtStep(table, 2).map(Math.exp);
    expect(weights).toHaveLength(3);
    weights.forEach((w, i) => close(w, hand[i]));
    const sum = hand.reduce((s, w) => s + w, 0), squares = hand.reduce((s, w) => s + w * w, 0);
    close(effectiveSampleSizeFromLogs(paddedLogWeightsAtStep(table, 2)), (sum * sum) / squares);
    close(perDecisionEstimates(perDecisionData(table, null), discount).importanceSampling, (discount ** 2 * wA2) / sum);
  });

  it('without a run cut early, an ended run carries its last weight unchanged (κ = 1 exactly)', () => {
    const runs = runsOf(1).filter((_, k) => k !== 2), data = logOf(runs), table = importanceWeightTable(data, indexEpisodes(data), candidate, behaviour);
    expect(paddedLogWeightsAtStep(table, 2)).toEqual([table.logWeight[2], table.logWeight[4], table.logWeight[6]]);
  });
});

describe('a fitted value that is not a finite number', () => {
  it('is refused with the run and step named, not carried into a NaN doubly robust value', () => {
    const data = logOf([{ actions: [0.3, -0.4], rewards: [-1, -1], absorbed: false }, { actions: [1.1], rewards: [-2], absorbed: true }]);
    const table = importanceWeightTable(data, indexEpisodes(data), candidate, behaviour);
    const values = (q: number) => ({ actionValues: Float64Array.from([-3, q, -2]), stateValues: Float64Array.from([-3, -2.5, -2]) });
    expect(() => perDecisionData(table, values(Number.NaN))).toThrow(/Q̂ at run 1, step 2 is not a finite number/);
    expect(() => perDecisionData(table, values(-Infinity))).toThrow(ImportanceSamplingError);
    expect(Number.isFinite(perDecisionEstimates(perDecisionData(table, values(-2.5)), 0.9).doublyRobust)).toBe(true);
  });
});
