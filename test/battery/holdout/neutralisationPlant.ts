/**
 * A fifth hold-out plant, defined (with the belt dryer, dryerPlant.ts) before any run on either: an
 * invented neutralisation tank whose pH responds steeply near the setpoint, dosed through a clipped
 * reagent valve that sits near its closed end (it cannot take base out when the tank overshoots). Not in the battery; nothing was chosen on it.
 * `npm run bench -- battery --holdout --plants holdout-neutralisation-g0.95`.
 *
 * The tank holds an excess of base x (invented units); its pH is the steep static map
 *   pH = 7 + 1.2·asinh(x / 0.01)
 * (an invented stand-in for a titration curve: 120 pH units per unit of x at neutral, a few tenths
 * per unit far from it). Per step a fifth of the tank is replaced: x' = x + 0.2·(v − 0.1 − d − x)
 * + 0.001·ε, where v ∈ [0, 1] is the reagent valve (clipped by the policy) and d the measured
 * deviation of the acid load from the mean load the valve bias 0.1 neutralises, drifting first-order (0.95 per step, noise 0.01). State: pH, d.
 * Cost per step: (pH − 7)² + 0.5·v (off-neutral effluent, and reagent). γ 0.95.
 * Logging controller: P on pH, v = 0.1 + 0.02·(7 − pH), dither 0.05, no use of d.
 * Candidates, defined in this order: 'feedforward' (the same gain with half of the load fed forward,
 * 0.5·d, dither 0.05: within the logged actions) and 'firmer' (0.05 per pH with the whole load fed
 * forward, 1·d, dither 0.03: it acts one to two logged dithers away from the logged actions).
 * Truth by seeded rollouts with their standard error.
 */
import type { BatteryPlant } from '../batteryPlant';
import type { PlantDynamics } from '../episodeLog';
import { nonlinearBatteryPlant } from '../nonlinearPlant';
import { valveLaw } from './valveLaw';

const NEUTRAL_PH = 7, VALVE_BIAS = 0.1, CURVE_SCALE = 0.01, CURVE_SLOPE = 1.2;

/** The invented titration curve and its inverse. */
export function phOf(baseExcess: number): number {
  return NEUTRAL_PH + CURVE_SLOPE * Math.asinh(baseExcess / CURVE_SCALE);
}
export function baseExcessOf(ph: number): number {
  return CURVE_SCALE * Math.sinh((ph - NEUTRAL_PH) / CURVE_SLOPE);
}

export const neutralisationDynamics: PlantDynamics = {
  stateDim: 2, actionDim: 1,
  step(s, a, rng, next) {
    const x = baseExcessOf(s[0]), d = s[1], valve = a[0]; // within [0, 1]: the policy clips
    next[0] = phOf(x + 0.2 * (valve - VALVE_BIAS - d - x) + 0.001 * rng.normal());
    next[1] = 0.95 * d + 0.01 * rng.normal();
    return (s[0] - NEUTRAL_PH) ** 2 + 0.5 * valve;
  },
};

/** v = 0.1 + K·(7 − pH) + F·d, clipped to [0, 1] (valveLaw.ts). */
export function reagentCommand(k: number, feedforward: number, std: number) {
  return valveLaw({ bias: VALVE_BIAS, setpoint: NEUTRAL_PH, gain: k, feedforward, std, clipped: true });
}

export function neutralisationPlant(): BatteryPlant {
  return nonlinearBatteryPlant({
    name: 'holdout-neutralisation-g0.95',
    description: 'neutralisation tank, pH steep near neutral, reagent valve clipped at 0 and 1, measured acid load, 2 states, γ 0.95 (hold-out)',
    stateNames: ['ph', 'acid_load_deviation'], actionNames: ['reagent_valve_fraction'], discount: 0.95, stepsPerEpisode: 400,
    dynamics: neutralisationDynamics, operatingState: [NEUTRAL_PH, 0], burnIn: 200,
    behaviour: reagentCommand(0.02, 0, 0.05),
    candidates: [
      { name: 'feedforward', description: 'K = 0.02 per pH, feedforward 0.5 of the load, dither 0.05', spec: reagentCommand(0.02, 0.5, 0.05) },
      { name: 'firmer', description: 'K = 0.05 per pH, feedforward 1 of the load, dither 0.03', spec: reagentCommand(0.05, 1, 0.03) },
    ],
    rolloutsPerStart: 400,
  });
}
