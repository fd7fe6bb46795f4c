/**
 * The battery's linear-quadratic plants: invented process loops of 2, 3 and 4 states with one
 * actuator each, at discounts 0.90, 0.97 and 0.99. All numbers are made up for the battery; each
 * plant has a firmer retune (more feedback, less dither) and an off-centre one (its offset misses
 * the operating point, so V has a linear part as well as the quadratic one).
 */
import type { GaussianPolicySpec } from '../../src/core/policy';
import { linearQuadraticBatteryPlant, type LinearQuadraticBatteryPlant } from './linearQuadraticPlant';

const diagonal = (values: number[]): Float64Array => {
  const n = values.length, out = new Float64Array(n * n);
  values.forEach((v, i) => (out[i * n + i] = v));
  return out;
};

/** a = u_sp − K(s − x_sp) + bias + N(0, std²) as the engine's affine form offset + G·s. */
function feedback(k: number[], xsp: number[], usp: number, std: number, bias = 0): GaussianPolicySpec {
  const offset = usp + bias + k.reduce((sum, ki, i) => sum + ki * xsp[i], 0);
  return { offset: [offset], gain: [k.map((ki) => -ki)], std: [std] };
}

/** A jacketed vessel: vessel and jacket temperatures (°C), steam valve (%). */
function vessel(discount: number): LinearQuadraticBatteryPlant {
  const xsp = [60, 45], usp = 35;
  return linearQuadraticBatteryPlant({
    name: `lq2-vessel-g${discount.toFixed(2)}`,
    description: `jacketed vessel, 2 states, γ ${discount}`,
    stateNames: ['vessel_temp_c', 'jacket_temp_c'], actionNames: ['steam_valve_pct'], discount, stepsPerEpisode: 500,
    plant: {
      stateDim: 2, actionDim: 1,
      dynamics: Float64Array.from([0.9, 0.08, 0.15, 0.75]), inputGain: Float64Array.from([0, 0.4]),
      processNoiseCovariance: diagonal([0.15 ** 2, 0.1 ** 2]), stateWeight: diagonal([1, 0.2]), actionWeight: diagonal([0.05]),
    },
    operatingPoint: { state: Float64Array.from(xsp), action: Float64Array.of(usp) },
    behaviour: feedback([0.4, 0.2], xsp, usp, 1.0),
    candidates: [
      { name: 'firmer', description: 'K = [1.4, 0.5], dither 0.4', spec: feedback([1.4, 0.5], xsp, usp, 0.4) },
      { name: 'offCentre', description: 'K = [0.8, 0.3], dither 0.6, offset 1.5 % high', spec: feedback([0.8, 0.3], xsp, usp, 0.6, 1.5) },
    ],
  });
}

/** A three-zone oven: zone temperatures (°C), burner firing at zone 1 (%). */
function oven(discount: number): LinearQuadraticBatteryPlant {
  const xsp = [180, 175, 170], usp = 55;
  return linearQuadraticBatteryPlant({
    name: `lq3-oven-g${discount.toFixed(2)}`,
    description: `three-zone oven, 3 states, γ ${discount}`,
    stateNames: ['zone1_temp_c', 'zone2_temp_c', 'zone3_temp_c'], actionNames: ['burner_pct'], discount, stepsPerEpisode: 500,
    plant: {
      stateDim: 3, actionDim: 1,
      dynamics: Float64Array.from([0.85, 0.08, 0, 0.1, 0.8, 0.06, 0, 0.12, 0.82]), inputGain: Float64Array.from([0.5, 0.1, 0]),
      processNoiseCovariance: diagonal([0.2 ** 2, 0.15 ** 2, 0.15 ** 2]), stateWeight: diagonal([0.5, 1, 0.5]), actionWeight: diagonal([0.1]),
    },
    operatingPoint: { state: Float64Array.from(xsp), action: Float64Array.of(usp) },
    behaviour: feedback([0.3, 0.3, 0.2], xsp, usp, 1.0),
    candidates: [
      { name: 'firmer', description: 'K = [0.8, 0.8, 0.6], dither 0.4', spec: feedback([0.8, 0.8, 0.6], xsp, usp, 0.4) },
      { name: 'offCentre', description: 'K = [0.5, 0.5, 0.3], dither 0.5, offset 1 % high', spec: feedback([0.5, 0.5, 0.3], xsp, usp, 0.5, 1) },
    ],
  });
}

/** A coupled level and temperature loop: two levels (cm), two temperatures (°C), one feed valve (%). */
function coupledLoop(discount: number): LinearQuadraticBatteryPlant {
  const xsp = [120, 80, 45, 40], usp = 50;
  return linearQuadraticBatteryPlant({
    name: `lq4-coupled-g${discount.toFixed(2)}`,
    description: `coupled level and temperature loop, 4 states, γ ${discount}`,
    stateNames: ['level1_cm', 'level2_cm', 'temp1_c', 'temp2_c'], actionNames: ['feed_valve_pct'], discount, stepsPerEpisode: 500,
    plant: {
      stateDim: 4, actionDim: 1,
      dynamics: Float64Array.from([0.95, 0.05, 0, 0, 0, 0.9, 0.05, 0, 0, 0, 0.92, 0.04, 0.02, 0, 0, 0.88]),
      inputGain: Float64Array.from([0.1, 0.3, 0.05, 0.2]),
      processNoiseCovariance: diagonal([0.1 ** 2, 0.1 ** 2, 0.08 ** 2, 0.08 ** 2]), stateWeight: diagonal([1, 0.5, 0.5, 0.2]), actionWeight: diagonal([0.1]),
    },
    operatingPoint: { state: Float64Array.from(xsp), action: Float64Array.of(usp) },
    behaviour: feedback([0.5, 0.4, 0.2, 0.2], xsp, usp, 1.0),
    candidates: [
      { name: 'firmer', description: 'K = [1.2, 1.0, 0.4, 0.5], dither 0.4', spec: feedback([1.2, 1.0, 0.4, 0.5], xsp, usp, 0.4) },
      { name: 'offCentre', description: 'K = [0.7, 0.5, 0.3, 0.3], dither 0.5, offset 1 % high', spec: feedback([0.7, 0.5, 0.3, 0.3], xsp, usp, 0.5, 1) },
    ],
  });
}

export function linearQuadraticPlants(): LinearQuadraticBatteryPlant[] {
  return [vessel(0.9), oven(0.97), coupledLoop(0.99), vessel(0.99)];
}
