/**
 * A third hold-out plant, defined after the level loop's runs (where no network fit met its
 * stopping rule, so they could not test an allowance meant for fits that do) and before any run of
 * its own: the outlet temperature of a steam-heated exchanger. Not in the battery; no default was
 * chosen on it. `npm run bench -- battery --holdout --plants holdout-exchanger-g0.95`.
 *
 * Outlet temperature T (°C) moves a fifth of the way per 30-second step towards the temperature the
 * steam valve and the inlet would hold, 50 + 40·valve + d; the inlet deviation d (°C) drifts
 * (first-order, 0.9 per step) and is measured. The valve command is clipped to [0, 1] by the policy.
 * Cost per step: 3·(T − 80)² above 80 °C (overheating the product costs three times as much as
 * underheating it), (80 − T)² below, plus 0.5·valve for steam.
 * Logging controller: P on T, 0.05 per °C, dither 0.1. Candidate: 0.12 per °C with feedforward of
 * d (0.025 per °C, which cancels it at steady state), dither 0.05; truth by seeded rollouts.
 */
import type { BatteryPlant } from '../batteryPlant';
import type { PlantDynamics } from '../episodeLog';
import { nonlinearBatteryPlant } from '../nonlinearPlant';
import { valveLaw } from './valveLaw';

export const SETPOINT_C = 80, VALVE_BIAS = 0.75;
/** °C of outlet temperature the fully open steam valve adds to the 50 °C the inlet brings (clean tubes). */
export const STEAM_GAIN_C = 40;

/** The exchanger whose fully open valve adds `steamGain` °C (a fouled exchanger adds less: exchangerFoulingPlant.ts). */
export function exchangerDynamicsAt(steamGain: number): PlantDynamics {
  return {
    stateDim: 2, actionDim: 1,
    step(s, a, rng, next) {
      const t = s[0], d = s[1], valve = a[0]; // within [0, 1]: the policy clips
      next[0] = t + 0.2 * (50 + steamGain * valve + d - t) + 0.3 * rng.normal();
      next[1] = 0.9 * d + 0.5 * rng.normal();
      const over = Math.max(0, t - SETPOINT_C), under = Math.max(0, SETPOINT_C - t);
      return 3 * over * over + under * under + 0.5 * valve;
    },
  };
}

export const exchangerDynamics: PlantDynamics = exchangerDynamicsAt(STEAM_GAIN_C);

/** valve = bias + K·(80 − T) − F·d, clipped to [0, 1] (valveLaw.ts). */
export function valveCommand(k: number, feedforward: number, std: number, bias = VALVE_BIAS) {
  return valveLaw({ bias, setpoint: SETPOINT_C, gain: k, feedforward: -feedforward, std, clipped: true });
}

export function exchangerPlant(): BatteryPlant {
  return nonlinearBatteryPlant({
    name: 'holdout-exchanger-g0.95',
    description: 'steam-heated exchanger, valve clipped at 0 and 1, overheating costs 3×, measured inlet drift, 2 states, γ 0.95 (hold-out)',
    stateNames: ['outlet_temp_c', 'inlet_deviation_c'], actionNames: ['steam_valve_fraction'], discount: 0.95, stepsPerEpisode: 400,
    dynamics: exchangerDynamics, operatingState: [SETPOINT_C, 0], burnIn: 200,
    behaviour: valveCommand(0.05, 0, 0.1),
    candidates: [
      { name: 'firmer', description: 'K = 0.12 per °C, feedforward 0.025 per °C, dither 0.05', spec: valveCommand(0.12, 0.025, 0.05) },
    ],
    rolloutsPerStart: 400,
  });
}
