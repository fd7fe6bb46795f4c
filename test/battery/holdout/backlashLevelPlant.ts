/**
 * An eleventh hold-out plant, defined (with the gas header, headerPressurePlant.ts) before any run on
 * either: a level loop whose inlet valve has backlash, so the same command gives different flows
 * depending on where the stem was. Not in the battery; nothing was chosen on it.
 * `npm run bench -- battery --holdout --plants holdout-backlash-level-g0.96`.
 *
 * State: level deviation x (m) from normal and the stem position p ∈ [0, 1] (a positioner read-back,
 * logged, so the logged state is Markov). Action: the valve command u ∈ [0, 1] (the controller clips).
 * Per step, with a dead band of 2·BACKLASH_HALF_BAND around the stem (the stem is dragged along only
 * when the command leaves it; a play model, common practice for backlash):
 *   p' = min(max(p, u − h), u + h) held in [0, 1],   h = 0.04,
 *   x' = 0.9·x + 0.3·(p' − 0.5) + 0.02·ε.
 * Cost per step: 10·x² + 2·|p' − p| (level off normal, and stem travel, which wears the packing). γ 0.96.
 * Logging controller: u = 0.5 − 1.0·x, dither 0.04 (about the half band, so the dither alone moves
 * the stem only part of the time).
 * Candidates, defined in this order: 'firmer' (gain 1.6, dither 0.04: within the logged actions) and
 * 'raised' (gain 1.6 around a level setpoint 0.05 m above normal, dither 0.04: 0.08 above the logged
 * law at the normal level, two logged dithers away).
 * Truth by seeded rollouts with their standard error.
 */
import type { BatteryPlant } from '../batteryPlant';
import type { PlantDynamics } from '../episodeLog';
import { nonlinearBatteryPlant } from '../nonlinearPlant';
import { valveLaw } from './valveLaw';

/** Half the dead band's width (valve fraction). */
export const BACKLASH_HALF_BAND = 0.04;

/** The stem after a command u: dragged to within h of u, else where it was (play operator), held in [0, 1]. */
export function stemAfter(stem: number, command: number, halfBand = BACKLASH_HALF_BAND): number {
  return Math.min(1, Math.max(0, Math.min(Math.max(stem, command - halfBand), command + halfBand)));
}

export const backlashLevelDynamics: PlantDynamics = {
  stateDim: 2, actionDim: 1,
  step(s, a, rng, next) {
    const x = s[0], stem = s[1], moved = stemAfter(stem, a[0]);
    next[0] = 0.9 * x + 0.3 * (moved - 0.5) + 0.02 * rng.normal();
    next[1] = moved;
    return 10 * x * x + 2 * Math.abs(moved - stem);
  },
};

/** u = 0.5 + K·(setpoint − x), clipped to [0, 1]; nothing fed forward from the stem. */
function inletCommand(k: number, levelSetpoint: number, std: number) {
  return valveLaw({ bias: 0.5, setpoint: levelSetpoint, gain: k, feedforward: 0, std, clipped: true });
}

export function backlashLevelPlant(): BatteryPlant {
  return nonlinearBatteryPlant({
    name: 'holdout-backlash-level-g0.96',
    description: 'level loop, inlet valve with backlash (dead band 0.08), stem position logged, command clipped at 0 and 1, 2 states, γ 0.96 (hold-out)',
    stateNames: ['level_deviation_m', 'stem_position_fraction'], actionNames: ['valve_command_fraction'], discount: 0.96, stepsPerEpisode: 400,
    dynamics: backlashLevelDynamics, operatingState: [0, 0.5], burnIn: 200,
    behaviour: inletCommand(1, 0, 0.04),
    candidates: [
      { name: 'firmer', description: 'gain 1.6 per m, dither 0.04', spec: inletCommand(1.6, 0, 0.04) },
      { name: 'raised', description: 'gain 1.6 per m around +0.05 m, dither 0.04', spec: inletCommand(1.6, 0.05, 0.04) },
    ],
    rolloutsPerStart: 200,
  });
}
