/**
 * Settings of the neural-network fitted Q-evaluation, as a plain interface so core does not
 * depend on the project document (its zod schema mirrors these fields and defaults).
 */
import { FqeOptionsError } from './fqeErrors';
import { DEFAULT_POLYNOMIAL_PART, isPolynomialPartSetting, POLYNOMIAL_PART_VALUES_TEXT, type PolynomialPartSetting } from './polynomialPartSetting';

export type NetworkActivation = 'relu' | 'tanh' | 'elu';
export type NetworkBackendPreference = 'auto' | 'wasm' | 'cpu';

export interface NetworkFqeSettings {
  /** Units per hidden layer, input side first. */
  hiddenLayers: number[];
  activation: NetworkActivation;
  /** Adam step size (Kingma & Ba, 2015). */
  learningRate: number;
  /** Transitions per gradient step (capped at the number of training transitions). */
  batchSize: number;
  /** Adam steps on each frozen regression target. */
  stepsPerIteration: number;
  /** Most outer iterations; each solves the last layer and recomputes the targets. */
  outerIterations: number;
  /** Fraction of whole episodes held out (not trained on) to report a held-out Bellman error; a diagnostic only. */
  heldOutFraction: number;
  /** Window of the stopping rule, in outer iterations (networkConvergence.ts): it judges the drift between two windows; 0 = never stop early. */
  patience: number;
  /** Stopping rule: the largest share of the value that may still be moving, γ/(1 − γ)·(relative change per iteration). */
  tolerance: number;
  /** Average the weights of the last k outer iterations' networks (1 = no averaging). */
  averageLast: number;
  backend: NetworkBackendPreference;
  /** The polynomial part's degree: "chosen" from the log (guarded), or fixed at 2 or 4 (polynomialPartSetting.ts). */
  polynomialDegree: PolynomialPartSetting;
}

/**
 * The defaults of the project schema (src/project/approximatorSchema.ts, kind "network"), chosen
 * on the battery (test/battery, `npm run bench -- battery --run-starts wide`, 6 plants, seeds 1–2):
 * two layers of 32 with 75 steps of 1,024 transitions per outer iteration (the same 76,800
 * transitions an iteration saw before with [64, 32] × 150 steps of 512, at twice the step size)
 * matched or beat the larger setting on every plant at about 60 % of its CPU time: largest error
 * 1.8 % vs 2.6 % on the linear-quadratic plants, 0.5 % vs 1.9 % on the clipped greenhouse and
 * 0.7 % vs 1.5 % on the saturating pendulum (steady starts). The full sweep at these defaults
 * (seeds 1–3, runs logged both ways) gave largest errors of 2.5 % on the linear-quadratic plants,
 * 1.5 % on the greenhouse's and 2.6 % on the pendulum's steady starts, with the pendulum's wide
 * starts still 3.8–4.4 % off (flagged there as disagreeing with the linear estimate). Ten seeds
 * per row (README, "Accuracy measured on plants with known answers"): largest errors 4.4 % on the
 * linear-quadratic plants (the exact quadratic class reached 4.3 % on the same logs: sampling
 * scatter at γ 0.99), 1.7 % and 3.3 % on the nonlinear plants' steady starts, 5.4 % on their wide ones.
 */
export const defaultNetworkSettings: Readonly<NetworkFqeSettings> = Object.freeze({
  hiddenLayers: [32, 32],
  activation: 'relu',
  learningRate: 2e-3,
  batchSize: 1024,
  stepsPerIteration: 75,
  outerIterations: 40,
  heldOutFraction: 0,
  patience: 5,
  tolerance: 0.01,
  averageLast: 5,
  backend: 'auto',
  polynomialDegree: DEFAULT_POLYNOMIAL_PART,
});

const ACTIVATIONS: readonly NetworkActivation[] = ['relu', 'tanh', 'elu'];
const BACKENDS: readonly NetworkBackendPreference[] = ['auto', 'wasm', 'cpu'];

/** Throws FqeOptionsError naming the first setting that cannot be used. Limits match the schema. */
export function checkNetworkSettings(s: NetworkFqeSettings): void {
  const layers = s.hiddenLayers;
  if (!Array.isArray(layers) || layers.length < 1 || layers.length > 6) {
    throw new FqeOptionsError(`hiddenLayers: expected 1 to 6 hidden layers, got ${Array.isArray(layers) ? layers.length : String(layers)}`);
  }
  layers.forEach((units, i) => wholeNumber(`hiddenLayers[${i}]`, units, 1, 1024));
  if (!ACTIVATIONS.includes(s.activation)) throw new FqeOptionsError(`activation: expected one of ${ACTIVATIONS.join(', ')}, got ${String(s.activation)}`);
  if (!(s.learningRate > 0) || !Number.isFinite(s.learningRate)) {
    throw new FqeOptionsError(`learningRate: expected a positive number, got ${s.learningRate}`);
  }
  wholeNumber('batchSize', s.batchSize, 8, 65_536);
  wholeNumber('stepsPerIteration', s.stepsPerIteration, 1, 100_000);
  wholeNumber('outerIterations', s.outerIterations, 1, 10_000);
  if (!(s.heldOutFraction >= 0 && s.heldOutFraction <= 0.5)) {
    throw new FqeOptionsError(`heldOutFraction: expected a fraction from 0 to 0.5, got ${s.heldOutFraction}`);
  }
  wholeNumber('patience', s.patience, 0, 10_000);
  if (!(s.tolerance > 0 && s.tolerance <= 1)) throw new FqeOptionsError(`tolerance: expected a fraction above 0 and at most 1, got ${s.tolerance}`);
  wholeNumber('averageLast', s.averageLast, 1, 100);
  if (!BACKENDS.includes(s.backend)) throw new FqeOptionsError(`backend: expected one of ${BACKENDS.join(', ')}, got ${String(s.backend)}`);
  if (!isPolynomialPartSetting(s.polynomialDegree)) throw new FqeOptionsError(`polynomialDegree: expected ${POLYNOMIAL_PART_VALUES_TEXT}, got ${JSON.stringify(s.polynomialDegree)}`);
}

function wholeNumber(name: string, value: number, lo: number, hi: number): void {
  if (!Number.isInteger(value) || value < lo || value > hi) {
    throw new FqeOptionsError(`${name}: expected a whole number from ${lo} to ${hi}, got ${value}`);
  }
}
