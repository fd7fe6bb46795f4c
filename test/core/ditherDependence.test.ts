/**
 * The present controller's dithers moving together under actuator limits (src/core/ditherDependence.ts).
 * Outside facts: the sample correlation's large-sample standard error (1 − ρ²)/√N and Fisher's z
 * transform with standard error 1/√(N − 3) (Fisher, Biometrika 1915; common practice); the plant is
 * the two-valve blending tank hold-out (test/battery/holdout/blendingTankPlant.ts), logged by its own
 * controller with each valve clipped at [0, 1] and the two dithers drawn with a stated correlation.
 */
import { beforeAll, describe, expect, it } from 'vitest';
import { DITHER_CORRELATION_NOTED, DITHER_CORRELATION_Z, ditherDependence, ditherDependenceNoted, ditherDependenceText } from '../../src/core/ditherDependence';
import { fitBehaviourModel } from '../../src/core/behaviourModel';
import { createGaussianPolicy } from '../../src/core/policy';
import { createRandom } from '../../src/core/random';
import type { TransitionSet } from '../../src/core/transitions';
import type { Assessment } from '../../src/pipeline/assessment';
import { plantProject } from '../support/plantProject';
import { assessedProject } from '../support/assessedProject';
import { burnInStart, logEpisodes, type PlantDynamics } from '../battery/episodeLog';
import { blendCommand, blendingTankDynamics, blendingTankPlant, SETPOINT_C } from '../battery/holdout/blendingTankPlant';

const plant = blendingTankPlant();
const VALVES = { lo: [0, 0], hi: [1, 1] };

/** The tank logged by its own controller, dithers 0.1 each with correlation rho, valves clipped at their ends. */
function correlatedLog(rho: number, transitions: number, seed: number): TransitionSet {
  const base = blendCommand(0.2, 0.8, 1, 0.02, 0.1);
  const logger = createGaussianPolicy({ offset: base.offset, gain: base.gain, covariance: [[0.01, rho * 0.01], [rho * 0.01, 0.01]] }, 2);
  const clipped: PlantDynamics = {
    ...blendingTankDynamics,
    step: (s, a, rng, next) => blendingTankDynamics.step(s, a.map((v, j) => Math.min(VALVES.hi[j], Math.max(VALVES.lo[j], v))), rng, next),
  };
  return logEpisodes(clipped, logger, burnInStart(clipped, logger, [SETPOINT_C, 1], 200), {
    episodes: Math.ceil(transitions / 400), stepsPerEpisode: 400, seed, stateNames: plant.stateNames, actionNames: plant.actionNames, actionClip: VALVES,
  });
}

describe('the correlation of the dithers over the rows inside the limits', () => {
  it('recovers a known correlation within four of its standard errors where the limits are never reached', () => {
    const n = 20_000, rho = 0.5, rng = createRandom(11), states = new Float64Array(n), actions = new Float64Array(2 * n);
    for (let i = 0; i < n; i++) {
      const s = rng.normal(), z1 = rng.normal(), z2 = rng.normal();
      states[i] = s;
      actions[2 * i] = 1 + 0.5 * s + z1;
      actions[2 * i + 1] = -2 * s + rho * z1 + Math.sqrt(1 - rho * rho) * z2;
    }
    const d = ditherDependence(states, actions, n, 1, 2, { offset: [1, 0], gain: [[0.5], [-2]], std: [1, 1] }, { lo: [-Infinity, -Infinity], hi: [Infinity, Infinity] });
    expect(d.rows).toBe(n);
    expect(Math.abs(d.correlation[0][1] - rho)).toBeLessThan((4 * (1 - rho * rho)) / Math.sqrt(n));
    expect(d.strongest).toEqual({ actions: [0, 1], correlation: d.correlation[0][1] });
  });

  it('leaves out the rows where an action sits at a limit, and names nothing from sampling noise on few rows', () => {
    const actions = Float64Array.from([0, 0.5, 0.2, 1, 0.3, 0.3, 0.6, 0.7, 0.4, 0.2]), states = new Float64Array(5);
    const d = ditherDependence(states, actions, 5, 1, 2, { offset: [0.4, 0.5], gain: [[0], [0]], std: [0.2, 0.2] }, VALVES);
    expect(d.rows).toBe(3); // rows 1 (at 0) and 2 (at 1) hold the clip
    // Fisher's rule by hand: atanh(0.5)·√(20 − 3) = 0.549·4.12 = 2.26 < 3, not named although |ρ| ≥ 0.3;
    // atanh(0.7)·√17 = 0.867·4.12 = 3.57 ≥ 3, named. (Three rows cannot be judged at all.)
    const on = (rows: number, correlation: number) => ditherDependenceNoted({ ...d, rows, strongest: { actions: [0, 1], correlation } });
    expect(on(20, 0.5)).toBe(false);
    expect(on(20, -0.7)).toBe(true);
    expect(on(10_000, 0.29)).toBe(false);
    expect(on(3, 0.99)).toBe(false);
  });

  it('says which way the dithers move and the whole rule, in the numbers it read', () => {
    const d = { correlation: [[1, -0.45], [-0.45, 1]], rows: 1_000, strongest: { actions: [0, 1] as [number, number], correlation: -0.45 } };
    const text = ditherDependenceText(d, ['hot', 'cold'])!;
    expect(text).toMatch(/^The present controller’s dithers on hot and cold move in opposite directions \(correlation \u22120\.45 over the 1,000 logged rows/);
    expect(text).toContain(`named from ${DITHER_CORRELATION_NOTED} in size and ${DITHER_CORRELATION_Z} standard errors of Fisher’s z`);
    expect(ditherDependenceText({ ...d, strongest: { actions: [0, 1], correlation: 0.45 } }, ['hot', 'cold'])).toContain('hot and cold move together (correlation 0.45');
  });

  // Independent dithers, both actions' means driven by one state, limits often reached: on the rows inside
  // the limits each residual is a normal cut to a window that moves with the state, so both residuals' means
  // move with the state together; raw residuals then correlate by 0.44 to 0.56 (limits ±1, dither 1, state
  // spread 1 to 4, seed 3; 0.80 with dither 2) with no dependence at all, and the caution fired. Standardised by the cut normal's own mean and variance
  // (Johnson, Kotz & Balakrishnan, "Continuous Univariate Distributions", vol. 1, 2nd ed. 1994, §10.1) they
  // are independent given the state, so their correlation is sampling noise: within 4/√N of 0.
  it('names no dependence where the limits alone make independent dithers look correlated', () => {
    for (const [spread, seed] of [[1, 3], [2, 3], [4, 5]]) {
      const n = 20_000, rng = createRandom(seed), states = new Float64Array(n), actions = new Float64Array(2 * n);
      for (let i = 0; i < n; i++) {
        const s = spread * rng.normal();
        states[i] = s;
        actions[2 * i] = Math.min(1, Math.max(-1, s + rng.normal()));
        actions[2 * i + 1] = Math.min(1, Math.max(-1, s + rng.normal()));
      }
      const d = ditherDependence(states, actions, n, 1, 2, { offset: [0, 0], gain: [[1], [1]], std: [1, 1] }, { lo: [-1, -1], hi: [1, 1] });
      expect(Math.abs(d.correlation[0][1])).toBeLessThan(4 / Math.sqrt(d.rows));
      expect(ditherDependenceNoted(d)).toBe(false);
      const fitted = fitBehaviourModel(states, actions, n, 1, 2).ditherDependence!;
      expect(ditherDependenceNoted(fitted)).toBe(false);
    }
  });
});

describe('the blending tank logged with correlated dithers and clipped valves', () => {
  let independent: TransitionSet, correlated: TransitionSet, assessment: Assessment;
  beforeAll(async () => {
    independent = correlatedLog(0, 10_000, 1);
    correlated = correlatedLog(0.6, 10_000, 1);
    const project = plantProject(plant, 'blend', [{ name: 'trimmed', ...blendCommand(0.2, 0.8, 1.5, 0.03, 0.1), bounds: { ...VALVES, mode: 'clip' } }], 6);
    assessment = await assessedProject({ project, dataset: correlated, settings: { resamples: 10, level: 0.9, seed: 1, sensitivity: false } });
  }, 300_000);

  const model = (d: TransitionSet) => fitBehaviourModel(d.states, d.actions, d.count, 2, 2);

  it('reads the limits, takes the dithers as independent, and measures how far the log disagrees', () => {
    const quiet = model(independent).ditherDependence!, loud = model(correlated).ditherDependence!;
    expect(model(correlated).bounds).toBeDefined();
    // Independent dithers: within 4/√N of zero (the standard error at ρ = 0).
    expect(Math.abs(quiet.correlation[0][1])).toBeLessThan(4 / Math.sqrt(quiet.rows));
    expect(ditherDependenceNoted(quiet)).toBe(false);
    // Drawn at 0.6: the rows inside the limits keep most of it (selection shrinks it toward zero, never past it).
    expect(loud.correlation[0][1]).toBeGreaterThan(DITHER_CORRELATION_NOTED);
    expect(loud.correlation[0][1]).toBeLessThan(0.6 + 4 * (1 - 0.36) / Math.sqrt(loud.rows));
    expect(ditherDependenceNoted(loud)).toBe(true);
  });

  it('says so as a caution in the assessment, with the numbers the rule read', () => {
    const d = model(correlated).ditherDependence!, text = ditherDependenceText(d, plant.actionNames)!;
    const warning = assessment.warnings.find((w) => w.message === text);
    expect(warning?.severity).toBe('caution');
    expect(text).toContain(d.correlation[0][1].toFixed(2));
    expect(text).toContain(`named from ${DITHER_CORRELATION_NOTED}`);
    expect(text).toContain(plant.actionNames[0]);
  });
});
