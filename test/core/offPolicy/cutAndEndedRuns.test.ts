/**
 * The padded per-decision estimators (perDecisionEstimators.ts) on a log where runs end in the end
 * state and other runs' logs are cut early by a time limit: the chain of absorbedRuns.test.ts (each
 * step the move a pays r(a) = −1 − a² and the run ends after it with probability Φ(a − 2)), logged
 * under N(0, 1), with each run's log cut after a length drawn uniformly from 1 … 25 steps,
 * independently of the chain. Closed form, as there (the geometric series and the probit–normal
 * identity; common practice, Rasmussen & Williams 2006 §3.9 from memory): for the candidate
 * N(0.5, 0.7²) at γ = 0.9, J = −8.76098. With the exact value V = J past each time limit (the tail),
 * both estimators are consistent for J; dropping the cut runs from the steps after their cut while
 * keeping the ended ones would overstate the chance of an end.
 */
import { describe, expect, it } from 'vitest';
import { indexEpisodes } from '../../../src/core/bootstrap/episodeTransitions';
import { importanceWeightTable } from '../../../src/core/offPolicy/importanceWeights';
import { perDecisionData, perDecisionEstimates } from '../../../src/core/offPolicy/perDecisionEstimators';
import { behaviour, bootstrapSpread, candidate, chainRuns, discount, exactValues, standardDeviation, truth } from './endingMovesChain';

describe('padded estimators where some runs end and others are cut early by a time limit', () => {
  it('hold the closed form within three bootstrap standard errors, with the exact value past each cut', () => {
    // Each run's log is cut after a length drawn uniformly from 1 … 25 steps, unless the run ends first.
    const { data, cut, lengths } = chainRuns(4000, 7, (rng) => 1 + Math.floor(25 * rng.uniform())), index = indexEpisodes(data);
    const tails = { finalStateValues: new Float64Array(data.episodeCount).fill(truth), tailWeights: Float64Array.from(cut, (c, k) => (c ? discount ** lengths[k] : 0)) };
    const prepared = perDecisionData(importanceWeightTable(data, index, candidate, behaviour), exactValues(data), tails);
    expect(prepared.cutEpisode.length).toBeGreaterThan(1000); // many runs are cut, at many lengths
    const full = perDecisionEstimates(prepared, discount), { is, dr } = bootstrapSpread(prepared, 13);
    expect(Math.abs(full.importanceSampling - truth)).toBeLessThan(3 * standardDeviation(is));
    expect(Math.abs(full.doublyRobust! - truth)).toBeLessThan(3 * standardDeviation(dr));
    expect(standardDeviation(is)).toBeLessThan(0.03 * Math.abs(truth));
  });
});
