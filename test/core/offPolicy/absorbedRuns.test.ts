/**
 * Weighted per-decision importance sampling and weighted doubly robust (Thomas & Brunskill, ICML
 * 2016) on runs that end in an absorbing state, padded with it (perDecisionEstimators.ts).
 *
 * The chain (invented for this test): each step the controller's move a is paid r(a) = −1 − a², and
 * the run ends after the step with probability p(a) = Φ(a − 2). Moves are drawn afresh each step,
 * so under a policy a ~ N(μ, σ²), with E_π r = −1 − μ² − σ² and q = E_π p(a),
 *   J = E_π r · Σ_t (γ(1 − q))^t = E_π r / (1 − γ(1 − q))          (the geometric series; common practice)
 *   q = E Φ(a − 2) = Φ((μ − 2)/√(1 + σ²))                          (the probit–normal identity, e.g. Rasmussen
 *                                                                    & Williams, "Gaussian Processes for Machine
 *                                                                    Learning", 2006, §3.9; quoted from memory)
 * Logged under N(0, 1), the candidate N(0.5, 0.7²): q = 0.109564 (Python's math.erfc), J = −8.76098.
 * Normalising each step over the runs still going instead would estimate E_π r/(1 − γ) = −17.4: the
 * runs that ended pay 0 and belong in the normaliser.
 * With Q and V exact, Q(a) = r(a) + γ(1 − p(a))·J and V = J, the doubly robust estimate is left with the
 * noise of whether each run ended, weighted: tighter than importance sampling alone, not exact.
 */
import { describe, expect, it } from 'vitest';
import { episodeMultiplicities } from '../../../src/core/bootstrap/episodeMultiplicities';
import { indexEpisodes } from '../../../src/core/bootstrap/episodeTransitions';
import { loggedDiscountedReturn } from '../../../src/core/loggedReturn';
import { importanceWeightTable } from '../../../src/core/offPolicy/importanceWeights';
import { perDecisionData, perDecisionEstimates } from '../../../src/core/offPolicy/perDecisionEstimators';
import { perDecisionResamples, prepareResampleEntries } from '../../../src/core/offPolicy/perDecisionResamples';
import { behaviour, bootstrapSpread, candidate, chainRuns, discount, exactValues, standardDeviation, truth } from './endingMovesChain';

const goingOnWrongly = -1.74 / (1 - discount);

describe('per-decision estimators on runs that end in an absorbing state', () => {
  const { data } = chainRuns(4000, 3, () => 400), index = indexEpisodes(data); // a 400-step limit is never reached in practice

  it('on-policy, weighted importance sampling is the mean discounted return of every run, 0 after its end', () => {
    // Every weight is 1, and padded every run is present at every step: the on-policy Monte Carlo estimate (Sutton & Barto, 2nd ed., §5.1).
    const table = importanceWeightTable(data, index, behaviour, behaviour);
    expect(perDecisionEstimates(perDecisionData(table, null), discount).importanceSampling).toBeCloseTo(loggedDiscountedReturn(data, discount).value, 10);
  });

  it('hold the closed form for a candidate that changes how soon runs end, within three bootstrap standard errors', () => {
    const table = importanceWeightTable(data, index, candidate, behaviour), exact = perDecisionData(table, exactValues(data));
    const full = perDecisionEstimates(exact, discount), { is, dr } = bootstrapSpread(exact, 11);
    const isError = standardDeviation(is), drError = standardDeviation(dr);
    expect(Math.abs(full.importanceSampling - truth)).toBeLessThan(3 * isError);
    expect(Math.abs(full.doublyRobust! - truth)).toBeLessThan(3 * drError);
    expect(isError).toBeLessThan(0.05 * Math.abs(truth)); // tight enough to tell −8.76 from −17.4
    expect(Math.abs(full.importanceSampling - goingOnWrongly)).toBeGreaterThan(20 * isError);
    expect(drError).toBeLessThan(isError); // exact values remove the rewards' noise; the ends' remains
  });

  it('give the block route the same numbers as the one-pass route on the padded runs', () => {
    const prepared = perDecisionData(importanceWeightTable(data, index, candidate, behaviour), exactValues(data));
    const block = Array.from({ length: 5 }, (_, b) => episodeMultiplicities(data.episodeCount, 5, b));
    perDecisionResamples(prepareResampleEntries(prepared), discount, block).forEach((fast, b) => {
      if (fast instanceof Error) throw fast;
      const plain = perDecisionEstimates(prepared, discount, block[b]);
      expect(fast.importanceSampling).toBeCloseTo(plain.importanceSampling, 12);
      expect(fast.doublyRobust!).toBeCloseTo(plain.doublyRobust!, 12);
    });
  });
});
