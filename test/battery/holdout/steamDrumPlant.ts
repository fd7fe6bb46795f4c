/**
 * A tenth hold-out plant, defined with both candidates before any run on it, and different in kind
 * from the others: an inverse (non-minimum-phase) response. An invented boiler steam drum whose level
 * first rises when the steam demand rises (the bubbles in the risers swell) and only then falls as
 * the water boils off — the "shrink and swell" every drum-level engineer knows (common practice).
 * Not in the battery; nothing was chosen on it. `npm run bench -- battery --holdout --plants holdout-steam-drum-g0.97`.
 *
 * State: level deviation L (cm) and steam demand d (fraction of the feed valve's full flow above
 * the design load, measured). Per 5-second step, with the feedwater valve command u (the valve
 * saturates at 0 and 1 inside the plant; the command is unbounded):
 *   d' = 0.9·d + 0.05·ε₁                                   (demand, slowly wandering),
 *   L' = L + 4·(clip(u, 0, 1) − 0.8 − d) + 8·(d' − d) + 0.3·ε₂   (mass balance, then swell),
 * so a demand step first lifts the level by 8 cm per unit and then draws it down by 4 cm per step
 * until the feed catches up; at d = 0 the valve holds the level at 0.8 open.
 * Cost per step: 0.01·L² + 0.5·max(0, |L| − 12)² + 2·(clip(u) − 0.8)² (level, the band where the
 * drum's protection would act, and feedwater moves). γ 0.97.
 * Logging controller: u = 0.8 − 0.03·L + 1.0·d (feedforward of the measured demand), dither 0.05,
 * so the valve meets its open end when the demand is more than about 0.2 above the design load.
 * Candidates: 'firmer' (level gain 0.06 per cm, same feedforward, dither 0.05: within the logged
 * actions near the operating point), 'levelOnly' (no feedforward, level gain 0.05, dither 0.05:
 * about two logged dithers from the logged actions when the demand is 0.1 off). Truth by seeded rollouts.
 */
import type { GaussianPolicySpec } from '../../../src/core/policy';
import type { BatteryPlant } from '../batteryPlant';
import type { PlantDynamics } from '../episodeLog';
import { nonlinearBatteryPlant } from '../nonlinearPlant';

const VALVE_BIAS = 0.8, FILL_CM = 4, SWELL_CM = 8, TRIP_BAND_CM = 12;

export const steamDrumDynamics: PlantDynamics = {
  stateDim: 2, actionDim: 1,
  step(s, a, rng, next) {
    const level = s[0], demand = s[1], valve = Math.min(1, Math.max(0, a[0]));
    const nextDemand = 0.9 * demand + 0.05 * rng.normal();
    next[1] = nextDemand;
    next[0] = level + FILL_CM * (valve - VALVE_BIAS - demand) + SWELL_CM * (nextDemand - demand) + 0.3 * rng.normal();
    const beyond = Math.max(0, Math.abs(level) - TRIP_BAND_CM);
    return 0.01 * level * level + 0.5 * beyond * beyond + 2 * (valve - VALVE_BIAS) ** 2;
  },
};

/** u = 0.8 − K·L + F·d, unclipped (the valve saturates in the plant). */
function feedCommand(levelGain: number, feedforward: number, std: number): GaussianPolicySpec {
  return { offset: [VALVE_BIAS], gain: [[-levelGain, feedforward]], std: [std] };
}

export function steamDrumPlant(): BatteryPlant {
  return nonlinearBatteryPlant({
    name: 'holdout-steam-drum-g0.97',
    description: 'steam drum level with shrink and swell (inverse response), feed valve saturating at 0 and 1, measured demand, 2 states, γ 0.97 (hold-out)',
    stateNames: ['drum_level_cm', 'steam_demand'], actionNames: ['feed_valve_command'], discount: 0.97, stepsPerEpisode: 300,
    dynamics: steamDrumDynamics, operatingState: [0, 0], burnIn: 200,
    behaviour: feedCommand(0.03, 1, 0.05),
    candidates: [
      { name: 'firmer', description: 'level gain 0.06 per cm, feedforward 1, dither 0.05', spec: feedCommand(0.06, 1, 0.05) },
      { name: 'levelOnly', description: 'no feedforward, level gain 0.05 per cm, dither 0.05', spec: feedCommand(0.05, 0, 0.05) },
    ],
    rolloutsPerStart: 400,
  });
}
