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
import { createTrainingSet, type InputStandardiser, type NetworkTrainingSet } from './networkTrainingSet';
import type { TrainableNetwork } from './networkTrainer';

export interface FitSession {
  readonly net: TrainableNetwork;
  readonly layout: NetworkLayout;
  readonly standardiser: InputStandardiser;
  readonly output: OutputScale;
  readonly training: NetworkTrainingSet;
  readonly next: NextInputs;
  readonly batches: MinibatchStream;
  readonly average: ParameterAverage;
  readonly heldOutEpisodes: number;
  /**
   * |Q| above this means divergence: every policy's true |Q| ≤ max|r|/(1−γ) (bounded rewards,
   * geometric series; Bertsekas & Tsitsiklis, "Neuro-Dynamic Programming", 1996, §2.1), and an
   * iterate at twice that is at least the whole bound away from the truth. One output-scale unit
   * is added so that near-zero rewards do not make the limit vanish.
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
    const training = own(owned, createTrainingSet(data, split.order, split.trainingCount, standardiser, output, discount));
    const next = own(owned, createNextInputs(data, split.order, input.policy, input.quadratureNodes, standardiser, discount));
    const theta = own(owned, tf.variable(tf.tensor1d(initialParameters(layout, settings.activation, rng)), true));
    const optimizer = own(owned, tf.train.adam(settings.learningRate));
    const trainingInputs = own(owned, tf.slice(training.inputs, [0, 0], [split.trainingCount, -1]));
    const batches = own(owned, createMinibatchStream(trainingInputs, settings.batchSize, rng));
    const average = own(owned, createParameterAverage(settings.averageLast));
    return {
      net: { theta, layout, activation: settings.activation, optimizer }, layout, standardiser, output, training, next, batches, average,
      heldOutEpisodes: split.heldOutEpisodes,
      valueLimit: (2 * largestReward(data.rewards)) / (1 - discount) + output.scale,
      dispose: () => owned.splice(0).reverse().forEach((o) => o.dispose()),
    };
  } catch (error) {
    owned.splice(0).reverse().forEach((o) => o.dispose());
    throw error;
  }
}

function own<T extends { dispose(): void }>(owned: { dispose(): void }[], resource: T): T {
  owned.push(resource);
  return resource;
}
