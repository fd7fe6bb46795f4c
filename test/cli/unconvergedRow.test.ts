/**
 * A fit that did not meet its convergence rule on the command line's value table: one stopped at its
 * iteration limit shows the J it reached, marked NOT CONVERGED, as the app's value table and the
 * assessment table below it show it (issue: "say what was reached and why it stopped"); a diverged fit
 * has no value. The numbers are invented; only the words are checked.
 */
import { describe, expect, it } from 'vitest';
import { formatEvaluation } from '../../src/cli/formatEvaluation';
import type { Evaluation } from '../../src/pipeline/estimates';

const policy = (name: string, status: string) => ({ name, status, policyValue: 7.3312, standardError: 0.41, fixedPointValue: null, iterations: 40, message: 'Stopped at the limit of 40 outer iterations.', network: null, backend: 'cpu' });
const evaluation = {
  project: 'invented loop', valueSense: 'cost', warnings: [], cautions: [], presentController: null, presentControllerReason: 'no model in this test',
  settings: { discount: 0.95, transitions: 1000, episodes: 20, startStates: 20, approximator: 'network', quadratureNodes: 10, seed: 1 },
  policies: [policy('stopped', 'maxIterations'), policy('ran away', 'diverged')],
  behaviour: { value: 9.2718, standardError: 0.4123, episodes: 20, meanTruncationWeight: 0, largestTruncationWeight: 0 },
} as unknown as Evaluation;

describe('a fit that did not converge, on the command line', () => {
  const text = formatEvaluation(evaluation, 'loop.spcritic'), row = (name: string) => text.split('\n').find((l) => l.startsWith(name))!.split(/\s{3,}/);
  it('shows the J a fit stopped at its limit reached, marked NOT CONVERGED, and says it is left out of the comparison', () => {
    expect(row('stopped').slice(1, 3)).toEqual(['7.33', '0.41']);
    expect(row('stopped').at(-1)).toBe('NOT CONVERGED');
    expect(text).toContain('SERIOUS — stopped: its fit stopped at its iteration limit without meeting its convergence rule: the J shown is where it stopped, not a settled value, and it is left out of the differences and the ranking.');
  });
  it('shows no value for a diverged fit', () => {
    expect(row('ran away')[1]).toBe('no value');
    expect(text).toContain('SERIOUS — ran away: its fit diverged, so no value is reported for it.');
  });
});
