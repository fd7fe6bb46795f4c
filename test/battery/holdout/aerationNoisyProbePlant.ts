/**
 * A hold-out plant whose LOG holds noisy readings (probe37; defined before any estimator ran on it, with the
 * drifting dosing pump, dosingPumpWearPlant.ts, and the retuned cold store, coldStoreRetunedPlant.ts): an
 * activated-sludge aeration basin whose dissolved-oxygen probe and load signal are read with white noise, the
 * controller acting on the readings. The log's states are the readings; its cost is the TRUE state's.
 * Not in the battery or the catalogue (its log is not Markov in the logged state); nothing was chosen on it.
 * `nice -n 10 npx tsx bench/holdoutCliRows.ts --plants holdout-aeration-noisy-probe-g0.95`.
 *
 * True state: dissolved oxygen x (mg/L; setpoint 2) and the oxygen-uptake load L (deviation from nominal,
 * measured, first-order 0.9 per step, spread about 0.3). Action: blower u ∈ [0, 1] (the controller clips).
 * Per step, oxygen transfer proportional to the blower and the saturation deficit (9 mg/L saturation) and
 * uptake by Monod kinetics (half-saturation 0.5 mg/L),
 *   x' = x + 0.3·u·(9 − x) − 1.3125·(1 + L)·x/(0.5 + x) + 0.05·ε₁,    L' = 0.9·L + 0.13·ε₂
 * (at rest at x = 2, L = 0, u = 0.5). Cost per step: 4·(x − 2)² + 40·max(0, 1.5 − x)² + 2·u² (off setpoint;
 * far worse below 1.5 mg/L, where nitrification fails; blower power). γ 0.95, runs of 400 steps.
 * Readings: y = (x, L) + n, n white Gaussian with sd READING_NOISE = 10 % of each state's steady spread
 * under the logging controller (0.38 mg/L and 0.30, from seed 1's log of 100,000 rows before any estimator ran).
 * Logging controller: u = 0.5 + 0.3·(2 − y_x), dither 0.05, on the reading.
 * Candidates (on the reading), with the answer they were meant to give (set from 10 rollouts per run start of
 * the truth on seed 1's log, before any estimator ran): `loadFed` (0.2 of the load fed forward: clearly better),
 * `timid` (0.15 per mg/L: clearly worse), `leaner` (around 1.9 mg/L: a close call, less air). Truth: each law as it acts on the true state (brokenLog.ts, lawOnTrueState),
 * rolled out on the true plant from the runs' true start states, with its standard error.
 */
import { createGaussianPolicy, type GaussianPolicySpec } from '../../../src/core/policy';
import type { PlantDynamics } from '../episodeLog';
import { nonlinearBatteryPlant } from '../nonlinearPlant';
import { lawOnTrueState, steadyRun, withBrokenLog, type BrokenLogPlant } from './brokenLog';
import { directActingLaw } from './valveLaw';

export const SETPOINT_MG_L = 2, NITRIFICATION_MG_L = 1.5, SATURATION_MG_L = 9;
/** 10 % of the steady spread of (x, L) under the logging controller. */
export const READING_NOISE = [0.038, 0.03] as const;

export const aerationDynamics: PlantDynamics = {
  stateDim: 2, actionDim: 1,
  step(s, a, rng, next) {
    const x = s[0], load = s[1], u = a[0]; // within [0, 1]: the policy clips
    next[0] = x + 0.3 * u * (SATURATION_MG_L - x) - 1.3125 * (1 + load) * x / (0.5 + x) + 0.05 * rng.normal();
    next[1] = 0.9 * load + 0.13 * rng.normal();
    return 4 * (x - SETPOINT_MG_L) ** 2 + 40 * Math.max(0, NITRIFICATION_MG_L - x) ** 2 + 2 * u * u;
  },
};

/** u = 0.5 − K·(y_x − 2) + F·y_L, clipped to [0, 1]: more air as the oxygen falls or the load rises. */
export function blowerLaw(k: number, feedforward: number, std: number, setpoint = SETPOINT_MG_L): GaussianPolicySpec {
  return directActingLaw(-k, setpoint, feedforward, std);
}

/**
 * kept: the control (probe37's addendum) — the same plant, candidates and seeds with the probe read without
 * noise (holdout-aeration-clean-probe-g0.95), to tell what the noisy reading costs from what the plant costs.
 */
export function aerationNoisyProbePlant(kept = false): BrokenLogPlant {
  const noise = kept ? [0, 0] : READING_NOISE, onTrueState = (spec: GaussianPolicySpec) => lawOnTrueState(spec, noise);
  const behaviour = blowerLaw(0.3, 0, 0.05);
  const candidates = [
    { name: 'loadFed', description: '0.3 per mg/L, 0.2 of the load fed forward, dither 0.05', spec: blowerLaw(0.3, 0.2, 0.05) },
    { name: 'timid', description: '0.15 per mg/L, dither 0.05', spec: blowerLaw(0.15, 0, 0.05) },
    { name: 'leaner', description: '0.3 per mg/L around 1.9 mg/L, dither 0.05', spec: blowerLaw(0.3, 0, 0.05, 1.9) },
  ];
  // The truth's plumbing (start sets, truth per start set) on the true plant with each law as it acts on the true state.
  const truthSide = nonlinearBatteryPlant({
    name: kept ? 'holdout-aeration-clean-probe-g0.95' : 'holdout-aeration-noisy-probe-g0.95',
    description: 'aeration basin, dissolved oxygen and load read with white noise (10 % of their spread), the controller acting on the readings, Monod uptake, blower clipped at 0 and 1, 2 states, γ 0.95 (hold-out; the log breaks: a noisy sensor)',
    stateNames: ['dissolved_oxygen_mg_l', 'uptake_load'], actionNames: ['blower_fraction'], discount: 0.95, stepsPerEpisode: 400,
    dynamics: aerationDynamics, operatingState: [SETPOINT_MG_L, 0], burnIn: 200,
    behaviour: onTrueState(behaviour), candidates: candidates.map((c) => ({ ...c, spec: onTrueState(c.spec) })), rolloutsPerStart: 200,
  });
  const start = steadyRun(aerationDynamics, onTrueState(behaviour), [SETPOINT_MG_L, 0], 200).start;
  const run = { dynamics: aerationDynamics, policy: createGaussianPolicy(behaviour, 2), start };
  return withBrokenLog({ ...truthSide, behaviour, candidates }, kept ? 'none (the control: the probe read without noise)' : 'noisy sensors: the log holds readings with white noise, the controller acts on them',
    { runConditions: () => run, readingNoise: noise }, onTrueState);
}
