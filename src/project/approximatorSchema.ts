/**
 * The approximator section of the project document (schema.ts): a linear fit on polynomial or
 * radial-basis features, or the network, with every bound and default taken from the engine
 * (src/core/limits.ts, src/core/fqe/networkSettings.ts) so each lives once.
 */
import { z } from 'zod';
import { defaultNetworkSettings as net, NETWORK_ACTIVATIONS, NETWORK_BACKENDS, NETWORK_LIMITS as L } from '../core/fqe/networkSettings';
import { POLYNOMIAL_PART_VALUES, POLYNOMIAL_PART_VALUES_TEXT, type PolynomialPartSetting } from '../core/fqe/polynomialPartSetting';
import { MAX_ITERATIONS, POLYNOMIAL_DEGREE_RANGE, RADIAL_CENTRES_RANGE, RIDGE, TOLERANCE } from '../core/limits';
import { finite } from './finiteNumber';
import { strictObject } from './strictObject';

export const featureSchema = z.discriminatedUnion('kind', [
  strictObject({ kind: z.literal('polynomial'), degree: z.number().int().min(POLYNOMIAL_DEGREE_RANGE.min).max(POLYNOMIAL_DEGREE_RANGE.max) }),
  strictObject({
    kind: z.literal('radialBasis'),
    centresPerInput: z.number().int().min(RADIAL_CENTRES_RANGE.min).max(RADIAL_CENTRES_RANGE.max),
    /** Width of each basis function as a multiple of the centre spacing. */
    widthScale: finite.positive().default(1),
  }),
]);

export const approximatorSchema = z.discriminatedUnion('kind', [
  strictObject({
    kind: z.literal('linear'),
    features: featureSchema,
    /** Ridge penalty per sample on the averaged normal equations. */
    ridge: finite.nonnegative().max(RIDGE.max, `expected a ridge of at most ${RIDGE.max}; larger values shrink every weight to zero`).default(RIDGE.default),
    tolerance: finite.min(TOLERANCE.min, `expected a tolerance of at least ${TOLERANCE.min} (round-off would stop a smaller one from ever being met)`).max(TOLERANCE.max).default(TOLERANCE.default),
    maxIterations: z.number().int().min(MAX_ITERATIONS.min).max(MAX_ITERATIONS.max).default(MAX_ITERATIONS.default),
  }),
  strictObject({
    kind: z.literal('network'),
    // Defaults are the engine's (src/core/fqe/networkSettings.ts), chosen on the battery of invented plants.
    /** Units per hidden layer; the last layer's units are the features the value is solved on. */
    hiddenLayers: z.array(z.number().int().min(L.units.min).max(L.units.max)).min(L.hiddenLayers.min).max(L.hiddenLayers.max).default(() => [...net.hiddenLayers]),
    activation: z.enum(NETWORK_ACTIVATIONS).default(net.activation),
    learningRate: finite.positive().default(net.learningRate),
    batchSize: z.number().int().min(L.batchSize.min).max(L.batchSize.max).default(net.batchSize),
    /** Adam steps per outer iteration (they improve the hidden features). */
    stepsPerIteration: z.number().int().min(L.stepsPerIteration.min).max(L.stepsPerIteration.max).default(net.stepsPerIteration),
    /** Most outer iterations; each solves the last layer over the whole horizon and then trains the features. */
    outerIterations: z.number().int().min(L.outerIterations.min).max(L.outerIterations.max).default(net.outerIterations),
    /** Fraction of episodes held out (not trained on) to report a held-out Bellman error; a diagnostic, not a stopping rule. */
    heldOutFraction: finite.min(L.heldOutFraction.min).max(L.heldOutFraction.max).default(net.heldOutFraction),
    /**
     * Window of the stopping rule in outer iterations: "converged" when the drift of J and Q between
     * two windows, times γ^W/(1 − γ^W), is within `tolerance`; 0 = never stop early. (Files from before
     * this rule keep their value, now read as the window.)
     */
    patience: z.number().int().min(L.patience.min).max(L.patience.max).default(net.patience),
    /** Stopping rule: the largest share of the value that may still be moving. */
    tolerance: finite.gt(L.tolerance.above).max(L.tolerance.max).default(net.tolerance),
    /** Average the hidden layers of the last k outer iterations and re-solve the last layer on them (1 = no averaging). */
    averageLast: z.number().int().min(L.averageLast.min).max(L.averageLast.max).default(net.averageLast),
    /** TensorFlow.js backend: auto = wasm where it loads and passes its check, else cpu. */
    backend: z.enum(NETWORK_BACKENDS).default(net.backend),
    /**
     * Degree of the polynomial part the hidden features correct: "chosen" from the log by the guarded
     * rule (src/core/fqe/networkDegreeChoice.ts), or fixed at one of the degrees allowed there.
     * Absent in files from before the setting: the default.
     */
    polynomialDegree: z.literal(POLYNOMIAL_PART_VALUES as [PolynomialPartSetting, ...PolynomialPartSetting[]], {
      error: `expected the polynomial part’s degree: ${POLYNOMIAL_PART_VALUES_TEXT}`,
    }).default(net.polynomialDegree),
  }),
]);

export type ApproximatorSettings = z.infer<typeof approximatorSchema>;
