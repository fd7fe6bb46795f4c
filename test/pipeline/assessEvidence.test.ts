/**
 * The assessment's evidence end to end, on invented plants with answers known outside the project
 * (test/core/testPlants.ts, saturatingPendulum.ts; invented for these checks, not demo data):
 *   - the comparable baseline: the present controller's model, evaluated by fitted Q-evaluation,
 *     within 1 % of the logging controller's exact value from the logged starts (closed form by the
 *     discrete Lyapunov equation: Bertsekas, "Dynamic Programming and Optimal Control", Vol. I, §4.1),
 *     with runs of 100 steps at γ = 0.97 where about 5 % of the weight lies past each run's end;
 *   - the candidate that is the logging controller is within 1 % of J of that baseline (the truncated
 *     logged return, 5 % off, is no longer what candidates are ranked against);
 *   - the calibrated occupancy shift: about 1 for the present controller (0.8–1.25), no flag for
 *     the logging controller as a candidate, "serious" for a candidate offset by 2 dither widths (its
 *     exact shift is about 60: test/core/diagnostics/occupancyShift.test.ts);
 *   - on the saturating pendulum, truth by long rollouts, the reported range holds the truth or the
 *     estimate is marked "not settled" across function classes.
 */
import { describe, expect, it } from 'vitest';
import type { TransitionSet } from '../../src/core/transitions';
import type { Assessment } from '../../src/pipeline/assessment';
import { assessProject } from '../../src/pipeline/assessProject';
import { linearProjectFor } from './linearProjectFor';
import { exactPolicyValue, simulateLog, type TestController } from '../core/linearGaussianPlant';
import { PENDULUM, pendulumLog, pendulumLogging, pendulumRolloutValue } from '../core/saturatingPendulum';
import { candidateFamily, cascadeLogging, cascadePlant, startLaws } from '../core/testPlants';

const settings = { resamples: 200, level: 0.9, seed: 7, sensitivity: false };

const asCandidate = (name: string, c: TestController, n: number) => ({ name, offset: c.offset, gain: [c.gain.slice(0, n)], std: c.std });

async function assessed(data: TransitionSet, discount: number, candidates: unknown[]): Promise<Assessment> {
  const result = await assessProject({ project: linearProjectFor(data, discount, candidates), dataset: data, settings });
  if (!result.ok) throw new Error(result.problems.map((p) => p.message).join('\n'));
  return result.value;
}

describe('the assessment on the cascade plant (steady starts, 300 runs of 100 steps, γ 0.97)', () => {
  const discount = 0.97, [, steady] = startLaws(cascadePlant, cascadeLogging)[0];
  const data = simulateLog(cascadePlant, cascadeLogging, { episodes: 300, steps: 100, seed: 41, start: steady });
  const family = Object.fromEntries(candidateFamily(cascadeLogging));
  let a: Assessment;

  it('uses the present controller’s model as a baseline within 1 % of the exact value', async () => {
    a = await assessed(data, discount, [asCandidate('logged', family.logged, 3), asCandidate('offset 2σ', family['offset 2σ'], 3)]);
    const exact = exactPolicyValue(cascadePlant, cascadeLogging, discount, data.startStates);
    const pc = a.presentController!;
    console.info(`cascade: exact ${exact.toFixed(3)}, present controller ${pc.policyValue.value.toFixed(3)}, logged return ${a.behaviour.value.toFixed(3)}, completed ${pc.completedReturn.value.toFixed(3)}`);
    expect(a.comparison.baseline.kind).toBe('presentController');
    expect(Math.abs(pc.policyValue.value / exact - 1)).toBeLessThan(0.01);
    expect(Math.abs(a.behaviour.value / exact - 1)).toBeGreaterThan(0.02); // the truncated logged return is biased, as the issue says
  });

  it('does not rank the logging controller against its own model', () => {
    const d = a.comparison.differences.find((x) => x.a === 'logged' && x.b === a.comparison.baseline.name)!;
    expect(Math.abs(d.difference.value)).toBeLessThan(0.01 * Math.abs(a.presentController!.policyValue.value));
    console.info(`cascade: logged − present controller ${d.difference.value.toFixed(4)} ${JSON.stringify(d.difference.percentile)}`);
    // The model is fitted to the logged actions, so it differs from the logging controller by its own estimation error: the gap is small, not zero.
  });

  it('reads the occupancy shift about 1 for the logs’ own controller and serious for a candidate far off them', () => {
    const shift = a.presentController!.occupancyShift!;
    console.info(`cascade: shift of the present controller ${shift.toFixed(3)}, logged ${a.candidates[0].diagnostics.occupancyShift?.toFixed(3)}, offset 2σ ${a.candidates[1].diagnostics.occupancyShift?.toFixed(3)}`);
    expect(shift).toBeGreaterThan(0.8);
    expect(shift).toBeLessThan(1.25);
    expect(a.candidates[0].warnings.filter((w) => w.topic === 'occupancyShift')).toEqual([]);
    expect(a.candidates[1].warnings.find((w) => w.topic === 'occupancyShift')?.severity).toBe('serious');
  });
});

describe('the assessment on the saturating pendulum (truth by long rollouts)', () => {
  it('holds the truth in the reported range or says the estimate is not settled', async () => {
    const discount = 0.97, data = pendulumLog(pendulumLogging, 600, 100, 3);
    const c = pendulumLogging, limit = PENDULUM.torqueLimit;
    const a = await assessed(data, discount, [{
      name: 'logged', offset: [c.offset], gain: [[-c.gainAngle, -c.gainRate]], std: [c.std], bounds: { lo: [-limit], hi: [limit], mode: 'clip' },
    }]);
    const truth = pendulumRolloutValue(c, discount, data.startStates, 10, 991).value, x = a.candidates[0];
    console.info(`pendulum: truth ${truth.toFixed(4)}, FQE ${x.policyValue.value.toFixed(4)} ${JSON.stringify(x.policyValue.percentile)}, range ${JSON.stringify(x.reportedRange)}, settled ${x.settled}`);
    const covers = x.reportedRange![0] <= truth && truth <= x.reportedRange![1];
    expect(covers || x.settled === false).toBe(true);
  });
});
