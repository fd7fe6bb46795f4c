/**
 * One precision per screen on the command line: the value table `evaluate` prints first writes each J
 * at the decimal place of the interval the assessment table beside it prints for the same row (the
 * app's Findings do the same), not at its own standard error's; without an assessment, the error's two
 * significant digits (JCGM 100, the GUM, §7.2.2 and §7.2.6 — common practice). Numbers by hand.
 */
import { describe, expect, it } from 'vitest';
import { formatEvaluation } from '../../src/cli/formatEvaluation';
import type { Assessment } from '../../src/pipeline/assessment';
import type { Evaluation } from '../../src/pipeline/estimates';

const policy = { name: 'retuned PI', status: 'converged', policyValue: 8.35823, standardError: 0.0912, fixedPointValue: 8.35901, iterations: 40, message: '', network: null, backend: 'cpu' };
const evaluation = {
  project: 'invented tank', valueSense: 'cost', warnings: [], cautions: [], presentController: null, presentControllerReason: 'no model in this test',
  settings: { discount: 0.97, transitions: 1000, episodes: 20, startStates: 20, approximator: 'linear', quadratureNodes: 7, seed: 1 },
  policies: [policy],
  behaviour: { value: 9.2718, standardError: 0.4123, episodes: 20, meanTruncationWeight: 0, largestTruncationWeight: 0 },
} as unknown as Evaluation;
// Width 3.76: three significant digits put the interval and the value read with it at two decimals.
const assessment = { candidates: [{ policyValue: { percentile: [6.5808, 10.3412] } }], presentController: null, behaviour: { percentile: [8.0512, 10.6031] } } as unknown as Assessment;

const rowOf = (text: string, name: string) => text.split('\n').find((l) => l.startsWith(name))!.split(/\s{3,}/);

describe('the first table on the command line', () => {
  it('writes J and its s.e. at the decimal place of the interval the assessment prints for the row', () => {
    const row = rowOf(formatEvaluation(evaluation, 'tank.spcritic', assessment), 'retuned PI');
    expect(row.slice(1, 4)).toEqual(['8.36', '0.09', '8.36']); // beside "[6.58, 10.34]", not "8.358 ± 0.091"
    expect(rowOf(formatEvaluation(evaluation, 'tank.spcritic', assessment), 'logged return').slice(1, 3)).toEqual(['9.27', '0.41']); // width 2.55
  });

  it('keeps the error’s two significant digits without an assessment', () => {
    expect(rowOf(formatEvaluation(evaluation, 'tank.spcritic'), 'retuned PI').slice(1, 4)).toEqual(['8.358', '0.091', '8.359']);
  });
});
