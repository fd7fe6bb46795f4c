/**
 * A seventh hold-out plant, defined before any run on it, and the first with TWO actions: an invented
 * blending tank that makes warm wash water from a hot and a cold supply, each through its own valve.
 * It checks every part of the tool that takes several actions (tensor quadrature, limits per action,
 * importance ratios, model rollouts, the closed form, the value slice). Not in the battery; nothing
 * was chosen on it. `npm run bench -- battery --holdout --plants holdout-blending-tank-g0.97`.
 *
 * State: tank temperature T (°C) and level h (m). Per 10-second step, with the hot valve u_h and the
 * cold valve u_c, each in [0, 1] (clipped by the policy), supplies at 70 °C and 10 °C, each passing
 * 0.1 m of level per step when fully open, and an outlet that passes 0.1·√h (Torricelli's law):
 *   h' = h + 0.1·(u_h + u_c) − 0.1·√h + 0.01·ε₁                       (mass balance),
 *   T' = T + 0.1·[u_h·(70 − T) + u_c·(10 − T)] / h + 0.3·ε₂            (energy balance, well mixed),
 * with h' kept within [0.05, 2] (the outlet's lip and the overflow weir).
 * At h = 1 and T = 22 both hold still with u_h = 0.2 and u_c = 0.8 (0.2·48 = 0.8·12; inflow 0.1 = outflow).
 * Cost per step: 0.05·(T − 22)² + 50·(h − 1)² + 0.4·u_h (off-temperature water, level, heating).
 * γ 0.97.
 * Logging controller: total flow on level and split on temperature, each valve with its own dither,
 *   u_h = 0.2 + 1.0·(1 − h) + 0.02·(22 − T),   u_c = 0.8 + 1.0·(1 − h) − 0.02·(22 − T),   dither 0.1 each,
 * so the hot valve sits two dithers above its closed end and the cold one two below its open end.
 * Candidates, defined in this order: 'trimmed' (level gain 1.5 and temperature gain 0.03, dither 0.1:
 * within the logged actions near the operating point) and 'warmer' (biases 0.4 and 0.6: the hot
 * valve 0.2 more open and the cold 0.2 less at the setpoint — two logged dithers on each valve —
 * logged gains, dither 0.06; it settles near 27.5 °C, worked by hand in its test).
 * Truth by seeded rollouts with their standard error.
 */
import type { GaussianPolicySpec } from '../../../src/core/policy';
import type { BatteryPlant } from '../batteryPlant';
import type { PlantDynamics } from '../episodeLog';
import { nonlinearBatteryPlant } from '../nonlinearPlant';

export const SETPOINT_C = 22;
export const HOT_C = 70, COLD_C = 10;
/** Level change per step of a fully open valve, and the outlet's coefficient (m per step per √m). */
export const VALVE_FLOW = 0.1, OUTLET = 0.1;
const LEVEL_SETPOINT = 1, LEVEL_MIN = 0.05, LEVEL_MAX = 2;

export const blendingTankDynamics: PlantDynamics = {
  stateDim: 2, actionDim: 2,
  step(s, a, rng, next) {
    const t = s[0], h = s[1], hot = a[0], cold = a[1]; // within [0, 1]: the policy clips
    const level = h + VALVE_FLOW * (hot + cold) - OUTLET * Math.sqrt(h) + 0.01 * rng.normal();
    next[1] = Math.min(LEVEL_MAX, Math.max(LEVEL_MIN, level));
    next[0] = t + (VALVE_FLOW * (hot * (HOT_C - t) + cold * (COLD_C - t))) / h + 0.3 * rng.normal();
    const dt = t - SETPOINT_C, dh = h - LEVEL_SETPOINT;
    return 0.05 * dt * dt + 50 * dh * dh + 0.4 * hot;
  },
};

/**
 * u_h = hotBias + kLevel·(1 − h) + kTemp·(22 − T), u_c = coldBias + kLevel·(1 − h) − kTemp·(22 − T),
 * each clipped to [0, 1], as offset + G·s over s = (T, h).
 */
export function blendCommand(hotBias: number, coldBias: number, kLevel: number, kTemp: number, std: number): GaussianPolicySpec {
  const shared = kLevel * LEVEL_SETPOINT, split = kTemp * SETPOINT_C;
  return {
    offset: [hotBias + shared + split, coldBias + shared - split],
    gain: [[-kTemp, -kLevel], [kTemp, -kLevel]],
    std: [std, std],
    bounds: { lo: [0, 0], hi: [1, 1], mode: 'clip' },
  };
}

export function blendingTankPlant(): BatteryPlant {
  return nonlinearBatteryPlant({
    name: 'holdout-blending-tank-g0.97',
    description: 'blending tank, hot and cold valves each clipped at 0 and 1 (two actions), Torricelli outlet, temperature and level, 2 states, γ 0.97 (hold-out)',
    stateNames: ['tank_temp_c', 'tank_level_m'], actionNames: ['hot_valve_fraction', 'cold_valve_fraction'], discount: 0.97, stepsPerEpisode: 400,
    dynamics: blendingTankDynamics, operatingState: [SETPOINT_C, LEVEL_SETPOINT], burnIn: 200,
    behaviour: blendCommand(0.2, 0.8, 1, 0.02, 0.1),
    candidates: [
      { name: 'trimmed', description: 'level gain 1.5, temperature gain 0.03, dither 0.1', spec: blendCommand(0.2, 0.8, 1.5, 0.03, 0.1) },
      { name: 'warmer', description: 'hot valve 0.2 more open, cold 0.2 less, logged gains, dither 0.06', spec: blendCommand(0.4, 0.6, 1, 0.02, 0.06) },
    ],
    rolloutsPerStart: 400,
  });
}
