/**
 * A network's line under the command line's value table gives its J interval once: with the
 * assessment, the interval the assessment table prints for the same row (its resamples, its level),
 * not the fit's own second one; the linear estimate and the difference stay at the level the
 * agreement rule reads them, said where it differs. Numbers invented; only the text is checked.
 */
import { describe, expect, it } from 'vitest';
import { formatEvaluation } from '../../src/cli/formatEvaluation';
import type { Assessment } from '../../src/pipeline/assessment';
import type { Evaluation } from '../../src/pipeline/estimates';

const network = {
  level: 0.9, interval: [5.19, 9.83], covers: 'the fit’s own resamples', linear: { value: 7.72, interval: [5.62, 10.18] },
  difference: { value: -0.388, interval: [-0.9, 0.1] }, agreement: { verdict: 'inconclusive', message: 'Too little data to tell.' },
};
const evaluation = {
  project: 'invented loop', valueSense: 'cost', warnings: [], cautions: [], presentController: null, presentControllerReason: 'no model in this test',
  settings: { discount: 0.95, transitions: 1000, episodes: 20, startStates: 20, approximator: 'network', quadratureNodes: 10, seed: 1 },
  policies: [{ name: 'retuned PI', status: 'converged', policyValue: 7.3312, standardError: 0.41, fixedPointValue: null, iterations: 22, message: '', network, backend: 'wasm' }],
  behaviour: { value: 9.2718, standardError: 0.4123, episodes: 20, meanTruncationWeight: 0, largestTruncationWeight: 0 },
} as unknown as Evaluation;
const assessed = (level: number) => ({
  settings: { level }, candidates: [{ policyValue: { percentile: [5.12, 10.01], covers: 'the assessment’s resamples' } }], presentController: null, behaviour: { percentile: null },
}) as unknown as Assessment;
const line = (text: string) => text.split('\n').find((l) => l.startsWith('retuned PI: network J'))!;

describe('a network’s line on the command line', () => {
  it('gives the fit’s own interval without an assessment', () => {
    expect(line(formatEvaluation(evaluation, 'loop.spcritic'))).toContain('network J 90\u00a0% interval [5.19, 9.83] (the fit’s own resamples)');
  });
  it('gives the assessment’s interval with one, so the two tables agree', () => {
    const text = line(formatEvaluation(evaluation, 'loop.spcritic', assessed(0.9)));
    expect(text).toContain('network J 90\u00a0% interval [5.12, 10.01] (the assessment’s resamples)');
    expect(text).not.toContain('[5.19, 9.83]');
    expect(text).not.toContain('the level the agreement rule reads');
  });
  it('says at which level the linear estimate and the difference are read when the assessment’s differs', () => {
    const text = line(formatEvaluation(evaluation, 'loop.spcritic', assessed(0.95)));
    expect(text).toContain('network J 95\u00a0% interval [5.12, 10.01]');
    expect(text).toContain('(these two at 90\u00a0%, the level the agreement rule reads)');
  });
});
