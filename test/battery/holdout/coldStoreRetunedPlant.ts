/**
 * A hold-out plant whose log holds TWO TUNINGS of its controller (probe37; defined before any estimator ran
 * on it, with aerationNoisyProbePlant.ts and dosingPumpWearPlant.ts): a cold store whose temperature loop
 * was retuned halfway through the months of the log, so the logged actions come from two laws while a
 * project assumes one present controller. The truth for "today" is the tuning in force at the END of the
 * log (`behaviour`). Not in the battery or the catalogue; nothing was chosen on it.
 * `nice -n 10 npx tsx bench/holdoutCliRows.ts --plants holdout-cold-store-retuned-g0.97`.
 *
 * State: store air temperature T (°C; setpoint −20) and the door-and-stock heat load q (deviation from
 * nominal, measured, first-order 0.95 per step, spread about 0.3). Action: compressor capacity u ∈ [0, 1]
 * (the controller clips). Per step, heat leaking in from 25 °C ambient, the load, and the compressor's duty,
 *   T' = T + 0.02·(25 − T) + 0.5·q − 1.8·u + 0.1·ε₁,    q' = 0.95·q + 0.1·ε₂
 * (at rest at T = −20, q = 0, u = 0.5). Cost per step: (T + 20)² + 20·max(0, T + 18)² + 3·u² (off setpoint;
 * far worse above −18 °C, where frozen stock is at risk; compressor power). γ 0.97, runs of 400 steps.
 * Logging controllers: the first half of the runs (by run order) under the old tuning u = 0.5 + 0.12·(T + 20),
 * dither 0.08; the second half under the retune in force today, u = 0.5 + 0.3·(T + 20), dither 0.05.
 * Candidates, set from 10 rollouts per run start of the truth on seed 1's log before any estimator ran:
 * `loadFed` (the load fed forward, less dither: clearly better), `modest` (0.2 per K, between the two tunings:
 * clearly worse than today, better than the old tuning), `firmer` (0.34 per K: a close call). Truth by seeded rollouts from the log's
 * own run starts, with its standard error; the present controller's truth is the retune's.
 */
import type { GaussianPolicySpec } from '../../../src/core/policy';
import type { PlantDynamics } from '../episodeLog';
import { nonlinearBatteryPlant } from '../nonlinearPlant';
import { steadyRun, withBrokenLog, type BrokenLogPlant } from './brokenLog';
import { directActingLaw } from './valveLaw';

export const SETPOINT_C = -20, STOCK_RISK_C = -18, AMBIENT_C = 25;

export const coldStoreDynamics: PlantDynamics = {
  stateDim: 2, actionDim: 1,
  step(s, a, rng, next) {
    const t = s[0], q = s[1], u = a[0]; // within [0, 1]: the policy clips
    next[0] = t + 0.02 * (AMBIENT_C - t) + 0.5 * q - 1.8 * u + 0.1 * rng.normal();
    next[1] = 0.95 * q + 0.1 * rng.normal();
    return (t - SETPOINT_C) ** 2 + 20 * Math.max(0, t - STOCK_RISK_C) ** 2 + 3 * u * u;
  },
};

/** u = 0.5 + K·(T + 20) + F·q, clipped to [0, 1]: more cooling as the store warms or the load rises. */
export function compressorLaw(k: number, feedforward: number, std: number): GaussianPolicySpec {
  return directActingLaw(k, SETPOINT_C, feedforward, std);
}

/** The tuning before the retune (the first half of the runs) and the retune in force at the end of the log. */
export const OLD_TUNING = compressorLaw(0.12, 0, 0.08), RETUNE = compressorLaw(0.3, 0, 0.05);

/**
 * kept: the control (probe37's addendum) — the same plant, candidates and seeds under the retune on every run
 * (holdout-cold-store-one-tuning-g0.97), to tell what the two tunings cost from what the plant costs.
 */
export function coldStoreRetunedPlant(kept = false): BrokenLogPlant {
  const plant = nonlinearBatteryPlant({
    name: kept ? 'holdout-cold-store-one-tuning-g0.97' : 'holdout-cold-store-retuned-g0.97',
    description: 'cold store, the temperature loop retuned halfway through the log (two controllers in one log), measured heat load, compressor clipped at 0 and 1, 2 states, γ 0.97 (hold-out; the log breaks: two tunings; truth: the retune in force at the end)',
    stateNames: ['store_temperature_c', 'heat_load'], actionNames: ['compressor_fraction'], discount: 0.97, stepsPerEpisode: 400,
    dynamics: coldStoreDynamics, operatingState: [SETPOINT_C, 0], burnIn: 200, behaviour: RETUNE,
    candidates: [
      { name: 'loadFed', description: '0.3 per K, 0.28 of the load fed forward, dither 0.03', spec: compressorLaw(0.3, 0.28, 0.03) },
      { name: 'modest', description: '0.2 per K, dither 0.05 (between the old tuning and the retune)', spec: compressorLaw(0.2, 0, 0.05) },
      { name: 'firmer', description: '0.34 per K, dither 0.05', spec: compressorLaw(0.34, 0, 0.05) },
    ],
    rolloutsPerStart: 200,
  });
  const old = steadyRun(coldStoreDynamics, OLD_TUNING, [SETPOINT_C, 0], 200), today = steadyRun(coldStoreDynamics, RETUNE, [SETPOINT_C, 0], 200);
  return withBrokenLog(plant, kept ? 'none (the control: the retune on every run)' : 'two tunings: the loop was retuned halfway through the log', {
    runConditions: (e, episodes) => (e < episodes / 2 && !kept ? old : today),
  });
}
