/**
 * Everything one network fit holds on the TensorFlow.js side, set up once and released together:
 * the regression data, the next-state quadrature inputs, the trainable parameters with their Adam
 * state, the minibatch stream and the weight average. Draws from the fit's one RandomSource in a
 * fixed order (episode split, layer seeds, then minibatch orders), so the seed fixes every number.
 */
import * as tf from '@tensorflow/tfjs';
import { fitStateActionStandardiser } from '../features/standardiser';
import type { GaussianPolicy } from '../policy';
import { createRandom } from '../random';
import type { TransitionSet } from '../transitions';
import { createParameterAverage, type ParameterAverage } from './networkAveraging';
import { splitEpisodes } from './networkEpisodeSplit';
import { createMinibatchStream, type MinibatchStream } from './networkMinibatches';
import { createNextInputs, type NextInputs } from './networkNextInputs';
import { largestReward, outputScaleOf, type OutputScale } from './networkOutputScale';
import { initialParameters, networkLayout, type NetworkLayout } from './networkParameters';
import type { NetworkFqeSettings } from './networkSettings';
import { createTrainingSet, type InputStandardiser, type NetworkTrainingSet, type RegressionRows } from './networkTrainingSet';
import type { TrainableNetwork } from './networkTrainer';

export interface FitSession {
  readonly net: TrainableNetwork;
  readonly layout: NetworkLayout;
  readonly standardiser: InputStandardiser;
  readonly output: OutputScale;
  readonly rows: NetworkTrainingSet;
  /** Next-state quadrature inputs of the training rows, and of the held-out rows (null without hold-out). */
  readonly next: { readonly training: NextInputs; readonly heldOut: NextInputs | null };
  readonly batches: MinibatchStream;
  readonly average: ParameterAverage;
  /**
   * |Q| above this means divergence: every policy's true |Q| ≤ max|r|/(1−γ) (bounded rewards,
   * geometric series; common practice, e.g. Bertsekas & Tsitsiklis, "Neuro-Dynamic Programming",
   * 1996), and an iterate at twice that is at least the whole bound away from the truth. One
   * output-scale unit is added so that near-zero rewards do not make the limit vanish.
   */
  readonly valueLimit: number;
  dispose(): void;
}

export interface SessionInput {
  readonly data: TransitionSet;
  readonly policy: GaussianPolicy;
  readonly discount: number;
  readonly quadratureNodes: number;
  readonly seed: number;
  readonly settings: NetworkFqeSettings;
}

export function createFitSession(input: SessionInput): FitSession {
  const { data, settings, discount } = input;
  const rng = createRandom(input.seed);
  const split = splitEpisodes(data, settings.heldOutFraction, rng);
  const spec = fitStateActionStandardiser(data).spec;
  const standardiser = { mean: Float64Array.from(spec.mean), scale: Float64Array.from(spec.scale) };
  const output = outputScaleOf(data.rewards, discount);
  const layout = networkLayout(data.stateDim + data.actionDim, settings.hiddenLayers);
  const owned: { dispose(): void }[] = [];
  try {
    const rows = own(owned, createTrainingSet(data, split, standardiser, output, discount));
    const nextOf = (r: RegressionRows) => own(owned, createNextInputs(data, r.transitions, input.policy, input.quadratureNodes, standardiser, discount));
    const next = { training: nextOf(rows.training), heldOut: rows.heldOut ? nextOf(rows.heldOut) : null };
    const theta = own(owned, trainableParameters(initialParameters(layout, settings.activation, rng)));
    const optimizer = own(owned, tf.train.adam(settings.learningRate));
    const batches = own(owned, createMinibatchStream(rows.training.inputs, settings.batchSize, rng));
    const average = own(owned, createParameterAverage(settings.averageLast));
    return {
      net: { theta, layout, activation: settings.activation, optimizer }, layout, standardiser, output, rows, next, batches, average,
      valueLimit: (2 * largestReward(data.rewards)) / (1 - discount) + output.scale,
      dispose: () => owned.splice(0).reverse().forEach((o) => o.dispose()),
    };
  } catch (error) {
    owned.splice(0).reverse().forEach((o) => o.dispose());
    throw error;
  }
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
