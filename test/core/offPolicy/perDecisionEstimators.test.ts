/**
 * Identities of the per-decision estimators (Thomas & Brunskill 2016): on-policy every weight is 1,
 * so weighted per-decision importance sampling is the mean discounted return of the episodes — the
 * on-policy Monte Carlo estimate (Sutton & Barto, "Reinforcement Learning", 2nd ed., §5.1), computed
 * independently by loggedReturn.ts; with Q̂ ≡ V̂ ≡ 0 the doubly robust estimate equals it; and
 * multiplicities equal copying episodes.
 */
import { describe, expect, it } from 'vitest';
import { episodeMultiplicities } from '../../../src/core/bootstrap/episodeMultiplicities';
import { indexEpisodes, resampledTransitions } from '../../../src/core/bootstrap/episodeTransitions';
import { loggedDiscountedReturn } from '../../../src/core/loggedReturn';
import { importanceWeightTable } from '../../../src/core/offPolicy/importanceWeights';
import { perDecisionData, perDecisionEstimates } from '../../../src/core/offPolicy/perDecisionEstimators';
import { createGaussianPolicy } from '../../../src/core/policy';
import { simulateLinearPlant } from '../fqe/simulatedTransitions';

const data = simulateLinearPlant({
  dynamics: [0.9, 0.1, 0, 0.8], inputGain: [0.5, 0.2], processNoiseStd: [0.1, 0.1], stateWeight: [1, 0, 0, 1], actionWeight: [0.1],
  behaviourGain: [-0.3, -0.1], behaviourStd: [0.5], startStd: 1, episodes: 30, stepsPerEpisode: 40, seed: 8,
});
const behaviour = createGaussianPolicy({ offset: [0], gain: [[-0.3, -0.1]], std: [0.5] }, 2);
const target = createGaussianPolicy({ offset: [0.1], gain: [[-0.5, -0.2]], std: [0.6] }, 2);
const index = indexEpisodes(data);

describe('per-decision estimators', () => {
  it('reduce to the mean discounted return on-policy', () => {
    const table = importanceWeightTable(data, index, behaviour, behaviour);
    const logged = loggedDiscountedReturn(data, 0.9);
    expect(perDecisionEstimates(perDecisionData(table, null), 0.9).importanceSampling).toBeCloseTo(logged.value, 12);
  });

  it('give WDR = WPDIS when Q̂ and V̂ are zero', () => {
    const table = importanceWeightTable(data, index, target, behaviour), zeros = new Float64Array(data.count);
    const e = perDecisionEstimates(perDecisionData(table, { actionValues: zeros, stateValues: zeros }), 0.9);
    expect(e.doublyRobust).toBeCloseTo(e.importanceSampling, 12);
  });

  it('give with multiplicities what they give on the episodes copied out', () => {
    const counts = episodeMultiplicities(data.episodeCount, 21, 0);
    const copied = resampledTransitions(data, index, counts);
    const values = (n: number) => ({ actionValues: Float64Array.from({ length: n }, (_, i) => Math.sin(i)), stateValues: Float64Array.from({ length: n }, (_, i) => Math.cos(i)) });
    // Q̂ and V̂ of each transition travel with it: build them on the original, then copy by the same episode order.
    const original = values(data.count);
    const copiedValues = { actionValues: new Float64Array(copied.count), stateValues: new Float64Array(copied.count) };
    let row = 0;
    for (let k = 0; k < index.episodes; k++) {
      for (let r = 0; r < counts[k]; r++) {
        for (let p = index.offsets[k]; p < index.offsets[k + 1]; p++, row++) {
          copiedValues.actionValues[row] = original.actionValues[p];
          copiedValues.stateValues[row] = original.stateValues[p];
        }
      }
    }
    const weighted = perDecisionEstimates(perDecisionData(importanceWeightTable(data, index, target, behaviour), original), 0.9, counts);
    const plain = perDecisionEstimates(perDecisionData(importanceWeightTable(copied, indexEpisodes(copied), target, behaviour), copiedValues), 0.9);
    expect(weighted.importanceSampling).toBeCloseTo(plain.importanceSampling, 11);
    expect(weighted.doublyRobust!).toBeCloseTo(plain.doublyRobust!, 11);
  });
});
