/** The cross-check rule's mechanics on hand-made evidence: each limit in CROSS_CHECK_RULE decides exactly where it says. */
import { describe, expect, it } from 'vitest';
import { confirmationOf, CROSS_CHECK_RULE, crossCheckVerdict, type CrossCheckEvidence } from '../../../src/core/offPolicy/crossCheckVerdict';
import { effectiveRunsText } from '../../../src/core/offPolicy/effectiveRunsText';
import { effectiveShareFinding } from '../../../src/core/diagnostics/severity';

const base: CrossCheckEvidence = { label: 'Model rollouts', difference: 0, differenceStandardError: 0.5, fqe: -100, shareOutsideLogs: 0 };
const weights = { effectiveEpisodes: 150, episodesReaching: 300, horizonSteps: 33, tailWeight: 0.05 };

describe('crossCheckVerdict', () => {
  it('agrees within 3 standard errors or 2\u00a0% of J, disagrees beyond both', () => {
    expect(crossCheckVerdict({ ...base, difference: 1.4 }).agreement).toBe('agrees'); // 2.8 SE
    expect(crossCheckVerdict({ ...base, difference: 1.9, differenceStandardError: 0.2 }).agreement).toBe('agrees'); // 1.9 % of J
    const v = crossCheckVerdict({ ...base, difference: 2.5 });
    expect(v.agreement).toBe('disagrees');
    expect(v.note).toMatch(/2\.5\u00a0% of J \(5\.0 standard errors/);
  });

  it('is uninformative when it agrees but could not have seen a 10\u00a0% error; a gap beyond 3 of its standard errors still counts', () => {
    const limit = (CROSS_CHECK_RULE.detectableGap * 100) / CROSS_CHECK_RULE.standardErrors;
    expect(crossCheckVerdict({ ...base, differenceStandardError: 0.99 * limit }).agreement).toBe('agrees');
    const v = crossCheckVerdict({ ...base, differenceStandardError: 1.01 * limit, difference: 5 });
    expect(v.agreement).toBe('uninformative');
    expect(v.note).toMatch(/too wide to see an error of 10\u00a0% of J/);
    expect(crossCheckVerdict({ ...base, differenceStandardError: 1.01 * limit, difference: 30 }).agreement).toBe('disagrees');
  });

  it('without a standard error (no resampled values) is uninformative and says so, with no count of standard errors nor an infinite gap', () => {
    const v = crossCheckVerdict({ ...base, difference: 0.6, differenceStandardError: Infinity });
    expect(v.agreement).toBe('uninformative');
    expect(v.note).toBe('Uninformative: it has no standard error from the resampled runs, so it cannot show an error of 10\u00a0% of J; it differs from fitted Q-evaluation by 0.6\u00a0% of J.');
    expect(v.note).not.toMatch(/Infinity|standard errors of the/);
  });

  it('is uninformative when the importance weights collapse or the tail carries most of the weight', () => {
    const ok = { ...base, shareOutsideLogs: undefined, label: 'Doubly robust' };
    expect(crossCheckVerdict({ ...ok, weights }).agreement).toBe('agrees');
    expect(crossCheckVerdict({ ...ok, weights: { ...weights, effectiveEpisodes: 29 } }).note).toMatch(/effective size of 29 runs \(below 30\)/);
    expect(crossCheckVerdict({ ...ok, weights: { ...weights, effectiveEpisodes: 9, episodesReaching: 40 } }).note).toMatch(/below 10/);
    expect(crossCheckVerdict({ ...ok, weights: { ...weights, tailWeight: 0.6 } }).note).toMatch(/60\u00a0% of the discount weight lies past/);
  });

  // Kish's n_eff = (Σw)²/Σw² is at least 1 with any positive weight and 0 when every weight is zero (a candidate
  // that would never take some action of each logged run): "0.0 runs" read as a fault of the tool.
  it('says an effective size below one run in words, from the same number', () => {
    const ok = { ...base, shareOutsideLogs: undefined, label: 'Doubly robust' };
    const note = crossCheckVerdict({ ...ok, weights: { ...weights, effectiveEpisodes: 0.0412 } }).note;
    expect(note).toMatch(/importance weights carry less than one run’s worth of weight \(0\.041 of a run\), where 30 runs are needed/);
    expect(note).not.toMatch(/0\.0 runs/);
    expect(effectiveShareFinding(0.0412, 300, 33)!.message).toMatch(/^Importance weights at step 33: less than one run’s worth of weight \(0\.041 of a run\) from 300 runs/);
    expect(effectiveRunsText(12.34)).toBe('12.3 runs');
    const none = crossCheckVerdict({ ...ok, weights: { ...weights, effectiveEpisodes: 0 } }).note;
    expect(none).toMatch(/importance weights carry no run’s worth of weight \(every logged run takes an action the candidate would never take\), where 30 runs are needed/);
  });

  it('is uninformative when the rollouts leave the logged states', () => {
    expect(crossCheckVerdict({ ...base, shareOutsideLogs: 0.05 }).agreement).toBe('agrees');
    expect(crossCheckVerdict({ ...base, shareOutsideLogs: 0.06 }).agreement).toBe('uninformative');
  });

  // An extrapolated part may be wrong by its whole size: to see a 10 % gap, at most half of it may rest there (crossCheckVerdict.ts).
  it('is uninformative when more than half the gap it must see comes from states held at the edge, and says so from the same constants', () => {
    expect(CROSS_CHECK_RULE.maxRewardShareAtEdge).toBe(CROSS_CHECK_RULE.detectableGap / 2);
    expect(crossCheckVerdict({ ...base, rewardShareAtEdge: 0.05 }).agreement).toBe('agrees');
    const v = crossCheckVerdict({ ...base, difference: 10, rewardShareAtEdge: 0.62 });
    expect(v.agreement).toBe('uninformative');
    expect(v.note).toBe('Uninformative: 62\u00a0% of the model’s value (its discounted rewards, in size) comes from simulated states held at the edge of the logged states, ' +
      'where the fitted model extrapolates and may be wrong by the whole of that part; at most 5\u00a0% may, half the 10\u00a0% error the check must see; ' +
      'it differs from fitted Q-evaluation by 10\u00a0% of J (20.0 standard errors of the paired difference).');
    // The step rule still applies first, with its own words.
    expect(crossCheckVerdict({ ...base, shareOutsideLogs: 0.06, rewardShareAtEdge: 0.62 }).note).toMatch(/6\u00a0% of the simulated \(discounted\) steps reach the edge/);
  });
});

describe('confirmationOf', () => {
  it('says contradicted, confirmed or that nothing can confirm the estimate', () => {
    const agree = crossCheckVerdict(base), disagree = crossCheckVerdict({ ...base, difference: 10 }), none = crossCheckVerdict({ ...base, shareOutsideLogs: 0.5 });
    expect(confirmationOf([agree, disagree]).status).toBe('contradicted');
    expect(confirmationOf([agree, none])).toEqual({ status: 'confirmed', text: 'Confirmed by model rollouts, which rests on assumptions other than the fitted Q.' });
    expect(confirmationOf([none, none]).text).toMatch(/^Nothing in the logs can confirm this estimate: every cross-check is uninformative/);
    expect(confirmationOf([])).toEqual({ status: 'unconfirmed', text: expect.stringMatching(/no cross-check applies here/) });
  });

  it('does not let checks on a fitted plant model alone confirm where the function classes disagree', () => {
    const model = { ...crossCheckVerdict(base), fromPlantModel: true };
    const sampling = { ...crossCheckVerdict({ ...base, label: 'Weighted per-decision importance sampling', shareOutsideLogs: undefined, weights }), fromPlantModel: false };
    const notSettled = confirmationOf([model], false);
    expect(notSettled.status).toBe('unconfirmed');
    expect(notSettled.text).toMatch(/^The function classes disagree, and the checks that agree with this value \(model rollouts\)/);
    expect(confirmationOf([model], true).status).toBe('confirmed');
    expect(confirmationOf([model], null).status).toBe('confirmed');
    expect(confirmationOf([model, sampling], false).status).toBe('confirmed'); // a check on the logged actions and rewards still confirms
    expect(confirmationOf([model, { ...crossCheckVerdict({ ...base, difference: 10 }), fromPlantModel: true }], false).status).toBe('contradicted');
  });
});
