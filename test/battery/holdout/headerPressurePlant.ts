/**
 * A twelfth hold-out plant, defined (with the backlash level loop, backlashLevelPlant.ts) before any
 * run on either: a gas header whose disturbance grows with the load (heteroscedastic noise), whose
 * cost has a hinge at a relief limit the steady state sits near, and whose load moves a hundred times
 * slower than the pressure (two time scales). Not in the battery; nothing was chosen on it.
 * `npm run bench -- battery --holdout --plants holdout-header-pressure-g0.98`.
 *
 * State: pressure deviation p (bar) from the setpoint and the load L (fraction of the compressor's
 * capacity, measured). Action: compressor speed u ∈ [0, 1] (the controller clips). Per step
 *   L' = L + 0.01·(0.6 − L) + 0.01·ε₁                  (time constant 100 steps),
 *   p' = 0.8·p + 0.5·(u − L) + (0.02 + 0.1·max(L, 0))·ε₂  (noise 0.08 at the nominal load 0.6).
 * Cost per step: p² + 50·max(0, p − 0.15)² + 0.2·u (off setpoint, far worse above the relief limit,
 * and compressor energy). γ 0.98.
 * Logging controller: u = L − 0.6·p (full load feedforward), dither 0.05; its pressure spread (about
 * 0.1 bar) puts the relief limit about 1.5 spreads above the setpoint.
 * Candidates, defined in this order: 'firmer' (gain 0.9, dither 0.05: within the logged actions) and
 * 'lowered' (gain 1.0 around a setpoint 0.1 bar lower, dither 0.05: 0.1 below the logged law at the
 * setpoint, two logged dithers away).
 * Truth by seeded rollouts with their standard error.
 */
import type { BatteryPlant } from '../batteryPlant';
import type { PlantDynamics } from '../episodeLog';
import { nonlinearBatteryPlant } from '../nonlinearPlant';
import { valveLaw } from './valveLaw';

export const NOMINAL_LOAD = 0.6, RELIEF_LIMIT_BAR = 0.15;

/** Standard deviation of the pressure's disturbance per step at load L. */
export function pressureNoise(load: number): number {
  return 0.02 + 0.1 * Math.max(load, 0);
}

export const headerPressureDynamics: PlantDynamics = {
  stateDim: 2, actionDim: 1,
  step(s, a, rng, next) {
    const p = s[0], load = s[1], u = a[0];
    next[1] = load + 0.01 * (NOMINAL_LOAD - load) + 0.01 * rng.normal();
    next[0] = 0.8 * p + 0.5 * (u - load) + pressureNoise(load) * rng.normal();
    return p * p + 50 * Math.max(0, p - RELIEF_LIMIT_BAR) ** 2 + 0.2 * u;
  },
};

/** u = K·(setpoint − p) + L, clipped to [0, 1]. */
function speedCommand(k: number, setpoint: number, std: number) {
  return valveLaw({ bias: 0, setpoint, gain: k, feedforward: 1, std, clipped: true });
}

export function headerPressurePlant(): BatteryPlant {
  return nonlinearBatteryPlant({
    name: 'holdout-header-pressure-g0.98',
    description: 'gas header, pressure noise growing with a slow load, hinge cost at a relief limit, compressor speed clipped at 0 and 1, 2 states, γ 0.98 (hold-out)',
    stateNames: ['pressure_deviation_bar', 'load_fraction'], actionNames: ['compressor_speed_fraction'], discount: 0.98, stepsPerEpisode: 500,
    dynamics: headerPressureDynamics, operatingState: [0, NOMINAL_LOAD], burnIn: 300,
    behaviour: speedCommand(0.6, 0, 0.05),
    candidates: [
      { name: 'firmer', description: 'gain 0.9 per bar, full load feedforward, dither 0.05', spec: speedCommand(0.9, 0, 0.05) },
      { name: 'lowered', description: 'gain 1.0 per bar around −0.1 bar, full load feedforward, dither 0.05', spec: speedCommand(1, -0.1, 0.05) },
    ],
    rolloutsPerStart: 200,
  });
}
