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

export const NETWORK_ACTIVATIONS = ['relu', 'tanh', 'elu'] as const satisfies readonly NetworkActivation[];
export const NETWORK_BACKENDS = ['auto', 'wasm', 'cpu'] as const satisfies readonly NetworkBackendPreference[];

/**
 * The ranges a network setting may take, in one place: the project schema reads them
 * (src/project/schema.ts) and checkNetworkSettings holds the engine's other callers to them. Ours:
 * wide enough for any network this CPU-only tool can train, narrow enough that a typo (a hidden layer
 * of 100,000 units, a held-out half plus) is refused with the field's name rather than run out of memory.
 */
export const NETWORK_LIMITS = Object.freeze({
  hiddenLayers: { min: 1, max: 6 },
  units: { min: 1, max: 1024 },
  batchSize: { min: 8, max: 65_536 },
  stepsPerIteration: { min: 1, max: 100_000 },
  outerIterations: { min: 1, max: 10_000 },
  heldOutFraction: { min: 0, max: 0.5 },
  patience: { min: 0, max: 10_000 },
  /** Exclusive of its lower end: a tolerance of 0 could never be met. */
  tolerance: { above: 0, max: 1 },
  averageLast: { min: 1, max: 100 },
});

/** Throws FqeOptionsError naming the first setting that cannot be used (NETWORK_LIMITS, as the schema). */
export function checkNetworkSettings(s: NetworkFqeSettings): void {
  const layers = s.hiddenLayers, L = NETWORK_LIMITS;
  if (!Array.isArray(layers) || layers.length < L.hiddenLayers.min || layers.length > L.hiddenLayers.max) {
    throw new FqeOptionsError(`hiddenLayers: expected ${L.hiddenLayers.min} to ${L.hiddenLayers.max} hidden layers, got ${Array.isArray(layers) ? layers.length : String(layers)}`);
  }
  layers.forEach((units, i) => wholeNumber(`hiddenLayers[${i}]`, units, L.units));
  if (!(NETWORK_ACTIVATIONS as readonly string[]).includes(s.activation)) throw new FqeOptionsError(`activation: expected one of ${NETWORK_ACTIVATIONS.join(', ')}, got ${String(s.activation)}`);
  if (!(s.learningRate > 0) || !Number.isFinite(s.learningRate)) {
    throw new FqeOptionsError(`learningRate: expected a positive number, got ${s.learningRate}`);
  }
  wholeNumber('batchSize', s.batchSize, L.batchSize);
  wholeNumber('stepsPerIteration', s.stepsPerIteration, L.stepsPerIteration);
  wholeNumber('outerIterations', s.outerIterations, L.outerIterations);
  if (!(s.heldOutFraction >= L.heldOutFraction.min && s.heldOutFraction <= L.heldOutFraction.max)) {
    throw new FqeOptionsError(`heldOutFraction: expected a fraction from ${L.heldOutFraction.min} to ${L.heldOutFraction.max}, got ${s.heldOutFraction}`);
  }
  wholeNumber('patience', s.patience, L.patience);
  if (!(s.tolerance > L.tolerance.above && s.tolerance <= L.tolerance.max)) throw new FqeOptionsError(`tolerance: expected a fraction above ${L.tolerance.above} and at most ${L.tolerance.max}, got ${s.tolerance}`);
  wholeNumber('averageLast', s.averageLast, L.averageLast);
  if (!(NETWORK_BACKENDS as readonly string[]).includes(s.backend)) throw new FqeOptionsError(`backend: expected one of ${NETWORK_BACKENDS.join(', ')}, got ${String(s.backend)}`);
  if (!isPolynomialPartSetting(s.polynomialDegree)) throw new FqeOptionsError(`polynomialDegree: expected ${POLYNOMIAL_PART_VALUES_TEXT}, got ${JSON.stringify(s.polynomialDegree)}`);
}

function wholeNumber(name: string, value: number, range: { readonly min: number; readonly max: number }): void {
  if (!Number.isInteger(value) || value < range.min || value > range.max) {
    throw new FqeOptionsError(`${name}: expected a whole number from ${range.min} to ${range.max}, got ${value}`);
  }
}
