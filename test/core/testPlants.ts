/**
 * Two invented linear plants for the evidence tests (demo-free, made up for these checks), their
 * logging controllers, a family of candidates defined relative to the logging controller, and the
 * logging controller's stationary state law (for start states "like the logs").
 */
import { stateLaws, type GaussianLaw, type TestController, type TestPlant } from './linearGaussianPlant';

/** Three states in a cascade (the action drives x3, which drives x2, which drives x1). */
export const cascadePlant: TestPlant = {
  n: 3, m: 1, A: [0.9, 0.2, 0, 0, 0.85, 0.2, 0, 0, 0.8], B: [0, 0.1, 1], noiseStd: [0.3, 0.3, 0.3],
  Q: [1, 0, 0, 0, 1, 0, 0, 0, 1], R: [0.1],
};
export const cascadeLogging: TestController = { offset: [0], gain: [-0.3, -0.4, -0.3], std: [0.5] };

/** Two states, lightly damped (a position and a rate). */
export const rotorPlant: TestPlant = {
  n: 2, m: 1, A: [0.95, 0.1, -0.05, 0.9], B: [0, 0.5], noiseStd: [0.2, 0.2], Q: [2, 0, 0, 0.5], R: [0.2],
};
export const rotorLogging: TestController = { offset: [0], gain: [-0.4, -0.6], std: [0.4] };

/** Candidates named by how they differ from the logging controller. */
export function candidateFamily(logging: TestController): [string, TestController][] {
  const scaled = (k: number, s: number, offset = 0): TestController => ({
    offset: logging.offset.map((o, a) => o + offset * logging.std[a]), gain: logging.gain.map((g) => k * g), std: logging.std.map((v) => s * v),
  });
  return [
    ['logged', logging],
    ['tighter (gain ×1.6, dither ×0.8)', scaled(1.6, 0.8)],
    ['gentler (gain ×0.5)', scaled(0.5, 1)],
    ['low dither (×0.2)', scaled(1, 0.2)],
    ['hard (gain ×3, dither ×0.6)', scaled(3, 0.6)],
    ['offset 0.5σ', scaled(1, 1, 0.5)],
    ['offset 1σ', scaled(1, 1, 1)],
    ['offset 2σ', scaled(1, 1, 2)],
  ];
}

/** The logging controller's stationary state law (zero mean), by iterating the exact recursion. */
export function stationaryLaw(plant: TestPlant, logging: TestController): GaussianLaw {
  const zero = { mean: new Float64Array(plant.n), cov: new Float64Array(plant.n * plant.n) };
  return stateLaws(plant, logging, zero, 600).at(-1)!;
}

/** Start laws: the logs' own steady state, nine times its covariance, and shifted by 3 units in every state. */
export function startLaws(plant: TestPlant, logging: TestController): [string, GaussianLaw][] {
  const s = stationaryLaw(plant, logging);
  return [
    ['steady', { mean: new Float64Array(plant.n), cov: s.cov }],
    ['wide', { mean: new Float64Array(plant.n), cov: s.cov.map((v) => 9 * v) }],
    ['offset', { mean: new Float64Array(plant.n).fill(3), cov: s.cov }],
  ];
}
