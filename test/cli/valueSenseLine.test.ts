/**
 * What J is, said once: the command line's line under its title, the report's summary and the app's
 * Findings all read `valueSenseSentence` (pipeline/valueUnitWords.ts), so a user reads one sentence
 * whichever host printed it. The evaluation is a hand-built stub of an invented tank; the unit is as the
 * project holds it, trimmed where it is read (project/unitText.ts, test/project/unitText.test.ts).
 */
import { describe, expect, it } from 'vitest';
import { formatEvaluation } from '../../src/cli/formatEvaluation';
import type { Evaluation } from '../../src/pipeline/estimates';
import { summarySection } from '../../src/pipeline/report/reportOverview';
import type { ReportInput } from '../../src/pipeline/report/reportInput';
import { valueSenseSentence } from '../../src/pipeline/valueUnitWords';

const evaluation = (valueSense: 'cost' | 'reward') => ({
  project: 'invented tank', valueSense, warnings: [], cautions: [], presentController: null, presentControllerReason: 'no model in this test',
  settings: { discount: 0.97, transitions: 1000, episodes: 20, startStates: 20, approximator: 'linear', quadratureNodes: 7, seed: 1 },
  policies: [{ name: 'retuned PI', status: 'converged', policyValue: 8.35823, standardError: 0.0912, fixedPointValue: 8.35901, iterations: 40, message: '', network: null, backend: 'cpu' }],
  behaviour: { value: 9.2718, standardError: 0.4123, episodes: 20, meanTruncationWeight: 0, largestTruncationWeight: 0 },
}) as unknown as Evaluation;

describe('the sentence saying what J is', () => {
  it.each([
    ['cost', '€', 'J is the expected discounted cost from the start states on, in € (lower is better); discount 0.97.'],
    ['cost', '', 'J is the expected discounted cost from the start states on, no unit given (lower is better); discount 0.97.'],
    ['reward', undefined, 'J is the expected discounted reward from the start states on, no unit given (higher is better); discount 0.97.'],
  ] as const)('the command line says the app\'s words for a %s in %j, then the discount', (sense, unit, line) => {
    expect(formatEvaluation(evaluation(sense), 'tank.spcritic', null, unit).split('\n')[1]).toBe(line);
    expect(line.startsWith(valueSenseSentence(sense, unit))).toBe(true);
  });

  it('the report\'s summary opens with the same sentence', () => {
    const input = { evaluation: evaluation('cost'), assessment: null, project: { columns: { reward: { unit: '€' } } } } as unknown as ReportInput;
    expect(summarySection(input).html).toContain(`<strong>Summary.</strong> ${valueSenseSentence('cost', '€')}. By point estimate`);
  });
});
