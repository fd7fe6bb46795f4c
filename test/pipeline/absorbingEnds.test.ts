/**
 * A log whose runs end in an end state (terminal = 1: nothing is paid after it) cannot be checked by
 * a model of the plant's next state alone: on an invented chain that pays −1 per step and ends after
 * each step with probability p, J = −1/(1 − γ(1 − p)) (the geometric series with ratio γ(1 − p);
 * common practice), while the same one-step dynamics without the end give −1/(1 − γ). The one-step
 * model's rollouts therefore carry a fitted chance of the end (logistic regression) and hold the
 * closed form; the linear-quadratic closed form, for a plant that goes on, says why it does not
 * apply instead of contradicting a right estimate. The per-decision importance-sampling checks
 * keep the runs that ended in each step's normaliser (padded with the absorbing state; Thomas &
 * Brunskill, ICML 2016) and hold the closed form within their standard errors.
 */
import { describe, expect, it } from 'vitest';
import { absorbingEndCount } from '../../src/core/absorbingEnds';
import { indexEpisodes } from '../../src/core/bootstrap/episodeTransitions';
import { createRandom } from '../../src/core/random';
import type { TransitionSet } from '../../src/core/transitions';
import type { AssessmentContext } from '../../src/pipeline/assessCandidate';
import { checkLinearQuadraticModel } from '../../src/pipeline/assessModelCheck';
import { assessProject } from '../../src/pipeline/assessProject';
import { openRolloutSimulations } from '../../src/pipeline/assessRollouts';
import { projectSchema } from '../../src/project/schema';
import type { AssessmentSettings } from '../../src/pipeline/assessSettings';

const settings = { seed: 1, resamples: 10 } as AssessmentSettings;

/** The rollout check's simulations as the assessment opens them (no helper thread): a route, or why there is none. */
function rollouts(context: AssessmentContext): { reason: string } | 'opened' {
  const opened = openRolloutSimulations(context, [], settings);
  if ('reason' in opened) return opened;
  opened.close();
  return 'opened';
}

/** Runs of a level that drifts (s' = 0.9·s + a + noise), paying −1 per step, ending with probability p after each step. */
function endingChain(runs: number, endChance: number, seed: number): TransitionSet {
  const rng = createRandom(seed), rows: number[][] = [];
  for (let e = 0; e < runs; e++) {
    let s = rng.normal();
    for (let t = 0; t < 200; t++) {
      const a = 0.1 * rng.normal(), next = 0.9 * s + a + 0.1 * rng.normal(), done = rng.uniform() < endChance ? 1 : 0;
      rows.push([e, s, a, -1, next, done]);
      s = next;
      if (done) break;
    }
  }
  const n = rows.length, col = (k: number) => Float64Array.from(rows, (r) => r[k]);
  const episode = Int32Array.from(rows, (r) => r[0]), firstRows = rows.filter((r, i) => i === 0 || rows[i - 1][0] !== r[0]);
  return {
    count: n, stateDim: 1, actionDim: 1, stateNames: ['level'], actionNames: ['valve'], states: col(1), actions: col(2), rewards: col(3), nextStates: col(4),
    terminal: Uint8Array.from(rows, (r) => r[5]), episode, episodeCount: runs, startStates: Float64Array.from(firstRows, (r) => r[1]),
    sourceLine: Int32Array.from({ length: n }, (_, i) => i + 2),
  };
}

describe('model checks on a log whose runs end', () => {
  it('counts the end states; the closed-form model check says it does not apply, the rollouts run', () => {
    const discount = 0.9, endChance = 0.2, data = endingChain(300, endChance, 5);
    const ends = absorbingEndCount(data.terminal);
    expect(ends).toBeGreaterThan(250); // nearly every run ends within 200 steps: 0.8^200 ≈ 4e-20
    // The return the log's runs paid, against the closed form (Monte Carlo, from a few hundred runs).
    const paid = -1 / (1 - discount * (1 - endChance)); // −3.57, against −10 for a plant that goes on
    let sum = 0, weight = 1, run = 0;
    for (let i = 0; i < data.count; i++) {
      if (i > 0 && data.episode[i] !== data.episode[i - 1]) { weight = 1; run++; }
      sum += weight * data.rewards[i];
      weight *= discount;
    }
    expect(Math.abs(sum / (run + 1) - paid)).toBeLessThan(0.3);
    const index = indexEpisodes(data);
    const lq = checkLinearQuadraticModel(data, index);
    expect(lq.fitsData).toBe(false);
    expect(lq.summary).toMatch(/end their run in an end state/);
    const model = rollouts({ plan: { data, episodes: index, discount, absorbingEnds: ends } } as unknown as AssessmentContext);
    expect(model).toBe('opened');
  });

  it('leaves the closed-form model check to a log without end states', () => {
    const data = { ...endingChain(100, 0, 6) };
    expect(absorbingEndCount(data.terminal)).toBe(0);
    const index = indexEpisodes(data);
    expect(checkLinearQuadraticModel(data, index).summary).not.toMatch(/end state/);
    expect(rollouts({ plan: { data, episodes: index, discount: 0.9, absorbingEnds: 0 } } as unknown as AssessmentContext)).toBe('opened');
  });

  it('leaves out the closed-form check in a whole assessment, saying why; the rollouts and the importance-sampling checks hold the closed form', async () => {
    const dataset = endingChain(300, 0.05, 8);
    const project = projectSchema.parse({
      format: 'setpoint-critic-project', version: 1, name: 'ending chain', data: { path: 'none.csv' },
      columns: { states: [{ column: 'level' }], actions: [{ column: 'valve' }], reward: { kind: 'column', column: 'r', sense: 'reward' } },
      discount: 0.9, approximator: { kind: 'linear', features: { kind: 'polynomial', degree: 2 } },
      candidates: [{ name: 'steady', offset: [0], gain: [[-0.1]], std: [0.1] }],
    });
    const result = await assessProject({ project, dataset, settings: { resamples: 50, level: 0.9, seed: 2, sensitivity: false } });
    if (!result.ok) throw new Error(result.problems.map((p) => p.message).join('\n'));
    const [candidate] = result.value.candidates, truth = -1 / (1 - 0.9 * 0.95);
    expect(candidate.crossChecks.find((c) => c.method === 'linearQuadraticModel')).toMatchObject({ agreement: 'notApplicable', note: expect.stringMatching(/end state/) });
    // The rollouts' own value carries their Monte Carlo error and no bootstrap standard error: held to the check's own 10 % (a model
    // without the end would give −1/(1 − γ) = −10, 45 % off), and not contradicting the fit.
    const rollout = candidate.crossChecks.find((c) => c.method === 'modelRollouts')!;
    expect(Math.abs(rollout.estimate!.value - truth)).toBeLessThan(0.1 * Math.abs(truth));
    expect(rollout.agreement).not.toMatch(/notApplicable|disagrees/);
    for (const method of ['weightedImportanceSampling', 'weightedDoublyRobust']) {
      const check = candidate.crossChecks.find((c) => c.method === method)!;
      expect(check.agreement).not.toBe('notApplicable');
      expect(Math.abs(check.estimate!.value - truth)).toBeLessThan(3 * check.estimate!.standardError!);
    }
    // The fit itself stops at the end states: every run pays −1 per step until it ends, J = −1/(1 − γ(1 − p)) (the geometric series),
    // within the estimate's own sampling error (the share of steps that end is itself estimated from about 6,000 logged steps).
    const { value, standardError } = candidate.policyValue;
    expect(Math.abs(value - truth)).toBeLessThan(3 * standardError!);
  }, 120_000);
});
