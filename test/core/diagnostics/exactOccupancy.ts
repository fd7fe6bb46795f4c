/**
 * Exact reference for the calibrated shift on a linear plant: the candidate's normalised
 * discounted occupancy ν = (1 − γ) Σ_t γ^t E[φ(x_t, u_t)] and the logged data's second moment
 * Σ = (1/H) Σ_{t<H} E[φφᵀ] under the logging controller, both from the exact Gaussian law of
 * (x_t, u_t) (../linearGaussianPlant.ts), then νᵀΣ⁻¹ν solved by ml-matrix (an independent library).
 * The discounted sum is cut where γ^t < 1e-10, far below every tolerance it is compared with.
 */
import { Matrix, solve } from 'ml-matrix';
import type { FeatureMap } from '../../../src/core/features/featureMap';
import { featureMoments, stateActionLaw, stateLaws, type GaussianLaw, type TestController, type TestPlant } from '../linearGaussianPlant';

export interface ExactShiftInput {
  plant: TestPlant; logging: TestController; candidate: TestController; start: GaussianLaw;
  stepsPerEpisode: number; discount: number; features: FeatureMap;
}

export function exactDataSecondMoment(input: ExactShiftInput): Float64Array {
  const { plant, logging, start, stepsPerEpisode: h, features } = input, d = features.dim, sigma = new Float64Array(d * d);
  for (const law of stateLaws(plant, logging, start, h)) {
    const { second } = featureMoments(features, stateActionLaw(logging, law, plant.n, plant.m), 3);
    for (let k = 0; k < d * d; k++) sigma[k] += second[k] / h;
  }
  return sigma;
}

export function exactOccupancyFeatures(input: ExactShiftInput): Float64Array {
  const { plant, candidate, start, discount: g, features } = input, d = features.dim, nu = new Float64Array(d);
  const steps = Math.ceil(Math.log(1e-10) / Math.log(g));
  let weight = 1 - g;
  for (const law of stateLaws(plant, candidate, start, steps)) {
    const { mean } = featureMoments(features, stateActionLaw(candidate, law, plant.n, plant.m), 3, true);
    for (let k = 0; k < d; k++) nu[k] += weight * mean[k];
    weight *= g;
  }
  return nu;
}

export function exactShift(input: ExactShiftInput, sigma = exactDataSecondMoment(input)): number {
  const d = input.features.dim, nu = exactOccupancyFeatures(input);
  const s = new Matrix(Array.from({ length: d }, (_, i) => Array.from(sigma.subarray(i * d, (i + 1) * d))));
  const x = solve(s, Matrix.columnVector(Array.from(nu)));
  return Array.from(nu).reduce((acc, v, i) => acc + v * x.get(i, 0), 0);
}
