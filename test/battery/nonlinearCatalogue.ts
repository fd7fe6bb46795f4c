/**
 * The battery's nonlinear plants, invented for it:
 *   - a greenhouse bay on a cold night, heated by a heater whose command is clipped to [0, 1] and
 *     which runs near full output, so the clip is active on a good share of the log;
 *   - an inverted pendulum held near upright by a motor whose torque saturates (the plant clips
 *     the commanded torque, so Q bends where the command exceeds the limit) and whose gravity
 *     term is sin θ, not θ.
 * Their truth comes from seeded rollouts (rolloutTruth.ts).
 */
import type { BatteryPlant } from './batteryPlant';
import type { PlantDynamics } from './episodeLog';
import { nonlinearBatteryPlant } from './nonlinearPlant';

/** Air and soil temperature (°C) of a heated bay; outdoors fixed at −18 °C; 5-minute steps. */
export const greenhouseDynamics: PlantDynamics = {
  stateDim: 2, actionDim: 1,
  step(s, a, rng, next) {
    const air = s[0], soil = s[1], heater = a[0]; // heater already within [0, 1]: the policy clips
    next[0] = air + 0.2 * (soil - air) + 0.06 * (-18 - air) + 2.4 * heater + 0.4 * rng.normal();
    next[1] = soil + 0.08 * (air - soil) + 0.05 * rng.normal();
    const cold = Math.max(0, 18 - air), warm = Math.max(0, air - 18);
    return 4 * cold * cold + warm * warm + 0.1 * heater; // cold costs 4× as much as warm (crop damage), plus energy
  },
};

const HEATER = { lo: [0], hi: [1], mode: 'clip' as const };

/** u = base + k_air·(18 − air) + k_soil·(18 − soil), clipped to [0, 1], as offset + G·s. */
function heaterPolicy(base: number, kAir: number, kSoil: number, std: number) {
  return { offset: [base + 18 * (kAir + kSoil)], gain: [[-kAir, -kSoil]], std: [std], bounds: HEATER };
}

function greenhouse(): BatteryPlant {
  return nonlinearBatteryPlant({
    name: 'greenhouse-clipped-g0.95',
    description: 'greenhouse bay, heater clipped at 0 and 1, 2 states, γ 0.95',
    stateNames: ['air_temp_c', 'soil_temp_c'], actionNames: ['heater_fraction'], discount: 0.95, stepsPerEpisode: 500,
    dynamics: greenhouseDynamics, operatingState: [18, 18], burnIn: 200,
    behaviour: heaterPolicy(0.9, 0.3, 0, 0.15),
    candidates: [
      { name: 'firmer', description: 'gains 0.8 (air) and 0.3 (soil), dither 0.05', spec: heaterPolicy(0.9, 0.8, 0.3, 0.05) },
      { name: 'economy', description: 'base 0.85, gain 0.4 (air), dither 0.08', spec: heaterPolicy(0.85, 0.4, 0, 0.08) },
    ],
    rolloutsPerStart: 150,
  });
}

/** Torque limit of the pendulum's motor (normalised units). */
export const PENDULUM_TORQUE_LIMIT = 0.8;

/** Angle from upright θ (rad) and rate ω (rad/s), 50 ms Euler steps, torque saturating at ±0.8. */
export const pendulumDynamics: PlantDynamics = {
  stateDim: 2, actionDim: 1,
  step(s, a, rng, next) {
    const theta = s[0], omega = s[1];
    const torque = Math.min(PENDULUM_TORQUE_LIMIT, Math.max(-PENDULUM_TORQUE_LIMIT, a[0]));
    next[0] = theta + 0.05 * omega;
    next[1] = omega + 0.05 * (15 * Math.sin(theta) - 0.3 * omega + 10 * torque) + 0.05 * rng.normal();
    return theta * theta + 0.05 * omega * omega + 0.02 * torque * torque;
  },
};

const torqueCommand = (kTheta: number, kOmega: number, std: number) => ({ offset: [0], gain: [[-kTheta, -kOmega]], std: [std] });

function pendulum(): BatteryPlant {
  return nonlinearBatteryPlant({
    name: 'pendulum-saturating-g0.97',
    description: 'inverted pendulum near upright, torque saturating at ±0.8, 2 states, γ 0.97',
    stateNames: ['angle_rad', 'rate_rad_s'], actionNames: ['torque_command'], discount: 0.97, stepsPerEpisode: 500,
    dynamics: pendulumDynamics, operatingState: [0, 0], burnIn: 200,
    behaviour: torqueCommand(5, 1, 0.35),
    candidates: [
      { name: 'firmer', description: 'k = [7, 1.4], dither 0.15', spec: torqueCommand(7, 1.4, 0.15) },
      { name: 'softer', description: 'k = [3.5, 0.6], dither 0.2', spec: torqueCommand(3.5, 0.6, 0.2) },
    ],
    rolloutsPerStart: 150,
  });
}

export function nonlinearPlants(): BatteryPlant[] {
  return [greenhouse(), pendulum()];
}
