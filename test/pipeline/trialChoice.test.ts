/**
 * The Findings answer's rule (trialChoice.ts) on hand-made assessments: a candidate is named only when
 * its paired interval against the baseline lies wholly on the better side of 0 (below 0 for a cost,
 * above for a reward), no serious warning (for it, or for the whole log) and no contradicting cross-check; the best J of those is named.
 * Invented numbers; the rule is the app's own, so these check its logic, not an outside value.
 */
import { describe, expect, it } from 'vitest';
import type { Assessment, CandidateAssessment, CrossCheck, IntervalEstimate, PairedDifference } from '../../src/pipeline/assessment';
import { CROSS_CHECK_TOPIC, disagreementWarnings } from '../../src/pipeline/crossCheckWarnings';
import { logCautionsText, TRIAL_RULE, trialAnswer, trialChoice, trialJson, warningsText, whollyBetter } from '../../src/pipeline/trialChoice';
import { ASCII_MINUS } from '../../src/figures/parts/uncertainNumber';
import { formatAssessment } from '../../src/cli/assessmentFormat';

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
    const said = (x: Assessment) => logCautionsText(trialChoice(x).pick!);
    expect(said(a)).toBe('The assessment raised a caution on the whole log; read it under Coverage before the trial.'); // … but is said
    expect(said(assessment('cost', [candidate('A', 5)], [['A', -1, -2, -0.5]], ['A', BASE], [caution, caution]))).toMatch(/^The assessment raised 2 cautions on the whole log; read them/);
    expect(said(assessment('cost', [candidate('A', 5)], [['A', -1, -2, -0.5]], ['A', BASE]))).toBeNull();
  });

  it('counts beside a named trial the cautions about it and on the whole log, not those about other candidates', () => {
    // As on the heating-loop sample: every candidate's estimate unconfirmed (a caution about each by name in the whole-log list),
    // and the named one with a caution of its own. Before, "3 cautions on the whole log": two about others, its own left out.
    const unconfirmed = (name: string) => ({ severity: 'caution' as const, topic: 'confirmation', candidate: name, message: `${name}: Nothing in the logs can confirm this estimate` });
    const weights = { severity: 'caution' as const, topic: 'importanceWeights', message: 'effective size 1 of 40 runs' };
    const a = assessment('cost', [candidate('A', 5, { warnings: [weights] }), candidate('B', 6), candidate('C', 7)],
      [['A', -3, -4, -2], ['B', -2, -3, -1], ['C', -1, -2, 0.5]], ['A', 'B', 'C', BASE], [unconfirmed('A'), unconfirmed('B'), unconfirmed('C')]);
    const pick = trialChoice(a).pick!;
    expect(pick.candidate.name).toBe('A');
    expect(logCautionsText(pick)).toBe('The assessment raised 2 cautions about it; read them under Coverage before the trial.');
    const general = { severity: 'caution' as const, topic: 'ditherDependence', message: '' };
    const b = { ...a, warnings: [...a.warnings, general] };
    expect(logCautionsText(trialChoice(b).pick!, 'in the list below')).toBe('The assessment raised 2 cautions about it and a caution on the whole log; read them in the list below before the trial.');
    // The table under the answer counts the same things in the same words (the screens read "a caution about it and
    // 3 cautions on the whole log" above "4 cautions in the whole-log list").
    expect(warningsText(trialChoice(b).pick!)).toBe('2 cautions about it; a caution on the whole log');
    const c = assessment('cost', [candidate('B', 6)], [['B', -2, -3, -1]], ['B', BASE], [unconfirmed('A')]);
    expect(logCautionsText(trialChoice(c).pick!)).toBeNull(); // a caution about another candidate only
  });

  it('never says "none" in the warnings column while a caution about the candidate sits in the whole-log list (the screen review: an unconfirmed estimate)', () => {
    const unconfirmed = { severity: 'caution' as const, topic: 'confirmation', candidate: 'A', message: 'A: Nothing in the logs can confirm this estimate' };
    const a = assessment('cost', [candidate('A', 5), candidate('B', 6)], [['A', -3, -4, -2], ['B', -2, -3, -1]], ['A', 'B', BASE], [unconfirmed]);
    const [lineA, lineB] = trialChoice(a).lines;
    expect(warningsText(lineA)).toBe('a caution about it');
    expect(warningsText(lineB)).toBe('none'); // about A by name, so not B's
    const shift = { severity: 'serious' as const, topic: 'shift', message: 'far from the logs' };
    const general = { severity: 'caution' as const, topic: 'loggedReturn', message: 'runs cut short' };
    const b = assessment('cost', [candidate('A', 5, { warnings: [shift] })], [['A', -3, -4, -2]], ['A', BASE], [unconfirmed, general]);
    expect(warningsText(trialChoice(b).lines[0])).toBe('1 serious, a caution about it; a caution on the whole log');
    expect(warningsText(trialChoice(assessment('cost', [candidate('A', 5)], [['A', -3, -4, -2]], ['A', BASE])).lines[0])).toBe('none');
  });
});

describe('the answer in words, one writer for the app, the command line and the report', () => {
  const places = { cautions: 'above', warnings: 'under Coverage' };

  it('names the trial with J, its interval, the difference and how often it came out better, each at its interval’s precision', () => {
    const caution = { severity: 'caution' as const, topic: 'ditherDependence', message: '' };
    const a = assessment('cost', [candidate('A', 5.123), candidate('B', 6)], [['A', -1.234, -2.345, -0.456], ['B', -0.5, -1, 0.1]], ['A', 'B', BASE], [caution]);
    a.settings = { level: 0.9 } as typeof a.settings;
    const answer = trialAnswer(a, trialChoice(a), places, '€')!;
    expect(answer.headline).toBe('Trial first: A.');
    // J's interval [4.123, 6.123] is 2 wide: three significant digits of the width, two decimals (uncertainNumber.ts).
    expect(answer.detail).toBe('J 5.12 [4.12, 6.12] €; 1.23 € lower than the present controller (difference [−2.35, −0.46]; both 90\u00a0% intervals), better in 90\u00a0% of resamples. '
      + 'An offline estimate from the logs: a trial still goes through the site’s design review and commissioning, with the safety functions and interlocks left in place (cautions above).');
    expect(answer.logCautions).toBe('The assessment raised a caution on the whole log; read it under Coverage before the trial.');
    // The terminal's ASCII minus, and its own places.
    const terminal = trialAnswer(a, trialChoice(a), { cautions: 'at the end', warnings: 'in the list below', minus: ASCII_MINUS })!;
    expect(terminal.detail).toContain('(difference [-2.35, -0.46]; both 90\u00a0% intervals)');
    expect(terminal.detail).toMatch(/\(cautions at the end\)\.$/);
    expect(terminal.logCautions).toMatch(/read it in the list below before the trial\.$/);
  });

  it('says none is named and why, for the best J: a contradiction once, as the contradiction, and its warning pointed to', () => {
    // As the pipeline writes it (assessAssembly.ts): a disagreeing check is a serious warning of the candidate's, and the headline says "Contradicted".
    const check = { method: 'weightedImportanceSampling', label: 'Weighted per-decision importance sampling', agreement: 'disagrees', note: 'Disagrees: it is 12 % above.' } as CrossCheck;
    const contradicted = { confirmation: { status: 'contradicted' as const, text: 'Contradicted by weighted per-decision importance sampling' }, warnings: disagreementWarnings([check]) };
    expect(contradicted.warnings).toEqual([{ severity: 'serious', topic: CROSS_CHECK_TOPIC, message: 'Weighted per-decision importance sampling: Disagrees: it is 12 % above.' }]);
    const a = assessment('reward', [candidate('A', 5, contradicted), candidate('B', 4)], [['A', 1, 0.5, 2], ['B', 0.5, -0.2, 1]], ['A', 'B', BASE]);
    expect(trialAnswer(a, trialChoice(a), places)).toEqual({
      headline: 'No candidate is named for a trial.',
      detail: 'The best J is A’s (5.00), but a cross-check contradicts it. Read its warnings under Coverage before any trial.',
      logCautions: null,
    });
    // Another serious warning beside it is counted apart from the contradiction's own.
    const shift = { severity: 'serious' as const, topic: 'shift', message: 'far from the logs' };
    const b = assessment('reward', [candidate('A', 5, { ...contradicted, warnings: [...contradicted.warnings, shift] })], [['A', 1, 0.5, 2]], ['A', BASE]);
    expect(trialChoice(b).best?.reasons).toEqual(['a cross-check contradicts it', 'the assessment raised another serious warning for it']);
  });

  it('counts as the whole log’s only the serious warnings about no one candidate', () => {
    const aboutB = { severity: 'serious' as const, topic: 'other', candidate: 'B', message: 'B: something' };
    const a = assessment('cost', [candidate('A', 5), candidate('B', 6)], [['A', -3, -4, -2], ['B', -2, -3, -1]], ['A', 'B', BASE], [aboutB]);
    expect(trialChoice(a).pick?.candidate.name).toBe('A');
    expect(trialChoice(a).lines[1].reasons).toEqual(['the assessment raised a serious warning for it']);
  });

  it('points to the best J’s warnings only where some bear on it', () => {
    // B's interval reaches 0 and nothing was raised about it: there is no warning to read, and the terminal prints no list "below".
    const a = assessment('cost', [candidate('B', 6)], [['B', -0.5, -1, 0.1]], ['B', BASE]);
    expect(trialAnswer(a, trialChoice(a), places)?.detail).toBe('The best J is B’s (6.00), but the interval of its difference from the baseline reaches 0 or the worse side.');
    const caution = { severity: 'caution' as const, topic: 'confirmation', candidate: 'B', message: 'B: Nothing in the logs can confirm this estimate' };
    const b = assessment('cost', [candidate('B', 6)], [['B', -0.5, -1, 0.1]], ['B', BASE], [caution]);
    expect(trialAnswer(b, trialChoice(b), places)?.detail).toMatch(/reaches 0 or the worse side\. Read its warnings under Coverage before any trial\.$/);
  });

  it('gives a JSON reader the same answer as data: the candidate named, the best J and why not, the rule', () => {
    const serious = { severity: 'serious' as const, topic: 'shift', message: 'far from the logs' };
    const a = assessment('cost', [candidate('A', 5, { warnings: [serious] }), candidate('B', 6)], [['A', -3, -4, -2], ['B', -2, -3, -1]], ['A', 'B', BASE]);
    expect(trialJson(a)).toEqual({ named: 'B', best: 'A', reasons: ['the assessment raised a serious warning for it'], rule: TRIAL_RULE });
    const none = assessment('cost', [candidate('B', 6)], [['B', -0.5, -1, 0.1]], ['B', BASE]);
    expect(trialJson(none)).toEqual({ named: null, best: 'B', reasons: ['the interval of its difference from the baseline reaches 0 or the worse side'], rule: TRIAL_RULE });
  });

  it('is printed by the command line after the ranking, with the rule', () => {
    const a = assessment('cost', [candidate('A', 5)], [['A', -1, -2, -0.5]], ['A', BASE]);
    const full = { ...a, settings: { level: 0.9, resamples: 100, episodes: 10, seed: 1, threads: 'one thread' }, behaviour: estimate(6, 5, 7), presentController: null,
      candidates: a.candidates.map((c) => ({ ...c, crossChecks: [], functionClasses: null, reportedRange: null, settled: null, diagnostics: { occupancyShift: null } })) } as unknown as typeof a;
    const text = formatAssessment(full);
    const lines = text.split('\n'), at = lines.findIndex((l) => l.startsWith('Answer: '));
    expect(lines[at]).toMatch(/^Answer: Trial first: A\. J 5\.00 \[4\.00, 6\.00\]; 1\.00 lower than the present controller \(difference \[-2\.00, -0\.50\]; both 90\s% intervals\)/);
    expect(lines[at + 1]).toBe(`  (${TRIAL_RULE})`);
    expect(lines.findIndex((l) => l.startsWith('Ranking: '))).toBeLessThan(at);
  });
});
