/**
 * A hold-out plant that DRIFTS over its log (drift40; defined, with coolingTowerFillLossPlant.ts, before any
 * estimator ran on either): the steam-heated exchanger of exchangerPlant.ts whose tubes foul, so the fully
 * open steam valve adds 20 % fewer degrees at the last logged run than at the first (40 °C falling on a
 * straight line to 32 °C). The truth is the plant AS IT IS AT THE END of the log. Not in the battery or the
 * catalogue; nothing was chosen on it.
 *
 * State: outlet temperature T (°C; setpoint 80) and the measured inlet deviation d (°C). Per 30-second step,
 * with the steam gain g of the run,  T' = T + 0.2·(50 + g·valve + d − T) + 0.3·ε₁,  d' = 0.9·d + 0.5·ε₂;
 * cost 3·(T − 80)² above 80 °C, (80 − T)² below, plus 0.5·valve. γ 0.95, runs of 400 steps.
 * Logging controller: valve = 0.75 + 0.05·(80 − T), dither 0.1 (tuned for clean tubes: at rest at 80 °C
 * there; at g = 32 it rests at (50 + 32·4.75)/(1 + 1.6) = 77.7 °C).
 * Candidates (their answers from 10 rollouts per run start of the END plant on seed 1's log, before any
 * estimator ran): `rebiased` (the bias the fouled tubes need at rest, 30/32 = 0.9375, same gain), `firmer`
 * (0.12 per °C with the inlet fed forward, 0.025 per °C, dither 0.05, as exchangerPlant.ts's candidate) and
 * `sluggish` (0.02 per °C, dither 0.1).
 */
import { nonlinearBatteryPlant } from '../nonlinearPlant';
import { alongRuns, driftingLog, type BrokenLogPlant } from './brokenLog';
import { SETPOINT_C, STEAM_GAIN_C, exchangerDynamicsAt, valveCommand } from './exchangerPlant';

/** The steam valve's full effect (°C) at the first logged run and at the last (fouled tubes: 20 % less). */
export const STEAM_GAIN = { first: STEAM_GAIN_C, last: 32 } as const;

/** Run e of E (0-based) meets the steam gain on a straight line from the first run's to the last's. */
export const steamGainAtRun = alongRuns(STEAM_GAIN);

/** kept: the control — the end-of-log (fouled) exchanger on every run (holdout-exchanger-fouled-steady-g0.95). */
export function exchangerFoulingPlant(kept = false): BrokenLogPlant {
  const behaviour = valveCommand(0.05, 0, 0.1), end = exchangerDynamicsAt(STEAM_GAIN.last);
  const plant = nonlinearBatteryPlant({
    name: kept ? 'holdout-exchanger-fouled-steady-g0.95' : 'holdout-exchanger-fouling-g0.95',
    description: 'steam-heated exchanger whose tubes foul: the open valve adds 20 % fewer degrees at the last logged run than at the first, valve clipped at 0 and 1, measured inlet drift, 2 states, γ 0.95 (hold-out; the log breaks: a plant that drifts; truth: the end-of-log plant)',
    stateNames: ['outlet_temp_c', 'inlet_deviation_c'], actionNames: ['steam_valve_fraction'], discount: 0.95, stepsPerEpisode: 400,
    dynamics: end, operatingState: [SETPOINT_C, 0], burnIn: 200, behaviour,
    candidates: [
      { name: 'rebiased', description: '0.05 per °C around a valve bias of 0.9375 (the fouled tubes at rest), dither 0.1', spec: valveCommand(0.05, 0, 0.1, 30 / STEAM_GAIN.last) },
      { name: 'firmer', description: '0.12 per °C, feedforward 0.025 per °C, dither 0.05', spec: valveCommand(0.12, 0.025, 0.05) },
      { name: 'sluggish', description: '0.02 per °C, dither 0.1', spec: valveCommand(0.02, 0, 0.1) },
    ],
    rolloutsPerStart: 200,
  });
  return driftingLog(plant, kept, {
    kept: 'none (the control: the fouled exchanger on every run)', drifts: 'a plant that drifts: the open steam valve adds 20 % fewer degrees at the last run than at the first',
  }, (e, episodes) => exchangerDynamicsAt(steamGainAtRun(e, episodes)), [SETPOINT_C, 0], 200);
}
