/**
 * The Findings answer's rule (trialChoice.ts) on hand-made assessments: a candidate is named only when
 * its paired interval against the baseline lies wholly on the better side of 0 (below 0 for a cost,
 * above for a reward), no serious warning (for it, or for the whole log) and no contradicting cross-check; the best J of those is named.
 * Invented numbers; the rule is the app's own, so these check its logic, not an outside value.
 */
import { describe, expect, it } from 'vitest';
import type { Assessment, CandidateAssessment, IntervalEstimate, PairedDifference } from '../../../src/pipeline/assessment';
import { logCautionsText, trialChoice, warningsText, whollyBetter } from '../../../src/renderer/src/screens/findings/trialChoice';

const BASE = 'present controller';
const estimate = (value: number, lo: number, hi: number): IntervalEstimate =>
  ({ value, standardError: null, percentile: [lo, hi], basic: null, replicates: 100, failedReplicates: 0, covers: '' }) as IntervalEstimate;

function candidate(name: string, value: number, extra: Partial<CandidateAssessment> = {}): CandidateAssessment {
  return { name, policyValue: estimate(value, value - 1, value + 1), warnings: [], confirmation: { status: 'unconfirmed', text: '' }, ...extra } as CandidateAssessment;
}

function assessment(sense: 'cost' | 'reward', candidates: CandidateAssessment[], differences: [string, number, number, number][], order: string[], warnings: Assessment['warnings'] = []): Assessment {
  const diffs: PairedDifference[] = differences.map(([a, v, lo, hi]) => ({ a, b: BASE, difference: estimate(v, lo, hi), probabilityBetter: 0.9 }));
  return {
    valueSense: sense, candidates, warnings,
    comparison: { baseline: { name: BASE, kind: 'presentController', note: '' }, differences: diffs, ranking: { order, frequency: 0.8, neighbours: [] } },
  } as unknown as Assessment;
}

describe('which candidate to trial', () => {
  it('reads the better side from the project’s sense', () => {
    expect(whollyBetter([-2, -0.1], 'cost')).toBe(true);
    expect(whollyBetter([-2, 0.1], 'cost')).toBe(false);
    expect(whollyBetter([0.1, 2], 'reward')).toBe(true);
    expect(whollyBetter([-0.1, 2], 'reward')).toBe(false);
    expect(whollyBetter(null, 'cost')).toBe(false);
  });

  it('names the best qualifying candidate, passing over a better J with a serious warning', () => {
    const serious = { severity: 'serious' as const, topic: 'shift', message: 'far from the logs' };
    const a = assessment('cost', [candidate('A', 5, { warnings: [serious] }), candidate('B', 6), candidate('C', 7)],
      [['A', -3, -4, -2], ['B', -2, -3, -1], ['C', -1, -2, 0.5]], ['A', 'B', 'C', BASE]);
    const choice = trialChoice(a);
    expect(choice.pick?.candidate.name).toBe('B');
    expect(choice.best?.candidate.name).toBe('A');
    expect(choice.lines.map((l) => l.candidate.name)).toEqual(['A', 'B', 'C']);
    expect(choice.lines[0].reasons).toEqual(['the assessment raised a serious warning for it']);
    expect(choice.lines[2].reasons).toEqual(['the interval of its difference from the baseline reaches 0 or the worse side']);
  });

  it('names none when every candidate fails the rule, and says why for the best', () => {
    const a = assessment('reward', [candidate('A', 5, { confirmation: { status: 'contradicted', text: '' } }), candidate('B', 4)],
      [['A', 1, 0.5, 2], ['B', 0.5, -0.2, 1]], ['A', 'B', BASE]);
    const choice = trialChoice(a);
    expect(choice.pick).toBeNull();
    expect(choice.best?.reasons).toEqual(['a cross-check contradicts it']);
  });

  it('names none when the whole log has a serious finding, whatever each candidate’s own', () => {
    const memory = { severity: 'serious' as const, topic: 'plantMemory', message: 'the logged state may not carry the plant’s memory' };
    const a = assessment('cost', [candidate('A', 5), candidate('B', 6)], [['A', -3, -4, -2], ['B', -2, -3, -1]], ['A', 'B', BASE], [memory]);
    const choice = trialChoice(a);
    expect(choice.pick).toBeNull();
    expect(choice.best?.reasons).toEqual(['the assessment raised a serious warning for the whole log']);
    const caution = assessment('cost', [candidate('A', 5)], [['A', -3, -4, -2]], ['A', BASE], [{ ...memory, severity: 'caution' }]);
    expect(trialChoice(caution).pick?.candidate.name).toBe('A');
  });

  it('says the cautions on the whole log beside a named trial (the two-valve log: its dithers move together), and nothing where there are none', () => {
    const caution = { severity: 'caution' as const, topic: 'ditherDependence', message: '' };
    const a = assessment('cost', [candidate('A', 5)], [['A', -1, -2, -0.5]], ['A', BASE], [caution]);
    expect(trialChoice(a).pick?.candidate.name).toBe('A'); // a caution does not stop a trial (TRIAL_RULE) …
    expect(logCautionsText(a)).toBe('The assessment raised a caution on the whole log; read it under Coverage before the trial.'); // … but is said
    expect(logCautionsText(assessment('cost', [candidate('A', 5)], [['A', -1, -2, -0.5]], ['A', BASE], [caution, caution]))).toMatch(/^The assessment raised 2 cautions .* read them/);
    expect(logCautionsText(assessment('cost', [candidate('A', 5)], [['A', -1, -2, -0.5]], ['A', BASE]))).toBeNull();
  });

  it('never says "none" in the warnings column while a caution about the candidate sits in the whole-log list (the screen review: an unconfirmed estimate)', () => {
    const unconfirmed = { severity: 'caution' as const, topic: 'confirmation', candidate: 'A', message: 'A: Nothing in the logs can confirm this estimate' };
    const a = assessment('cost', [candidate('A', 5), candidate('B', 6)], [['A', -3, -4, -2], ['B', -2, -3, -1]], ['A', 'B', BASE], [unconfirmed]);
    const [lineA, lineB] = trialChoice(a).lines;
    expect(warningsText(lineA)).toBe('1 caution in the whole-log list (Coverage)');
    expect(warningsText(lineB)).toBe('none'); // about A by name, so not B's
    const shift = { severity: 'serious' as const, topic: 'shift', message: 'far from the logs' };
    const general = { severity: 'caution' as const, topic: 'loggedReturn', message: 'runs cut short' };
    const b = assessment('cost', [candidate('A', 5, { warnings: [shift] })], [['A', -3, -4, -2]], ['A', BASE], [unconfirmed, general]);
    expect(warningsText(trialChoice(b).lines[0])).toBe('1 serious; 2 cautions in the whole-log list (Coverage)');
    expect(warningsText(trialChoice(assessment('cost', [candidate('A', 5)], [['A', -3, -4, -2]], ['A', BASE])).lines[0])).toBe('none');
  });
});
