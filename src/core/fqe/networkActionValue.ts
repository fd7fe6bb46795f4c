/**
 * A fitted Q-network as an ActionValueFunction: Q(s, a) = offset + scale·f_θ(z) [+ φ(s, a)ᵀw when
 * the fit has a linear part, networkLinearPart.ts], with z the standardised [s, a]. Rows are run through the network in batches and read back synchronously
 * (dataSync), which is cheap on the CPU backends this runs on.
 *
 * Shapes: inputs count×(ds+m) row-major, out count.
 */
import * as tf from '@tensorflow/tfjs';
import type { ActionValueFunction } from '../actionValue';
import type { FeatureMap } from '../features/featureMap';
import { NetworkDisposedError } from './networkErrors';
import { networkOutput } from './networkForward';
import type { OutputScale } from './networkOutputScale';
import type { NetworkLayout } from './networkParameters';
import type { NetworkActivation } from './networkSettings';
import { standardiseInto, type InputStandardiser } from './networkTrainingSet';
import { requireActiveBackend, type TfBackendName } from './tfBackend';

export interface NetworkActionValue extends ActionValueFunction {
  /** Frees the parameters; evaluate throws afterwards. */
  dispose(): void;
}

export interface NetworkActionValueSpec {
  readonly theta: tf.Tensor1D; // taken over: disposed by dispose()
  readonly layout: NetworkLayout;
  readonly activation: NetworkActivation;
  readonly standardiser: InputStandardiser;
  readonly output: OutputScale;
  readonly backend: TfBackendName;
  readonly stateDim: number;
  readonly actionDim: number;
  /** The linear part φ(s, a)ᵀw added to the network's output (raw, unstandardised inputs go to φ). */
  readonly linear?: { readonly features: FeatureMap; readonly weights: Float64Array };
}

const ROWS_PER_CALL = 32_768;

export function createNetworkActionValue(spec: NetworkActionValueSpec): NetworkActionValue {
  const { layout, activation, standardiser, output, stateDim, actionDim } = spec;
  const p = stateDim + actionDim;
  let theta: tf.Tensor1D | null = spec.theta;
  const batch = new Float32Array(ROWS_PER_CALL * p);
  const linear = spec.linear, phi = new Float64Array(linear?.features.dim ?? 0);
  const linearValue = (inputs: Float64Array, row: number): number => {
    if (!linear) return 0;
    linear.features.evaluate(inputs, row * p, phi, 0);
    let s = 0;
    for (let f = 0; f < phi.length; f++) s += phi[f] * linear.weights[f];
    return s;
  };
  return {
    stateDim,
    actionDim,
    evaluate(inputs, count, out) {
      if (!theta) throw new NetworkDisposedError();
      if (inputs.length < count * p || out.length < count) {
        throw new RangeError(`network action-value function: ${count} rows need ${count * p} inputs and ${count} outputs, got ${inputs.length} and ${out.length}`);
      }
      requireActiveBackend(spec.backend, 'network action-value function');
      for (let start = 0; start < count; start += ROWS_PER_CALL) {
        const rows = Math.min(ROWS_PER_CALL, count - start);
        for (let r = 0; r < rows; r++) standardiseInto(inputs, (start + r) * p, 0, p, standardiser, batch, r * p);
        // dataSync outside tf.tidy: tidy walks a returned typed array element by element (measured: ~1 µs per value).
        const qTensor = tf.tidy(() => networkOutput(theta!, layout, activation, tf.tensor2d(batch.subarray(0, rows * p), [rows, p])));
        const q = qTensor.dataSync();
        qTensor.dispose();
        for (let r = 0; r < rows; r++) {
          const value = output.offset + output.scale * q[r] + linearValue(inputs, start + r);
          if (!Number.isFinite(value)) {
            throw new RangeError(`network action-value function: Q is ${value} at input row ${start + r + 1} [${Array.from(inputs.subarray((start + r) * p, (start + r + 1) * p)).join(', ')}]`);
          }
          out[start + r] = value;
        }
      }
    },
    dispose() {
      theta?.dispose();
      theta = null;
    },
  };
}
