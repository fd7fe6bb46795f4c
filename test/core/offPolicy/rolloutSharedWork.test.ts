/**
 * The one-step model's rollouts share work that the straightforward route does again each time, and
 * must give its numbers to the last bit:
 * - the dynamics' and the reward's per-episode moments from one pass (leadingEpisodeMoments), on a
 *   log with no end state, against episodeMoments run for each regression alone;
 * - fitPolynomialModels (the moments of several resamples in one read of the episodes') against
 *   fitPolynomialModel on each resample alone;
 * - rollouts whose reward monomials are read off the dynamics' (they lead them), from recorded
 *   streams shared by every model and policy (src/core/recordedRandom.ts), against rollouts that
 *   evaluate the reward's map on its own from a fresh createRandom per rollout — with truncated
 *   actions (rejected draws part from the record) and an end chance (runs of differing lengths).
 * Data: the invented saturating pendulum (test/core/saturatingPendulum.ts).
 */
import { describe, expect, it } from 'vitest';
import { episodeMultiplicities } from '../../../src/core/bootstrap/episodeMultiplicities';
import { episodeMoments } from '../../../src/core/bootstrap/episodeMoments';
import { indexEpisodes } from '../../../src/core/bootstrap/episodeTransitions';
import type { FeatureMap, FeatureMapSpec } from '../../../src/core/features/featureTypes';
import { modelRolloutValue } from '../../../src/core/offPolicy/modelRollouts';
import { fitPolynomialModel, fitPolynomialModels, polynomialModelRegressions, type PolynomialModelFit } from '../../../src/core/offPolicy/polynomialDynamicsModel';
import { createGaussianPolicy } from '../../../src/core/policy';
import { recordedStreams } from '../../../src/core/recordedRandom';
import { pendulumLog, pendulumLogging } from '../saturatingPendulum';

describe('the one-step model’s shared rollout work', () => {
  const log = pendulumLog(pendulumLogging, 40, 100, 2), index = indexEpisodes(log);
  const regressions = polynomialModelRegressions(log, index, { degree: 3, rewardDegree: 2 });
  const resamples = [0, 1, 2, 3, 4, 5].map((b) => episodeMultiplicities(index.episodes, 11, b));

  it('forms the dynamics’ and the reward’s moments in one pass to the sums of a pass for each', () => {
    // Runs of 700 rows span several chunks of the sums (CHUNK_ROWS = 256) and end inside one.
    const long = pendulumLog(pendulumLogging, 4, 700, 3), longIndex = indexEpisodes(long), shared = polynomialModelRegressions(long, longIndex, { degree: 3, rewardDegree: 2 });
    expect(long.terminal.every((t) => t === 0)).toBe(true); // the route of one pass is taken
    const ds = 2, input = new Float64Array(3), { dynamicsFeatures, rewardFeatures } = shared;
    const load = (i: number) => { input.set(long.states.subarray(2 * i, 2 * i + 2)); input[2] = long.actions[i]; };
    const dynamics = episodeMoments(longIndex, dynamicsFeatures.dim, ds, (i, x, y) => {
      load(i);
      dynamicsFeatures.evaluate(input, 0, x, 0);
      for (let c = 0; c < ds; c++) y[c] = long.nextStates[i * ds + c] - long.states[i * ds + c];
      return true;
    });
    const reward = episodeMoments(longIndex, rewardFeatures.dim, 1, (i, x, y) => {
      load(i);
      rewardFeatures.evaluate(input, 0, x, 0);
      y[0] = long.rewards[i];
      return true;
    });
    expect(shared.dynamics).toEqual(dynamics);
    expect(shared.reward).toEqual(reward);
  });

  it('refits several resamples in one read to the same fits as one at a time', () => {
    const together = fitPolynomialModels(regressions, resamples);
    expect(together).toHaveLength(resamples.length);
    together.forEach((fit, b) => expect(fit).toEqual(fitPolynomialModel(regressions, resamples[b])));
  });

  it('rolls out from recorded streams and the dynamics’ leading monomials to the numbers of the straightforward route', () => {
    // The reward's map disguised as of a higher degree, so the simulator evaluates it on its own.
    const own = regressions.rewardFeatures, separate: FeatureMap = {
      dim: own.dim, inputDim: own.inputDim, constantIndex: own.constantIndex, evaluate: (i, o, out, p) => own.evaluate(i, o, out, p),
      toSpec: () => ({ ...own.toSpec(), degree: 99 }) as FeatureMapSpec,
    };
    const plain = (fit: PolynomialModelFit): PolynomialModelFit => ({ ...fit, regressions: { ...fit.regressions, rewardFeatures: separate } });
    const chance = (features: FeatureMap) => ({ features, weights: Float64Array.from({ length: features.dim }, (_, j) => (j === 0 ? -3 : j === 1 ? 0.5 : 0)) });
    const policies = [
      createGaussianPolicy({ offset: [0], gain: [[-3, -1]], std: [1.5], bounds: { lo: [-2], hi: [2], mode: 'truncate' } }, 2),
      createGaussianPolicy({ offset: [0.1], gain: [[-8, -3]], std: [0.4] }, 2),
    ];
    const fits = [fitPolynomialModel(regressions), ...fitPolynomialModels(regressions, resamples.slice(0, 3))];
    const starts = log.startStates.subarray(0, 20), settings = { rolloutsPerStart: 3, seed: 5 }, streams = recordedStreams();
    for (const policy of policies) {
      for (const fit of fits) {
        if (!('regressions' in fit)) throw fit;
        for (const ends of [false, true]) {
          const shared = modelRolloutValue(fit, policy, 0.9, starts, settings, null, ends ? chance(own) : null, streams);
          expect(shared).toEqual(modelRolloutValue(plain(fit), policy, 0.9, starts, settings, null, ends ? chance(separate) : null));
        }
      }
    }
  });
});
