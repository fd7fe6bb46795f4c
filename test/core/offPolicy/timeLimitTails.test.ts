/**
 * Cross-checks that respect time limits.
 *
 * Identities (independent code paths): on-policy every weight is 1, so weighted per-decision
 * importance sampling with tails is the logged return completed by γ^T·V̂(s_T) (loggedReturn.ts;
 * the n-step return, Sutton & Barto §7.1), and doubly robust with Q̂ ≡ V̂ ≡ 0 along the way equals it;
 * multiplicities equal copying episodes, tails included.
 *
 * On an invented linear plant with 100-step episodes, against the logged controller's exact value
 * from the logged starts (closed form, src/core/lq.ts; Bertsekas Vol. I §4.1): doubly robust with
 * the tail lies within its own 90 % bootstrap interval of it, and its paired difference from FQE is
 * within 3 paired standard errors, where without the tail it is not at γ = 0.99 (37 % of the weight
 * past the end). And the model-based rollout check (polynomial one-step model) is within 3 of its
 * bootstrap standard errors of the exact value of candidates whose importance weights collapse.
 */
import { describe, expect, it } from 'vitest';
import { episodeMultiplicities } from '../../../src/core/bootstrap/episodeMultiplicities';
import { indexEpisodes, resampledTransitions } from '../../../src/core/bootstrap/episodeTransitions';
import { createFeatureMap } from '../../../src/core/features/featureMap';
import { polynomialFeatureSpec } from '../../../src/core/features/polynomialFeatures';
import { fitStateActionStandardiser } from '../../../src/core/features/standardiser';
import { completedLoggedReturn, episodeEnds, loggedDiscountedReturn } from '../../../src/core/loggedReturn';
import { fittedBehaviourPolicy } from '../../../src/core/offPolicy/behaviourPolicy';
import { importanceWeightTable } from '../../../src/core/offPolicy/importanceWeights';
import { perDecisionData, perDecisionEstimates } from '../../../src/core/offPolicy/perDecisionEstimators';
import { polynomialModelRegressions } from '../../../src/core/offPolicy/polynomialDynamicsModel';
import { createGaussianPolicy } from '../../../src/core/policy';
import type { TransitionSet } from '../../../src/core/transitions';
import { exactPolicyValue, simulateLog, type TestController } from '../linearGaussianPlant';
import { candidateFamily, cascadeLogging, cascadePlant, startLaws } from '../testPlants';
import { paired, percentileInterval, runCrossChecks, standardDeviation } from './crossCheckHarness';

const policyOf = (c: TestController) => createGaussianPolicy({ offset: c.offset, gain: [c.gain], std: c.std }, 3);

/** A log with episodes of unequal length (every fifth one cut at 60 steps), some ending in a terminal state. */
function unevenLog(): TransitionSet {
  const full = simulateLog(cascadePlant, cascadeLogging, { episodes: 40, steps: 80, seed: 4, start: startLaws(cascadePlant, cascadeLogging)[0][1] });
  const keep = Array.from({ length: full.count }, (_, i) => i).filter((i) => full.episode[i] % 5 !== 0 || i % 80 < 60);
  const pick = <T extends Float64Array | Int32Array | Uint8Array>(a: T, w: number) => keep.flatMap((i) => Array.from(a.subarray(i * w, (i + 1) * w)));
  const terminal = Uint8Array.from(keep, (i) => (full.episode[i] % 7 === 3 && i % 80 === 79 ? 1 : 0));
  return {
    ...full, count: keep.length, states: Float64Array.from(pick(full.states, 3)), actions: Float64Array.from(pick(full.actions, 1)),
    rewards: Float64Array.from(pick(full.rewards, 1)), nextStates: Float64Array.from(pick(full.nextStates, 3)), terminal,
    episode: Int32Array.from(pick(full.episode, 1)), sourceLine: Int32Array.from(pick(full.sourceLine, 1)),
  };
}

describe('per-decision estimators with tails: identities', () => {
  const data = unevenLog(), index = indexEpisodes(data), behaviour = policyOf(cascadeLogging), discount = 0.95;
  const ends = episodeEnds(data, discount);
  const finalStateValues = Float64Array.from({ length: data.episodeCount }, (_, k) => -10 - Math.sin(k));
  const tails = { finalStateValues, tailWeights: ends.tailWeights };

  it('on-policy, give the completed logged return (equal lengths) and count no tail after a terminal state', () => {
    const even = simulateLog(cascadePlant, cascadeLogging, { episodes: 30, steps: 50, seed: 6, start: startLaws(cascadePlant, cascadeLogging)[0][1] });
    const evenEnds = episodeEnds(even, discount), values = Float64Array.from({ length: 30 }, (_, k) => -5 - k / 10);
    const table = importanceWeightTable(even, indexEpisodes(even), behaviour, behaviour);
    const estimate = perDecisionEstimates(perDecisionData(table, null, { finalStateValues: values, tailWeights: evenEnds.tailWeights }), discount);
    const completed = completedLoggedReturn(loggedDiscountedReturn(even, discount), evenEnds, values);
    expect(estimate.importanceSampling).toBeCloseTo(completed.value, 10);
    expect(ends.tailWeights.filter((w) => w === 0).length).toBeGreaterThan(0); // the uneven log has terminal ends
  });

  it('give doubly robust = importance sampling with tails when Q̂ and V̂ vanish along the way', () => {
    const target = policyOf(candidateFamily(cascadeLogging)[1][1]), zeros = new Float64Array(data.count);
    const prepared = perDecisionData(importanceWeightTable(data, index, target, behaviour), { actionValues: zeros, stateValues: zeros }, tails);
    const e = perDecisionEstimates(prepared, discount);
    // Unequal lengths: WPDIS bootstraps only past the longest episodes, WDR at every time-limited end; they coincide only when all ends are at H.
    expect(e.importanceSamplingTail).not.toBe(0);
    const evenPrepared = perDecisionData(importanceWeightTable(data, index, target, behaviour), { actionValues: zeros, stateValues: zeros }, {
      finalStateValues, tailWeights: Float64Array.from(ends.tailWeights, (w, k) => (index.offsets[k + 1] - index.offsets[k] === 80 ? w : 0)),
    });
    const even = perDecisionEstimates(evenPrepared, discount);
    expect(even.doublyRobust!).toBeCloseTo(even.importanceSampling, 10);
  });

  it('give with multiplicities what they give on the episodes copied out, tails included', () => {
    const target = policyOf(candidateFamily(cascadeLogging)[5][1]), counts = episodeMultiplicities(data.episodeCount, 8, 1);
    const copied = resampledTransitions(data, index, counts), copiedIndex = indexEpisodes(copied);
    const copyPerEpisode = (a: ArrayLike<number>) => Float64Array.from(Array.from(counts).flatMap((c, k) => Array<number>(c).fill(a[k])));
    // Q̂ and V̂ travel with their transition: functions of its reward, in each table's episode-major order.
    const values = (set: TransitionSet, order: Int32Array) => ({
      actionValues: Float64Array.from(order, (i) => Math.cos(set.rewards[i])), stateValues: Float64Array.from(order, (i) => Math.sin(set.rewards[i])),
    });
    const weighted = perDecisionEstimates(perDecisionData(importanceWeightTable(data, index, target, behaviour), values(data, index.order), tails), discount, counts);
    const copiedEnds = episodeEnds(copied, discount);
    const plain = perDecisionEstimates(perDecisionData(importanceWeightTable(copied, copiedIndex, target, behaviour), values(copied, copiedIndex.order), {
      finalStateValues: copyPerEpisode(finalStateValues), tailWeights: copiedEnds.tailWeights,
    }), discount);
    expect(weighted.importanceSampling).toBeCloseTo(plain.importanceSampling, 10);
    expect(weighted.doublyRobust!).toBeCloseTo(plain.doublyRobust!, 10);
  });
});

describe('time-limit tails on a linear plant with 100-step episodes', () => {
  const data = simulateLog(cascadePlant, cascadeLogging, { episodes: 300, steps: 100, seed: 5, start: startLaws(cascadePlant, cascadeLogging)[1][1] });
  const behaviour = fittedBehaviourPolicy(data).policy;
  const features = createFeatureMap(polynomialFeatureSpec(fitStateActionStandardiser(data).spec, 2));

  it.each([0.97, 0.99])('at γ = %s, doubly robust with the tail agrees with the logged controller’s exact value; without it, with FQE less well', (discount) => {
    const exact = exactPolicyValue(cascadePlant, cascadeLogging, discount, data.startStates);
    const run = runCrossChecks({ data, policy: policyOf(cascadeLogging), behaviour, features, discount, resamples: 200, seed: 13 });
    const [lo, hi] = percentileInterval(run.doublyRobust.replicates, 0.9);
    const withTail = paired(run.doublyRobust, run.fqe), withoutTail = paired(run.doublyRobustNoTail, run.fqe);
    const z = (d: typeof withTail) => d.point / standardDeviation(d.replicates);
    console.info(`γ ${discount}: exact ${exact.toFixed(2)}; DR with tail ${run.doublyRobust.point.toFixed(2)} [${lo.toFixed(2)}, ${hi.toFixed(2)}]; ` +
      `DR − FQE with tail ${withTail.point.toFixed(2)} (${z(withTail).toFixed(1)} paired SE), without ${withoutTail.point.toFixed(2)} (${z(withoutTail).toFixed(1)} paired SE); ` +
      `IS with tail ${run.importanceSampling.point.toFixed(2)}, without ${run.importanceSamplingNoTail.point.toFixed(2)}`);
    expect(exact).toBeGreaterThanOrEqual(lo);
    expect(exact).toBeLessThanOrEqual(hi);
    expect(Math.abs(z(withTail))).toBeLessThan(3);
    if (discount === 0.99) expect(Math.abs(z(withoutTail))).toBeGreaterThan(3);
  });

  it('where the importance weights collapse, the model-based rollouts still find the exact value within 3 bootstrap standard errors', () => {
    const regressions = polynomialModelRegressions(data, indexEpisodes(data), { degree: 2, rewardDegree: 2 });
    for (const [name, c] of [candidateFamily(cascadeLogging)[4], candidateFamily(cascadeLogging)[6]]) {
      const discount = 0.97, exact = exactPolicyValue(cascadePlant, c, discount, data.startStates);
      const run = runCrossChecks({ data, policy: policyOf(c), behaviour, features, discount, resamples: 20, seed: 17, model: { regressions, resamples: 20, rolloutsPerStart: 2 } });
      const model = run.model!, se = Math.hypot(standardDeviation(model.replicates), model.monteCarloError);
      console.info(`${name}: exact ${exact.toFixed(2)}, FQE ${run.fqe.point.toFixed(2)}, model rollouts ${model.point.toFixed(2)} ± ${se.toFixed(2)} ` +
        `(outside the logs ${(100 * model.shareOutsideLogs).toFixed(1)} %), importance weights' effective size ${run.effectiveEpisodes.toFixed(1)} of ${run.episodesAtHorizon}`);
      expect(run.effectiveEpisodes).toBeLessThan(10);
      expect(Math.abs(model.point - exact)).toBeLessThan(3 * se);
      expect(model.shareOutsideLogs).toBeLessThan(0.01);
    }
  });
});
