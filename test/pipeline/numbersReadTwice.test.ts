/**
 * A number the engineer reads in two places reads the same in both (the screen review: "effective
 * size of 3.4 runs" in a cross-check note beside "3.45 of 12" in the coverage panel, and "6.3 %" in
 * the report's diagnostics against "6.29 %" on screen for the same share). The same invented
 * diagnostics go through every writer: the cross-check note (crossCheckVerdict.ts), the coverage
 * finding (severity.ts, its occupancy and action-support findings too), the app's coverage sentences (assessmentWords.ts) and the report's
 * diagnostics table (reportEvidence.ts). The precisions are ours (effectiveRunsText.ts, shareText.ts);
 * the expected digits are worked by hand: 3.4517 to three significant digits is 3.45, 0.062912 is 6.29 %.
 */
import { describe, expect, it } from 'vitest';
import { crossCheckVerdict } from '../../src/core/offPolicy/crossCheckVerdict';
import { effectiveShareFinding } from '../../src/core/diagnostics/severity';
import { effectiveRunsText } from '../../src/core/offPolicy/effectiveRunsText';
import { shareText } from '../../src/core/shareText';
import { actionSupportFinding } from '../../src/core/diagnostics/severity';
import type { Assessment, CoverageDiagnostics } from '../../src/pipeline/assessment';
import { diagnosticsSection } from '../../src/pipeline/report/reportEvidence';
import type { ReportInput } from '../../src/pipeline/report/reportInput';
import { coverageSentences, unvisitedSentence } from '../../src/renderer/src/screens/findings/assessmentWords';

const RUNS = 3.4517, REACHING = 40, SHARE = 0.062912;

const diagnostics: CoverageDiagnostics = {
  occupancyShift: 2.5, occupancyShiftUpper: 3.1, presentControllerShift: 1.2, shiftFeatures: 'the linear features',
  importanceWeights: { oneStepEffectiveSize: 900, oneStepShare: SHARE, horizonSteps: 20, horizonEffectiveEpisodes: RUNS, horizonEpisodes: REACHING, horizonNotNumbers: 0 },
  actionSupport: { meanOutside: SHARE, p90Outside: SHARE, maxOutside: SHARE, behaviourMeanOutside: SHARE, neighbours: 20, queryStates: 200 },
} as CoverageDiagnostics;

function reportText(): string {
  const assessment = {
    candidates: [{ name: 'PI', diagnostics, settled: null, confirmation: { status: 'unconfirmed', text: '' }, warnings: [] }],
    presentController: null, unvisitedShare: SHARE, plantMemory: null, warnings: [],
  } as unknown as Assessment;
  return diagnosticsSection({ assessment, assessmentProblems: [] } as unknown as ReportInput).html;
}

describe('one precision for a number read in two places', () => {
  it('an effective number of runs: 3.45 in the cross-check note, the coverage finding, the app and the report', () => {
    const note = crossCheckVerdict({
      label: 'Doubly robust', difference: 0, differenceStandardError: 0.5, fqe: -100,
      weights: { effectiveEpisodes: RUNS, episodesReaching: REACHING, horizonSteps: 20, tailWeight: 0.05 },
    }).note;
    expect(note).toContain('effective size of 3.45 runs');
    expect(effectiveRunsText(RUNS)).toBe('3.45 runs');
    expect(effectiveRunsText(1.0004)).toBe('1 run'); // one weight dominating: not "1 runs" (seen on the after-screenshots)
    expect(effectiveShareFinding(RUNS, REACHING, 20)!.message).toContain('effective size 3.45 of 40 runs');
    expect(coverageSentences(diagnostics).join(' ')).toContain('are worth 3.45 of 40 runs');
    expect(reportText()).toContain('3.45 of 40');
  });

  it('a share: 6.29\u00a0% on screen and in the report, never 6.3\u00a0%', () => {
    expect(shareText(SHARE)).toBe('6.29\u00a0%');
    // The coverage finding wrote its measured shares at two digits ("27 %" beside the sentence's "26.9 %").
    expect(actionSupportFinding(0.269, 50, 0.028)!.message).toMatch(/^On average 26\.9\u00a0% .*present controller itself: 2\.8\u00a0%/);
    const screen = [...coverageSentences(diagnostics), unvisitedSentence(SHARE)!].join(' '), report = reportText();
    expect(screen).toContain('6.29\u00a0%');
    expect(report).toContain('6.29\u00a0%');
    for (const text of [screen, report]) expect(text).not.toMatch(/\b6\.3\u00a0%/);
  });
});
