/**
 * A fourteenth hold-out plant, defined (with the reactor, reactorRunawayPlant.ts, and the rinse bath,
 * rinseBathPlant.ts) before any run on any of the three: a cooling tower whose fan drive takes only five
 * speeds, so the plant sees the controller's command through a staircase (the drive rounds it to the
 * nearest quarter), and whose fan power grows with the cube of the speed (the fan affinity laws, common
 * practice). Not in the battery; nothing was chosen on it.
 * `nice -n 10 npx tsx bench/holdoutCliRows.ts --plants holdout-cooling-tower-g0.96`.
 *
 * State: cold-water temperature T (°C; setpoint 28) and the heat load q (MW above nominal, measured,
 * first-order, 0.98 per step). Action: the fan command u ∈ [0, 1] (the controller clips); the fan runs at
 *   f = round(4·u)/4 ∈ {0, ¼, ½, ¾, 1}.
 * Per two-minute step
 *   T' = 28 + 0.9·(T − 28) + 0.15·q − 0.6·(f − 0.5) + 0.2·ε₁,    q' = 0.98·q + 0.1·ε₂
 * (one speed step holds the water 1.5 K cooler at steady state; the load's spread is about 0.5 MW).
 * Cost per step: 2·(T − 28)² + 4·f³ (water off its setpoint; fan power).
 * γ 0.96, runs of 400 steps.
 * Logging controller: u = 0.5 + 0.3·(T − 28), dither 0.1 (the dither alone crosses a speed boundary on
 * about one row in three: 32 % of seed 1's 20,000 logged rows, the speed of u with and without its dither).
 * Candidates, with the answer they were meant to give: `loadFed` (0.3 per K with 0.25 per MW of the load
 * fed forward, which cancels the load at steady state, dither 0.1: clearly better), `sluggish` (0.05 per
 * K, dither 0.1: clearly worse) and `firmer` (0.6 per K, dither 0.1: a close call, tighter water against
 * a busier fan). The weights and candidates were set from short rollouts of the truth alone (10 per
 * run start, seed 1's log) so that each candidate gives the answer meant, before any estimator ran.
 * Truth by seeded rollouts with their standard error.
 */
import type { BatteryPlant } from '../batteryPlant';
import type { PlantDynamics } from '../episodeLog';
import { nonlinearBatteryPlant } from '../nonlinearPlant';
import { directActingLaw } from './valveLaw';

export const SETPOINT_C = 28, FAN_SPEEDS = 4;

/** The speed the drive runs at for a command u: the nearest of 0, ¼, ½, ¾, 1. */
export function fanSpeed(command: number): number {
  return Math.round(FAN_SPEEDS * Math.min(1, Math.max(0, command))) / FAN_SPEEDS;
}

/** The tower whose water comes back `warming` K per step warmer for the same fan (fill lost: coolingTowerFillLossPlant.ts); 0 as built. */
export function coolingTowerDynamicsWith(warming: number): PlantDynamics {
  return {
    stateDim: 2, actionDim: 1,
    step(s, a, rng, next) {
      const t = s[0], q = s[1], f = fanSpeed(a[0]);
      next[0] = SETPOINT_C + 0.9 * (t - SETPOINT_C) + 0.15 * q - 0.6 * (f - 0.5) + warming + 0.2 * rng.normal();
      next[1] = 0.98 * q + 0.1 * rng.normal();
      return 2 * (t - SETPOINT_C) ** 2 + 4 * f ** 3;
    },
  };
}

export const coolingTowerDynamics: PlantDynamics = coolingTowerDynamicsWith(0);

/** u = 0.5 + K·(T − setpoint) + F·q, clipped to [0, 1]: more fan as T or the load rises (valveLaw.ts). */
export const fanCommand = directActingLaw;

export function coolingTowerPlant(): BatteryPlant {
  return nonlinearBatteryPlant({
    name: 'holdout-cooling-tower-g0.96',
    description: 'cooling tower, fan drive with five speeds (the command rounded to a quarter), cube-law fan power, measured heat load, 2 states, γ 0.96 (hold-out)',
    stateNames: ['cold_water_c', 'heat_load_mw'], actionNames: ['fan_command_fraction'], discount: 0.96, stepsPerEpisode: 400,
    dynamics: coolingTowerDynamics, operatingState: [SETPOINT_C, 0], burnIn: 200,
    behaviour: fanCommand(0.3, SETPOINT_C, 0, 0.1),
    candidates: [
      { name: 'loadFed', description: '0.3 per K, 0.25 per MW of load fed forward, dither 0.1', spec: fanCommand(0.3, SETPOINT_C, 0.25, 0.1) },
      { name: 'sluggish', description: '0.05 per K, dither 0.1', spec: fanCommand(0.05, SETPOINT_C, 0, 0.1) },
      { name: 'firmer', description: '0.6 per K, dither 0.1', spec: fanCommand(0.6, SETPOINT_C, 0, 0.1) },
    ],
    rolloutsPerStart: 200,
  });
}
