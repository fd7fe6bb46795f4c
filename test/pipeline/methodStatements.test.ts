import { describe, expect, it } from 'vitest';
import { methodStatements } from '../../src/pipeline/assessMethod';
import { CLASS_AGREEMENT } from '../../src/core/diagnostics/functionClassRange';
import { CROSS_CHECK_RULE } from '../../src/core/offPolicy/crossCheckVerdict';
import type { AssessmentSettings } from '../../src/pipeline/assessSettings';

// The report's definitions are quoted from the constants the verdict applies (house rule: the words
// users read come from the same thresholds the code applies). The screen review found the function-class
// statement without the rule's second half (agreement only from a class that could have seen 10 % of J).
describe('methodStatements: the function-class rule in full', () => {
  it('states both halves of the agreement rule from the constants', () => {
    const settings = { resamples: 1000, seed: 1, level: 0.9 } as unknown as AssessmentSettings;
    const classes = methodStatements(settings, 12, true, 'each resample is solved again').find((s) => s.startsWith('Function classes:'))!;
    expect(classes).toContain(`more than ${CLASS_AGREEMENT.standardErrors} paired standard errors`);
    expect(classes).toContain(`could have seen a gap of ${Math.round(100 * CROSS_CHECK_RULE.detectableGap)}\u00a0% of J (${CLASS_AGREEMENT.standardErrors} paired standard errors within it)`);
    expect(classes).toContain('not settled');
  });
});

describe('methodStatements: the model rollouts’ two limits at the edge of the logged states', () => {
  it('states the share of steps and the share of the model’s value from the constants', () => {
    const settings = { resamples: 1000, seed: 1, level: 0.9 } as unknown as AssessmentSettings;
    const checks = methodStatements(settings, 12, true, 'each resample is solved again').find((s) => s.startsWith('Cross-checks are informative'))!;
    const pct = (x: number) => `${Math.round(100 * x)}\u00a0%`;
    expect(checks).toContain(`at most ${pct(CROSS_CHECK_RULE.maxShareOutsideLogs)} of simulated steps at the edge of the logged states`);
    expect(checks).toContain(`at most ${pct(CROSS_CHECK_RULE.maxRewardShareAtEdge)} of the model’s discounted rewards (in size) from states held there`);
    expect(checks).toContain(`half the ${pct(CROSS_CHECK_RULE.detectableGap)} the check must see`);
  });
});
