/**
 * The project's setting of the network's polynomial part (approximator.polynomialDegree,
 * src/core/fqe/polynomialPartSetting.ts) reaching the fit through the one pipeline every host uses
 * (openProject → evaluateProject), and the degree used said in the settings.
 *
 * The log is the invented quartic-cost log of the degree-choice tests (test/core/fqe/quarticCostLog.ts:
 * r = −s⁴ under a linear controller, so the present controller's action value is exactly a quartic in
 * (s, a) — every moment of a Gaussian is a polynomial of the same degree in its mean, common practice —
 * and no quadratic holds it): written out as a CSV, it is read like any project's data. The guarded
 * choice takes 4 on it over the run starts (test/core/fqe/degreeChoiceStartGuard.test.ts); a project
 * that fixes 2 must fit 2. The network is tiny: this checks the wiring, not the accuracy.
 */
import { describe, expect, it } from 'vitest';
import { formatEvaluation } from '../../src/cli/formatEvaluation';
import { evaluateProject } from '../../src/pipeline/evaluateProject';
import { openProject } from '../../src/pipeline/openProject';
import { polynomialPartProblems } from '../../src/pipeline/plan/planChecks';
import { settingsSection } from '../../src/pipeline/report/reportOverview';
import { quarticCostLog } from '../core/fqe/quarticCostLog';
import { wasmDirectory } from '../core/fqe/networkTestEnvironment';

function quarticCsv(): string {
  const log = quarticCostLog(200, 100, 7), lines = ['run,x,u,r,x_next'];
  for (let i = 0; i < log.count; i++) lines.push(`${log.episode[i] + 1},${log.states[i]},${log.actions[i]},${log.rewards[i]},${log.nextStates[i]}`);
  return `${lines.join('\n')}\n`;
}

const csv = new TextEncoder().encode(quarticCsv());

function projectText(polynomialDegree?: unknown): string {
  return JSON.stringify({
    format: 'setpoint-critic-project', version: 1, name: 'Quartic cost (invented)',
    data: { path: 'quartic.csv', csv: { delimiter: 'auto', decimalMark: 'auto', badRows: 'stop' } },
    columns: {
      states: [{ column: 'x', unit: 'm' }], actions: [{ column: 'u', unit: '%' }],
      reward: { kind: 'column', column: 'r', sense: 'reward' },
      nextState: { kind: 'columns', columns: ['x_next'] }, episode: { kind: 'column', column: 'run' },
    },
    discount: 0.9,
    candidates: [{ name: 'Gain 0.3', form: { kind: 'affine', offset: [0], gain: [[-0.3]] }, dither: [0.3] }],
    approximator: {
      kind: 'network', hiddenLayers: [8], batchSize: 64, stepsPerIteration: 10, outerIterations: 2, patience: 0, averageLast: 1, backend: 'wasm',
      ...(polynomialDegree === undefined ? {} : { polynomialDegree }),
    },
    quadratureNodes: 3, seed: 1,
  });
}

async function evaluate(polynomialDegree?: unknown) {
  const opened = await openProject(projectText(polynomialDegree), 'quartic.spcritic', async () => csv);
  if (!opened.ok) throw new Error(opened.problems.map((p) => `${p.where}: ${p.message}`).join('\n'));
  const result = await evaluateProject({ project: opened.value.project, dataset: opened.value.dataset, wasmPath: wasmDirectory });
  if (!result.ok) throw new Error(result.problems.map((p) => `${p.where}: ${p.message}`).join('\n'));
  return Object.assign(result.value, { project: opened.value.project });
}

describe('the network polynomial part set in the project', () => {
  it('fits degree 2 where the project fixes it, and degree 4 where the default choice takes it; the settings say which', async () => {
    const chosen = await evaluate(), fixed = await evaluate(2);
    expect(chosen.settings.polynomialPart).toMatchObject({ setting: 'chosen', degree: 4 });
    expect(chosen.settings.polynomialPart!.reason).toMatch(/^Polynomial part of degree 4: it predicted the present controller’s held-out returns better than degree 2/);
    expect(chosen.settings.approximator).toBe('network, one hidden layer of 8 units, ReLU activation, polynomial part’s degree chosen from the log');
    expect(fixed.settings.polynomialPart).toEqual({ setting: 2, degree: 2, reason: 'Polynomial part of degree 2, as set in the project (not chosen from the log).' });
    expect(fixed.settings.approximator).toBe('network, one hidden layer of 8 units, ReLU activation, polynomial part of degree 2, fixed');
    // Weights of the network plus the polynomial part's: 1 + 2 inputs give 15 quartic terms, 6 quadratic ones (C(2+k, k)).
    expect(chosen.policies[0].featureCount - fixed.policies[0].featureCount).toBe(15 - 6);
    // The command line's settings lines carry the fit's own sentence, once.
    const text = formatEvaluation(fixed, 'quartic.spcritic');
    expect(text).toContain('polynomial part of degree 2, fixed; 3 quadrature nodes');
    expect(text.split('\n')).toContain('Polynomial part of degree 2, as set in the project (not chosen from the log).');
    // The report's settings table: the setting in the approximator's row, the degree used and why in a row of its own.
    const settings = settingsSection({ evaluation: chosen, assessment: null, assessmentProblems: ['not computed here'], project: chosen.project } as never).html;
    expect(settings).toContain('<td>network, one hidden layer of 8 units, ReLU activation, polynomial part’s degree chosen from the log</td>');
    expect(settings).toContain(`<tr><th>Polynomial part of the network</th><td>${chosen.settings.polynomialPart!.reason}</td></tr>`);
  }, 240_000);

  it('fixes degree 4 as asked, the same degree the choice took', async () => {
    const four = await evaluate(4);
    expect(four.settings.polynomialPart).toMatchObject({ setting: 4, degree: 4 });
  }, 240_000);

  it('stops a bad value at the setting, naming the field and the values allowed', async () => {
    for (const bad of [3, '4', 'choose']) {
      const opened = await openProject(projectText(bad), 'quartic.spcritic', async () => csv);
      expect(opened.ok).toBe(false);
      if (opened.ok) continue;
      expect(opened.problems).toEqual([expect.objectContaining({ where: 'quartic.spcritic, approximator.polynomialDegree', message: 'expected the polynomial part’s degree: "chosen", 2 or 4' })]);
    }
  });

  it('stops a fixed degree with more features than supported before any fit', () => {
    const network = { kind: 'network', polynomialDegree: 4 } as never;
    // C(12 + 4, 4) = 1,820 ≤ 2,000 (limits.ts MAX_FEATURES); C(13 + 4, 4) = 2,380 is over.
    expect(polynomialPartProblems(network, 12)).toEqual([]);
    expect(polynomialPartProblems(network, 13)).toEqual([expect.objectContaining({ where: 'approximator.polynomialDegree', message: expect.stringMatching(/degree 4 in 13 states and actions has 2,380 features, more than the 2,000 supported/) })]);
    expect(polynomialPartProblems({ kind: 'network', polynomialDegree: 'chosen' } as never, 13)).toEqual([]);
  });
});
