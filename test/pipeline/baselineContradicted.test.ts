/**
 * A contradicted baseline (crossCheckWarnings.ts, baselineConfirmationWarnings): where a cross-check
 * disagrees with the present controller's own J (crossCheckVerdict.ts: beyond 3 paired standard
 * errors and 2 % of J), the whole log gets one serious warning in the verdict's own words, with no
 * candidate named in it, and the answer (trialChoice.ts) then names no candidate. Invented numbers;
 * the thresholds are the project's own rule, so these check its wiring, not an outside value.
 */
import { describe, expect, it } from 'vitest';
import { confirmationOf, crossCheckVerdict } from '../../src/core/offPolicy/crossCheckVerdict';
import type { Assessment, CandidateAssessment, IntervalEstimate } from '../../src/pipeline/assessment';
import { BASELINE_CONTRADICTED_TOPIC, BASELINE_UNCONFIRMED_TOPIC, baselineConfirmationWarnings } from '../../src/pipeline/crossCheckWarnings';
import { PRESENT_CONTROLLER_NAME } from '../../src/pipeline/plan/presentController';
import { trialChoice } from '../../src/pipeline/trialChoice';

const FQE = -40;
/** A weighted doubly robust check on plenty of effective runs, `difference` from FQE's J with standard error `se`. */
const check = (difference: number, se: number) => crossCheckVerdict({
  label: 'Weighted doubly robust', difference, differenceStandardError: se, fqe: FQE,
  weights: { effectiveEpisodes: 200, episodesReaching: 400, horizonSteps: 25, tailWeight: 0.3 },
});
const present = (confirmation: ReturnType<typeof confirmationOf>) => ({ name: PRESENT_CONTROLLER_NAME, confirmation });

describe('a contradicted baseline', () => {
  it('is one serious warning on the whole log, in the confirmation’s words, where a check disagrees with the present controller’s J', () => {
    const confirmation = confirmationOf([check(-2, 0.2)]); // 5 % of J at 10 standard errors: disagrees
    expect(confirmation.status).toBe('contradicted');
    const warnings = baselineConfirmationWarnings(present(confirmation));
    expect(warnings).toHaveLength(1);
    expect(warnings[0]).toEqual({
      severity: 'serious', topic: BASELINE_CONTRADICTED_TOPIC,
      message: `Present controller: ${confirmation.text} Every difference from the baseline is taken against this J.`,
    });
    expect(warnings[0].message).toContain('weighted doubly robust'); // names the disagreeing check
    expect('candidate' in warnings[0]).toBe(false);
  });

  it('raises nothing where the present controller’s J is confirmed, or there is no baseline model', () => {
    expect(baselineConfirmationWarnings(present(confirmationOf([check(-0.2, 0.2)])))).toEqual([]); // 0.5 % of J: agrees
    expect(baselineConfirmationWarnings(null)).toEqual([]);
  });

  it('is a caution on the whole log where nothing can confirm the present controller’s J, as for an unconfirmed candidate', () => {
    const wide = confirmationOf([check(-2, 1.5)]); // 1.3 standard errors: not seen, and too wide to agree
    expect(wide.status).toBe('unconfirmed');
    expect(baselineConfirmationWarnings(present(wide))).toEqual([{
      severity: 'caution', topic: BASELINE_UNCONFIRMED_TOPIC,
      message: `Present controller: ${wide.text} Every difference from the baseline is taken against this J.`,
    }]);
    expect(baselineConfirmationWarnings(present(confirmationOf([])))[0].severity).toBe('caution');
  });

  it('leaves no candidate named for a trial, however clearly better one is', () => {
    const estimate = (value: number, lo: number, hi: number) => ({ value, standardError: null, percentile: [lo, hi], basic: null, replicates: 100, failedReplicates: 0, covers: '' }) as IntervalEstimate;
    const candidate = { name: 'A', policyValue: estimate(-30, -31, -29), warnings: [], confirmation: { status: 'confirmed', text: '' } } as unknown as CandidateAssessment;
    const assessment = (warnings: Assessment['warnings']) => ({
      valueSense: 'reward', candidates: [candidate], warnings,
      comparison: {
        baseline: { name: PRESENT_CONTROLLER_NAME, kind: 'presentController', note: '' },
        differences: [{ a: 'A', b: PRESENT_CONTROLLER_NAME, difference: estimate(10, 8, 12), probabilityBetter: 1 }],
        ranking: { order: ['A', PRESENT_CONTROLLER_NAME], frequency: 1, neighbours: [] },
      },
    }) as unknown as Assessment;
    expect(trialChoice(assessment([])).pick?.candidate.name).toBe('A');
    const choice = trialChoice(assessment(baselineConfirmationWarnings(present(confirmationOf([check(-2, 0.2)])))));
    expect(choice.pick).toBeNull();
    expect(choice.best?.reasons).toEqual(['the assessment raised a serious warning for the whole log']);
  });
});
