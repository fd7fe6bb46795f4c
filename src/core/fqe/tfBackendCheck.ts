/**
 * Check that a TensorFlow.js backend computes the network's training step like the reference
 * `cpu` backend. TF.js's own test suite does not cover the wasm backend's gradient kernels, and
 * the training step leans on transposes, steps, row sums and products in backward roles; so this
 * runs the exact code of a training step (networkGradient.ts) and of evaluation
 * (networkForward.ts) on a small fixed network, for every activation, on both backends.
 *
 * Tolerance. Both backends compute in float32 (unit roundoff u = 2⁻²⁴ ≈ 6·10⁻⁸) and may sum in
 * different orders (blocked SIMD kernels vs plain loops), so each may err by up to
 * γ_k·Σ|aᵢbᵢ| in a length-k dot product, γ_k = ku/(1 − ku) (Higham, "Accuracy and Stability of
 * Numerical Algorithms", 2nd ed., §3.1, section from memory). Here the longest sums are the batch sums of the weight
 * gradient (k = 32) and the chain has 3 layers forward and back, so relative to the largest
 * component a difference up to about 2·6·γ_32 ≈ 2·10⁻⁵ is rounding; allowing for a
 * cancellation factor of up to ~50 in gradient components gives the tolerance 1·10⁻³ on
 * max|Δ|/max|reference|. A wrong kernel (transposed operand, wrong slope, missing bias) moves the
 * result by the order of its own size, far above this.
 */
import * as tf from '@tensorflow/tfjs';
import { createRandom } from '../random';
import { networkLayout } from './networkParameters';
import { networkOutput } from './networkForward';
import { lossAndGradient } from './networkGradient';
import { NETWORK_ACTIVATIONS, type NetworkActivation } from './networkSettings';
import { ASCII_MINUS, exponentText } from '../exponentText';

export const BACKEND_CHECK_TOLERANCE = 1e-3;

export interface BackendCheck {
  readonly backend: string;
  readonly agrees: boolean;
  /** Largest normwise relative difference from cpu over loss, gradient and outputs (0 if not computed). */
  readonly largestDifference: number;
  readonly tolerance: number;
  /** Why it does not agree (a failed kernel, a missing kernel, or which quantity differs); '' when it agrees. */
  readonly reason: string;
}

interface StepResult {
  readonly loss: Float32Array;
  readonly gradient: Float32Array;
  readonly output: Float32Array;
}

const BATCH = 32, INPUTS = 3, HIDDEN = [16, 16];

/**
 * Compare backend `name` (any registered TF.js backend) with cpu on one training step of a
 * 3-16-16-1 network for each activation. Restores the previously active backend afterwards.
 */
export async function verifyBackend(name: string): Promise<BackendCheck> {
  const previous = tf.getBackend();
  const fail = (reason: string, largestDifference = 0): BackendCheck => ({ backend: name, agrees: false, largestDifference, tolerance: BACKEND_CHECK_TOLERANCE, reason });
  try {
    let largest = 0;
    for (const activation of NETWORK_ACTIVATIONS) {
      const candidate = await stepOn(name, activation);
      const reference = await stepOn('cpu', activation);
      for (const key of ['loss', 'gradient', 'output'] as const) {
        const difference = relativeDifference(candidate[key], reference[key]);
        largest = Math.max(largest, difference);
        if (!(difference <= BACKEND_CHECK_TOLERANCE)) {
          return fail(`the ${key} of a ${activation} network differs from cpu by ${exponentText(difference, 2, ASCII_MINUS, true)} relative (tolerance ${BACKEND_CHECK_TOLERANCE})`, difference);
        }
      }
    }
    return { backend: name, agrees: true, largestDifference: largest, tolerance: BACKEND_CHECK_TOLERANCE, reason: '' };
  } catch (error) {
    return fail(`the training step failed on ${name}: ${error instanceof Error ? error.message : String(error)}`);
  } finally {
    if (previous && tf.getBackend() !== previous) await tf.setBackend(previous);
  }
}

/** max|a − b| / max|b| (normwise, so near-zero components do not dominate); Infinity on a length mismatch or non-finite value. */
export function relativeDifference(a: Float32Array, b: Float32Array): number {
  if (a.length !== b.length) return Infinity;
  let diff = 0, scale = 0;
  for (let i = 0; i < a.length; i++) {
    if (!Number.isFinite(a[i]) || !Number.isFinite(b[i])) return Infinity;
    diff = Math.max(diff, Math.abs(a[i] - b[i]));
    scale = Math.max(scale, Math.abs(b[i]));
  }
  return scale === 0 ? diff : diff / scale;
}

async function stepOn(backend: string, activation: NetworkActivation): Promise<StepResult> {
  if (!(await tf.setBackend(backend))) throw new Error(`backend ${backend} did not start`);
  const { theta, x, t } = fixedProblem();
  const layout = networkLayout(INPUTS, HIDDEN);
  return tf.tidy(() => {
    const thetaT = tf.tensor1d(theta), xT = tf.tensor2d(x, [BATCH, INPUTS]), tT = tf.tensor2d(t, [BATCH, 1]);
    const { loss, gradient } = lossAndGradient(thetaT, layout, activation, xT, tT);
    const output = networkOutput(thetaT, layout, activation, xT);
    return { loss: loss.dataSync() as Float32Array, gradient: gradient.dataSync() as Float32Array, output: output.dataSync() as Float32Array };
  });
}

/** A fixed network and batch: weights ~ N(0, 1/fan-in), inputs ~ N(0, 1), targets ~ N(0, 1). */
function fixedProblem(): { theta: Float32Array; x: Float32Array; t: Float32Array } {
  const rng = createRandom(20_240_611);
  const layout = networkLayout(INPUTS, HIDDEN);
  const theta = new Float32Array(layout.size);
  for (const l of layout.layers) {
    for (let i = 0; i < l.inputs * l.units; i++) theta[l.weightOffset + i] = rng.normal() / Math.sqrt(l.inputs);
    for (let i = 0; i < l.units; i++) theta[l.biasOffset + i] = 0.1 * rng.normal();
  }
  const x = Float32Array.from({ length: BATCH * INPUTS }, () => rng.normal());
  const t = Float32Array.from({ length: BATCH }, () => rng.normal());
  return { theta, x, t };
}
