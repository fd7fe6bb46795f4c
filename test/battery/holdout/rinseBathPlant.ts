/**
 * A fifteenth hold-out plant, defined (with the reactor, reactorRunawayPlant.ts, and the cooling tower,
 * coolingTowerPlant.ts) before any run on any of the three: a rinse bath kept clean by fresh water, where
 * the action multiplies the state — the fresh-water flow carries off contamination in proportion to how
 * much is there (a dilution rate), so the loop's gain vanishes as the bath gets clean and doubles as it
 * gets twice as dirty (a bilinear plant). Not in the battery; nothing was chosen on it.
 * `nice -n 10 npx tsx bench/holdoutCliRows.ts --plants holdout-rinse-bath-g0.95`.
 *
 * State: contamination c (g/L; target 1) and the drag-in load d (deviation from nominal, measured,
 * first-order, 0.95 per step, spread about 0.3). Action: fresh-water valve u ∈ [0, 1] (the controller clips).
 * Per step
 *   c' = c + 0.1·(1 + d) − 0.2·u·c + 0.02·ε₁,    d' = 0.95·d + 0.1·ε₂
 * (at rest at c = 1, d = 0, u = 0.5; ∂c'/∂u = −0.2·c).
 * Cost per step: 4·(c − 1)² + 20·max(0, c − 1.3)² + 0.5·u (off target; far worse past 1.3 g/L, where
 * rinsed parts are rejected; fresh water).
 * γ 0.95, runs of 400 steps.
 * Logging controller: u = 0.5 + 0.5·(c − 1), dither 0.05.
 * Candidates, defined in this order, with the answer they were meant to give: `dragFed` (1.0 per g/L with
 * 0.5 of the load fed forward, dither 0.05: clearly better), `lazy` (0.15 per g/L, dither 0.05: clearly
 * worse) and `saver` (0.5 per g/L around 1.05 g/L, dither 0.05: a close call, less water against
 * dirtier rinsing). Checked with short rollouts of the truth alone (10 per run start, seed 1's log)
 * before any estimator ran.
 * Truth by seeded rollouts with their standard error.
 */
import type { BatteryPlant } from '../batteryPlant';
import type { PlantDynamics } from '../episodeLog';
import { nonlinearBatteryPlant } from '../nonlinearPlant';
import { directActingLaw } from './valveLaw';

export const TARGET_G_L = 1, REJECT_G_L = 1.3;

export const rinseBathDynamics: PlantDynamics = {
  stateDim: 2, actionDim: 1,
  step(s, a, rng, next) {
    const c = s[0], d = s[1], u = a[0]; // within [0, 1]: the policy clips
    next[0] = c + 0.1 * (1 + d) - 0.2 * u * c + 0.02 * rng.normal();
    next[1] = 0.95 * d + 0.1 * rng.normal();
    return 4 * (c - TARGET_G_L) ** 2 + 20 * Math.max(0, c - REJECT_G_L) ** 2 + 0.5 * u;
  },
};

/** u = 0.5 + K·(c − target) + F·d, clipped to [0, 1]: more water as c or the load rises (valveLaw.ts). */
export const freshWaterCommand = directActingLaw;

export function rinseBathPlant(): BatteryPlant {
  return nonlinearBatteryPlant({
    name: 'holdout-rinse-bath-g0.95',
    description: 'rinse bath, fresh-water flow acting in proportion to the contamination (bilinear), measured drag-in load, valve clipped at 0 and 1, 2 states, γ 0.95 (hold-out)',
    stateNames: ['contamination_g_l', 'drag_in_load'], actionNames: ['fresh_water_valve_fraction'], discount: 0.95, stepsPerEpisode: 400,
    dynamics: rinseBathDynamics, operatingState: [TARGET_G_L, 0], burnIn: 200,
    behaviour: freshWaterCommand(0.5, TARGET_G_L, 0, 0.05),
    candidates: [
      { name: 'dragFed', description: '1.0 per g/L, 0.5 of the load fed forward, dither 0.05', spec: freshWaterCommand(1, TARGET_G_L, 0.5, 0.05) },
      { name: 'lazy', description: '0.15 per g/L, dither 0.05', spec: freshWaterCommand(0.15, TARGET_G_L, 0, 0.05) },
      { name: 'saver', description: '0.5 per g/L around 1.05 g/L, dither 0.05', spec: freshWaterCommand(0.5, TARGET_G_L + 0.05, 0, 0.05) },
    ],
    rolloutsPerStart: 200,
  });
}
