/** The assessment in words: interval text, verdict notes without a repeated verdict, progress lines, coverage sentences. */
import { describe, expect, it } from 'vitest';
import type { CoverageDiagnostics } from '../../../src/pipeline/assessment';
import {
  assessmentFraction, coverageLine, coverageSentences, levelText, noteWithoutVerdict, progressLine, shareText, typesetMinus, unvisitedSentence,
} from '../../../src/renderer/src/screens/findings/assessmentWords';
import { intervalAtPrecision, valueAtPrecision } from '../../../src/figures/parts/uncertainNumber';

describe('assessment words', () => {
  it('writes intervals, levels and shares', () => {
    expect(intervalAtPrecision([6.58123, 10.3349])).toBe('[6.58, 10.33]'); // one decimal place for both ends
    expect(intervalAtPrecision([-53.5712, -50.7204])).toBe('[−53.57, −50.72]');
    expect(intervalAtPrecision([1200.4, 1350.6])).toBe('[1200, 1351]');
    expect(intervalAtPrecision([2, 2])).toBe('[2, 2]');
    expect(intervalAtPrecision(null)).toBe('—');
    expect(levelText(0.9)).toBe('90\u00a0%');
    expect(shareText(0.475)).toBe('47.5\u00a0%');
    expect(shareText(null)).toBe('—');
    // No exponent for a share too small to matter (heating-loop sample: "5.74e−6 %" of action probability).
    expect(shareText(5.74e-8)).toBe('below 0.01\u00a0%');
    expect(shareText(1.93e-5)).toBe('below 0.01\u00a0%');
    expect(shareText(0.000193)).toBe('0.0193\u00a0%');
    expect(shareText(0)).toBe('0\u00a0%');
  });

  it('writes a value at its interval’s precision (one precision for numbers read together, JCGM 100 §7.2.2, common practice)', () => {
    expect(valueAtPrecision(7.71841, [5.62131, 10.1834])).toBe('7.72'); // beside "[5.62, 10.18]"
    expect(valueAtPrecision(-0.84712, [-1.04533, -0.63021])).toBe('−0.847'); // beside "[−1.045, −0.630]"
    expect(valueAtPrecision(8.565, null)).toBe('8.565');
  });

  it('drops the verdict word the verdict column already shows', () => {
    // After the verdict's full stop the note opens a sentence (the screen review saw "… contradict. at step 20").
    expect(noteWithoutVerdict('Uninformative: at step 20 the weights …')).toBe('At step 20 the weights …');
    expect(noteWithoutVerdict('Agrees: it differs by 0.5\u00a0% of J')).toBe('It differs by 0.5\u00a0% of J');
    expect(noteWithoutVerdict('the fitted dynamics do not fit')).toBe('The fitted dynamics do not fit');
    // The model check's words said 'Not applicable here. not applicable to this candidate: …' (screen review).
    expect(noteWithoutVerdict('not applicable to this candidate: it has actuator limits')).toBe('It has actuator limits');
    expect(noteWithoutVerdict('Not applicable: not applicable to this candidate: it has actuator limits')).toBe('It has actuator limits');
  });

  it('says where the assessment is and how far', () => {
    expect(progressLine(null)).toBe('Starting the assessment…');
    expect(progressLine({ stage: 'resampling', done: 1200, total: 2000, elapsedMs: 0 })).toBe('Resampling runs (1,200 of 2,000)…');
    expect(assessmentFraction({ stage: 'resampling', done: 1000, total: 2000, elapsedMs: 0 })).toBeCloseTo(0.45);
    expect(assessmentFraction({ stage: 'preparing', done: 0, total: 2, elapsedMs: 0 })).toBe(0);
  });

  it('puts each diagnostic beside the present controller’s own level', () => {
    const d: CoverageDiagnostics = {
      occupancyShift: 55.3, occupancyShiftUpper: 61.2, presentControllerShift: 1.1, shiftFeatures: 'the fit’s own features (15)',
      importanceWeights: { oneStepEffectiveSize: 9490.4, oneStepShare: 0.475, horizonSteps: 20, horizonEffectiveEpisodes: 1.09, horizonEpisodes: 40, horizonNotNumbers: 0 },
      actionSupport: { neighbours: 50, queryStates: 400, meanOutside: 0.001, p90Outside: 0.0002, maxOutside: 0.2, behaviourMeanOutside: 0.039 },
    };
    const [shift, weights, support] = coverageSentences(d);
    expect(shift).toContain('Occupancy shift: 55.3, 61.2 at the 90th percentile over resamples (the present controller itself: 1.10), measured in the fit’s own features (15).');
    expect(shift).toContain('caution above 4 times the present controller’s own level (at least 1), serious above 10 times'); // the limits the code applies (src/core/diagnostics/severity.ts)
    expect(weights).toContain('worth 9,490 transitions (47.5\u00a0% of them)');
    // Four shares in one sentence at one count of decimals, the most any takes alone (0.02 %: two; core/shareText.ts sharesText).
    expect(support).toContain('on average 0.10\u00a0% of the candidate’s action probability');
    expect(support).toContain('0.02\u00a0% at the 90th percentile of 400 states and 20.00\u00a0% at worst (the present controller itself: 3.90\u00a0%)');
    expect(coverageSentences({ ...d, occupancyShift: null, importanceWeights: null })).toHaveLength(1);
    // Below one run (Kish's size is 0 only when every weight is 0): said in words, not "worth no run’s worth".
    const none = coverageSentences({ ...d, importanceWeights: { ...d.importanceWeights!, horizonEffectiveEpisodes: 0 } })[1];
    expect(none).toContain('after 20 steps the cumulative weights carry no run’s worth of weight');
    expect(none).not.toMatch(/worth no run/);
    expect(unvisitedSentence(0.497)).toContain('49.7\u00a0%');
    expect(unvisitedSentence(null)).toBeNull();
    // The same figures on the one line the sentences fold behind, the present controller's two in the same order.
    expect(coverageLine(d)).toBe('Occupancy shift 55.3, action probability outside the logs 0.1\u00a0% (present controller 1.10, 3.9\u00a0%) · weights worth 47.5\u00a0% of transitions');
    expect(coverageLine({ ...d, occupancyShift: null, importanceWeights: null })).toBe('Action probability outside the logs 0.1\u00a0% (present controller 3.9\u00a0%)');
    expect(coverageLine({ ...d, presentControllerShift: null })).toContain('(present controller —, 3.9\u00a0%)');
  });
});

describe('typesetMinus', () => {
  it('gives a number opening with the terminal’s minus the true minus (U+2212, ISO 80000-2), and leaves hyphens in words', () => {
    expect(typesetMinus('cut below at 0 (it was [-3.4, 12.3]): J = -0.5, x=-2')).toBe('cut below at 0 (it was [\u22123.4, 12.3]): J = \u22120.5, x=\u22122');
    expect(typesetMinus('linear-quadratic, 2-step, a -.5 shift')).toBe('linear-quadratic, 2-step, a \u2212.5 shift');
  });
});
