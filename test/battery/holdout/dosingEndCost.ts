/**
 * The dosing loops' END plant (delivery 1.6) under the logging controller at small amplitude: the rollout value
 * and the discrete Lyapunov solution of the linear plant (Bertsekas vol. I §4.1, from memory), shared by
 * dosingPumpWearPlant.test.ts and dosingPumpLateWearPlant.test.ts.
 */
import { feedbackCostToGo } from '../../../src/core/lq';
import type { BrokenLogPlant } from './brokenLog';
import { DELIVERY } from './dosingPumpWearPlant';
import { smallAmplitudeQuadraticValue } from './smallAmplitude';

/** The residual at rest under u = 0.5 − 0.5·(c − 1) with delivery g: c = g·(1 − 0.5·c) ⇒ c* = g/(1 + 0.5·g). */
export const restResidual = (g: number) => g / (1 + 0.5 * g);

export function dosingEndPlantCosts(plant: BrokenLogPlant, seed: number) {
  const g = DELIVERY.last, rest = restResidual(g), restAction = 1 - 0.5 * rest;
  // State (c, d): c′ = 0.8·c − 0.1·d + 0.2·g·u, d′ = 0.9·d. Law u = u* − 0.5·(c − c*) + 0.25·d: u = −F·x with F = (0.5, −0.25).
  const closed = feedbackCostToGo({
    stateDim: 2, actionDim: 1, dynamics: Float64Array.of(0.8, -0.1, 0, 0.9), inputGain: Float64Array.of(0.2 * g, 0),
    processNoiseCovariance: Float64Array.of(0.03 ** 2, 0, 0, 0.13 ** 2), stateWeight: Float64Array.of(5, 0, 0, 0), actionWeight: Float64Array.of(0),
  }, { feedbackGain: Float64Array.of(0.5, -0.25), bias: Float64Array.of(0), noiseCovariance: Float64Array.of(0.05 ** 2) }, plant.discount);
  const run = smallAmplitudeQuadraticValue({
    dynamics: plant.dynamics, rest: [rest, 0], restAction, gain: [-0.5, 0.25], std: 0.05,
    weights: [5, 0], discount: plant.discount, scale: 0.01, rollouts: 3000, seed,
  });
  return { closed: closed.constant, run };
}
