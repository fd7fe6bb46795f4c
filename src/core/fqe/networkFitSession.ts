/**
 * Everything one network fit holds, set up once and released together: the regression rows
 * (training rows grouped by episode, so an episode is one contiguous range), the quadratic part
 * with its exact sums and its linear fixed point, the next-state quadrature inputs of the hidden
 * features, the trainable parameters with their Adam state, the minibatch stream, the weight
 * average and the probe rows of the stopping rule. Draws from the fit's one RandomSource in a
 * fixed order (episode split, layer seeds, probe rows, then minibatch orders), so the seed fixes
 * every number.
 */
import { higherTermRidge, type HigherTermRidge } from './networkHigherTermRidge';
import * as tf from '@tensorflow/tfjs';
import { createActionQuadrature, type ActionQuadrature } from '../actionQuadrature';
import { fitStateActionStandardiser } from '../features/standardiser';
import type { GaussianPolicy } from '../policy';
import { createRandom, type RandomSource } from '../random';
import type { TransitionSet } from '../transitions';
import { createParameterAverage, type ParameterAverage } from './networkAveraging';
import { splitEpisodes } from './networkEpisodeSplit';
import { linearPartSums, type LastLayerSums, type LinearPartTensors } from './networkLastLayerSums';
import { createComparator, type Comparator } from './networkComparator';
import { createLinearPart, type LinearPart } from './networkLinearPart';
import type { SettledNetworkMethod } from './networkMethod';
import { createMinibatchStream, type MinibatchStream } from './networkMinibatches';
import { runStartEmphasis } from './networkRunEmphasis';
import { createNextInputs, type NextInputs } from './networkNextInputs';
import { largestReward, outputScaleOf, type OutputScale } from './networkOutputScale';
import { initialParameters, networkLayout, type NetworkLayout } from './networkParameters';
import type { NetworkFqeSettings } from './networkSettings';
import { createTrainingSet, type InputStandardiser, type NetworkTrainingSet, type RegressionRows } from './networkTrainingSet';
import type { TrainableNetwork } from './networkTrainer';
import { episodeOrder } from './networkEpisodeRanges';

/** The quadratic part of one set of rows, on both sides. */
export interface LinearRows {
  readonly part: LinearPart;
  readonly tensors: LinearPartTensors;
  readonly rewards: Float64Array; // n
}

export interface FitSession {
  readonly net: TrainableNetwork;
  readonly layout: NetworkLayout;
  readonly standardiser: InputStandardiser;
  /** Q = φᵀw1 + scale·f_θ: only the scale is used (the quadratic part carries the offset). */
  readonly output: OutputScale;
  readonly rows: NetworkTrainingSet;
  /** Next-state inputs of the hidden features, training and held-out rows (null without hold-out). */
  readonly next: { readonly training: NextInputs; readonly heldOut: NextInputs | null };
  readonly linear: { readonly training: LinearRows; readonly heldOut: LinearRows | null };
  /** Exact quadratic-part sums over all training rows (one range), and per episode. */
  readonly linearTotal: LastLayerSums;
  readonly episodes: { readonly ranges: Int32Array; readonly ids: Int32Array; readonly sums: LastLayerSums };
  /** The linear estimate the network is compared with (networkComparator.ts): its features and sums. */
  readonly comparator: Comparator;
  /** Probe rows of the stopping rule: standardised inputs (PROBE_ROWS×p) and their φ rows. */
  readonly probe: { readonly inputs: tf.Tensor2D; readonly linear: Float64Array };
  /** The project's action quadrature (start-state values and the quadratic part). */
  readonly quadrature: ActionQuadrature;
  readonly batches: MinibatchStream;
  readonly average: ParameterAverage;
  /**
   * |Q| above this means divergence: every policy's true |Q| ≤ max|r|/(1−γ) (bounded rewards,
   * geometric series; common practice, e.g. Bertsekas & Tsitsiklis, "Neuro-Dynamic Programming",
   * 1996), and an iterate at twice that is at least the whole bound away from the truth. One
   * output-scale unit is added so that near-zero rewards do not make the limit vanish.
   */
  readonly valueLimit: number;
  readonly discount: number;
  readonly method: SettledNetworkMethod;
  /** The ridge on the polynomial part's terms above degree 2 (networkHigherTermRidge.ts), for every solve of the joint last layer. */
  readonly higherTermRidge: HigherTermRidge;
  dispose(): void;
}

export interface SessionInput {
  readonly data: TransitionSet;
  readonly policy: GaussianPolicy;
  readonly discount: number;
  readonly quadratureNodes: number;
  readonly seed: number;
  readonly settings: NetworkFqeSettings;
  readonly method: SettledNetworkMethod;
}

/** Rows of the probe set (a choice: enough to see a change anywhere in the logged cloud, cheap to evaluate). */
export const PROBE_ROWS = 512;

export function createFitSession(input: SessionInput): FitSession {
  const { data, settings, discount } = input;
  const rng = createRandom(input.seed);
  const split = episodeOrder(splitEpisodes(data, settings.heldOutFraction, rng), data);
  const spec = fitStateActionStandardiser(data).spec;
  const standardiser = { mean: Float64Array.from(spec.mean), scale: Float64Array.from(spec.scale) };
  const scale = outputScaleOf(data.rewards, discount).scale, output = { offset: 0, scale };
  const layout = networkLayout(data.stateDim + data.actionDim, settings.hiddenLayers);
  const quadrature = createActionQuadrature(input.policy, input.quadratureNodes);
  const hiddenNodes = Math.min(input.quadratureNodes, input.method.hiddenNodes ?? input.quadratureNodes);
  const owned: { dispose(): void }[] = [];
  try {
    const rows = own(owned, createTrainingSet(data, split, standardiser, output, discount));
    const nextOf = (r: RegressionRows) => own(owned, createNextInputs(data, r.transitions, input.policy, hiddenNodes, standardiser, discount));
    const linearOf = (r: RegressionRows) => own(owned, linearRows(data, r.transitions, standardiser, quadrature, discount, input.method.linearPartDegree));
    const next = { training: nextOf(rows.training), heldOut: rows.heldOut ? nextOf(rows.heldOut) : null };
    const linear = { training: linearOf(rows.training), heldOut: rows.heldOut ? linearOf(rows.heldOut) : null };
    const theta = own(owned, trainableParameters(initialParameters(layout, settings.activation, rng)));
    const probe = own(owned, probeRows(rows.training, linear.training.part, rng));
    const optimizer = own(owned, tf.train.adam(settings.learningRate));
    const batches = own(owned, createMinibatchStream(rows.training.inputs, settings.batchSize, rng, runStartEmphasis(data, rows.training.transitions, discount, input.method.runStartEmphasis)));
    const average = own(owned, createParameterAverage(settings.averageLast));
    const all = Int32Array.of(0, rows.training.transitions.length), { part, rewards } = linear.training;
    const linearTotal = linearPartSums(part, rewards, all), episodeSums = linearPartSums(part, rewards, split.trainingEpisodes.ranges);
    const comparator = createComparator({
      data, transitions: rows.training.transitions, standardiser, quadrature, discount, part, partTotal: linearTotal, partEpisodes: episodeSums,
      rewards, episodeRanges: split.trainingEpisodes.ranges,
    });
    return {
      net: { theta, layout, activation: settings.activation, optimizer }, layout, standardiser, output, rows, next, linear,
      linearTotal, episodes: { ...split.trainingEpisodes, sums: episodeSums }, comparator,
      probe, quadrature, batches, average, discount, method: input.method,
      higherTermRidge: higherTermRidge(data.stateDim + data.actionDim, input.method.linearPartDegree, input.method.higherTermRidge),
      valueLimit: (2 * largestReward(data.rewards)) / (1 - discount) + scale,
      dispose: () => owned.splice(0).reverse().forEach((o) => o.dispose()),
    };
  } catch (error) {
    owned.splice(0).reverse().forEach((o) => o.dispose());
    throw error;
  }
}

function linearRows(
  data: TransitionSet, transitions: Int32Array, standardiser: InputStandardiser, quadrature: ActionQuadrature, discount: number, degree: number,
): LinearRows & { dispose(): void } {
  const part = createLinearPart(data, transitions, standardiser, quadrature, discount, degree);
  const n = transitions.length, d1 = part.dim;
  const rewards = Float64Array.from(transitions, (i) => data.rewards[i]);
  const transposed = new Float32Array(n * d1);
  for (let i = 0; i < n; i++) for (let f = 0; f < d1; f++) transposed[f * n + i] = part.rows[i * d1 + f];
  const tensors = {
    rows: tf.tensor2d(Float32Array.from(part.rows), [n, d1]),
    rowsTransposed: tf.tensor2d(transposed, [d1, n]),
    nextRows: tf.tensor2d(Float32Array.from(part.nextRows), [n, d1]),
    rewards: tf.tensor2d(Float32Array.from(rewards), [n, 1]),
  };
  return { part, tensors, rewards, dispose: () => tf.dispose([tensors.rows, tensors.rowsTransposed, tensors.nextRows, tensors.rewards]) };
}

/** PROBE_ROWS training rows drawn without replacement (all rows when there are fewer). */
function probeRows(rows: RegressionRows, part: LinearPart, rng: RandomSource): FitSession['probe'] & { dispose(): void } {
  const n = rows.transitions.length, count = Math.min(PROBE_ROWS, n), d1 = part.dim;
  const pool = Int32Array.from({ length: n }, (_, i) => i);
  for (let i = 0; i < count; i++) {
    const j = i + rng.integer(n - i);
    [pool[i], pool[j]] = [pool[j], pool[i]];
  }
  const picked = pool.slice(0, count);
  const linear = new Float64Array(count * d1);
  picked.forEach((row, k) => linear.set(part.rows.subarray(row * d1, (row + 1) * d1), k * d1));
  const inputs = tf.tidy(() => tf.gather(rows.inputs, tf.tensor1d(picked, 'int32')) as tf.Tensor2D);
  return { inputs, linear, dispose: () => inputs.dispose() };
}

/** A variable holding θ; the variable keeps its own reference to the data, so the upload tensor is freed. */
function trainableParameters(theta: Float32Array): tf.Variable<tf.Rank.R1> {
  const initial = tf.tensor1d(theta);
  const variable = tf.variable(initial, true);
  initial.dispose();
  return variable;
}

function own<T extends { dispose(): void }>(owned: { dispose(): void }[], resource: T): T {
  owned.push(resource);
  return resource;
}

