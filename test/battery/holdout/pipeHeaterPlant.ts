/**
 * A ninth hold-out plant, defined before any run on it, to check what a user is told when the logged
 * state has no memory of a dead time: an invented product heater whose steam valve warms the product
 * at the head of a pipe, and whose outlet thermometer sits DEAD_TIME_STEPS samples of pipe downstream.
 * An engineer typically logs only the outlet temperature, the measured inlet disturbance and the
 * valve; the valve positions still travelling down the pipe are then missing from the logged state,
 * which is no longer Markov. Not in the battery; nothing was chosen on it.
 * `npm run bench -- battery --holdout --plants holdout-pipe-heater-g0.97`.
 *
 * State: outlet temperature T (°C), inlet temperature deviation d (°C, measured), and the valve
 * positions u_{t−1} … u_{t−4} (fraction open, in the pipe). Per step, with the valve u_t in [0, 1]
 * (clipped by the policy, and by the valve itself), the product reaching the thermometer was heated
 * by the valve position of 4 steps before, and the thermometer pocket moves a fifth of the way
 * towards it (first order plus dead time, common practice for transport through a pipe):
 *   T' = T + 0.2·(20 + 50·u_{t−4} + d − T) + 0.3·ε₁,   d' = 0.95·d + ε₂,   (u_{t−1}…u_{t−4})' = (u_t, u_{t−1}, u_{t−2}, u_{t−3}).
 * A valve move at t first shows in T at t + 5 (the 4 steps of pipe and the sample of the pocket).
 * At d = 0 the outlet holds 60 °C with the valve at 0.8 (20 + 50·0.8 = 60).
 * Cost per step: (T − 60)² + u_t (off-temperature product, and steam). γ 0.97.
 * Logging controller: P on the outlet temperature with half feedforward of the inlet deviation,
 *   u = 0.8 + 0.01·(60 − T) − 0.01·d, dither 0.03 (loop gain 50·0.01 = 0.5).
 * Candidates, defined in this order: 'steadier' (gain 0.012, dither 0.03: within the logged actions)
 * and 'firmer' (gain 0.04, dither 0.02: a loop gain of 2, which the dead time punishes with a
 * lightly damped swing of about 14 steps; in its own closed loop it acts 2.0 logged dithers (RMS)
 * away from the logging controller's law, and pays about two thirds more per step). Both keep the
 * logged feedforward and use only what is logged (T and d), so each is the same policy in a project
 * with or without the valve's memory.
 * Truth by seeded rollouts with their standard error.
 */
import type { GaussianPolicySpec } from '../../../src/core/policy';
import type { BatteryPlant } from '../batteryPlant';
import type { PlantDynamics } from '../episodeLog';
import { nonlinearBatteryPlant } from '../nonlinearPlant';

/** Samples of pipe between the valve and the product the thermometer sees. */
export const DEAD_TIME_STEPS = 4;
export const SETPOINT_C = 60, VALVE_BIAS = 0.8;
/** Heating per fraction open (°C), the cold-valve outlet temperature, and the pocket's share per step. */
export const VALVE_HEAT_C = 50, COLD_OUTLET_C = 20, POCKET_SHARE = 0.2;
const INLET_PERSISTENCE = 0.95;

const clip01 = (v: number) => Math.min(1, Math.max(0, v));

export const pipeHeaterDynamics: PlantDynamics = {
  stateDim: 2 + DEAD_TIME_STEPS, actionDim: 1,
  step(s, a, rng, next) {
    const t = s[0], d = s[1], u = clip01(a[0]), arriving = s[1 + DEAD_TIME_STEPS];
    next[0] = t + POCKET_SHARE * (COLD_OUTLET_C + VALVE_HEAT_C * arriving + d - t) + 0.3 * rng.normal();
    next[1] = INLET_PERSISTENCE * d + 1.0 * rng.normal();
    for (let k = DEAD_TIME_STEPS; k > 1; k--) next[1 + k] = s[k];
    next[2] = u;
    return (t - SETPOINT_C) ** 2 + u;
  },
};

/** u = 0.8 + K·(60 − T) + F·d, clipped to [0, 1], as offset + G·s (no weight on the valve's memory). */
export function heaterCommand(k: number, feedforward: number, std: number): GaussianPolicySpec {
  const gain = [-k, feedforward, ...Array<number>(DEAD_TIME_STEPS).fill(0)];
  return { offset: [VALVE_BIAS + k * SETPOINT_C], gain: [gain], std: [std], bounds: { lo: [0], hi: [1], mode: 'clip' } };
}

export function pipeHeaterPlant(): BatteryPlant {
  const lags = Array.from({ length: DEAD_TIME_STEPS }, (_, i) => `valve_${i + 1}_steps_ago_fraction`);
  return nonlinearBatteryPlant({
    name: 'holdout-pipe-heater-g0.97',
    description: `product heater, valve clipped at 0 and 1, ${DEAD_TIME_STEPS} steps of dead time to the outlet thermometer, ${2 + DEAD_TIME_STEPS} states (2 logged), γ 0.97 (hold-out)`,
    stateNames: ['outlet_temp_c', 'inlet_deviation_c', ...lags], actionNames: ['steam_valve_fraction'], discount: 0.97, stepsPerEpisode: 400,
    dynamics: pipeHeaterDynamics, operatingState: [SETPOINT_C, 0, ...Array<number>(DEAD_TIME_STEPS).fill(VALVE_BIAS)], burnIn: 200,
    behaviour: heaterCommand(0.01, -0.01, 0.03),
    candidates: [
      { name: 'steadier', description: 'gain 0.012 per °C, half feedforward, dither 0.03', spec: heaterCommand(0.012, -0.01, 0.03) },
      { name: 'firmer', description: 'gain 0.04 per °C, half feedforward, dither 0.02', spec: heaterCommand(0.04, -0.01, 0.02) },
    ],
    rolloutsPerStart: 200,
  });
}
