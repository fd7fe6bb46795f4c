/**
 * Network FQE throughput at 100,000 transitions of the tank-levels plant with the default network
 * settings (src/core/fqe/networkSettings.ts), per TF.js backend: gradient steps per second, the
 * feature pass (the hidden layers over the n training rows and the n·K next-state rows), the
 * last-layer sums, an outer iteration, an end-to-end fit, and achieved GFLOP/s. The accuracy of
 * the defaults is measured on the battery (`npm run bench -- battery`).
 *
 * FLOPs count only the dense layers' products (biases and activations are O(B·units), a few per
 * cent): forward 2·B·M per step with M = Σ inputs·units (multiplyAddsPerRow); backward 2·B·M for
 * the weight gradients plus 2·B·(M − p·h₁) for the gradients passed down (none into the input).
 * For comparison the same step is also timed through TF.js's autodiff (tf.grads) and through the
 * layers API (model.trainOnBatch), which is why the fit uses its own backpropagation.
 */
import * as tf from '@tensorflow/tfjs';
import { fileURLToPath } from 'node:url';
import { fitNetworkFqe } from '../src/core/fqe/networkFqe';
import { createFitSession, type FitSession } from '../src/core/fqe/networkFitSession';
import { forwardPass } from '../src/core/fqe/networkForward';
import { hiddenFeatureRows } from '../src/core/fqe/networkHiddenFeatures';
import { lastLayerTotals } from '../src/core/fqe/networkLastLayerSums';
import { defaultNetworkMethod } from '../src/core/fqe/networkMethod';
import { LINEAR_PART_DEGREE } from '../src/core/fqe/networkLinearPart';
import { featurePassFlop, lastLayerSumsFlop } from '../src/core/fqe/networkWork';
import { multiplyAddsPerRow, networkLayout } from '../src/core/fqe/networkParameters';
import { defaultNetworkSettings } from '../src/core/fqe/networkSettings';
import { createPacer, trainSteps } from '../src/core/fqe/networkTrainer';
import { loadBackend, type TfBackendName } from '../src/core/fqe/tfBackend';
import { createGaussianPolicy } from '../src/core/policy';
import type { TransitionSet } from '../src/core/transitions';
import { simulateTankLevels, tankDiscount, tankTunedPolicy } from '../sample-projects/tank-levels/simulate';

const wasmPath = fileURLToPath(new URL('../node_modules/@tensorflow/tfjs-backend-wasm/dist/', import.meta.url));
const QUADRATURE_NODES = 10;
const settings = { ...defaultNetworkSettings };
const seconds = (start: number) => (performance.now() - start) / 1000;

/** 200 runs × 501 steps → 100,000 transitions (each row and the next row of its run). */
function tankTransitions(): TransitionSet {
  const log = simulateTankLevels({ runs: 200, stepsPerRun: 501, seed: 5 });
  const at = (i: number, c: number) => log.rows[i * 6 + c];
  const keep: number[] = [], starts: number[] = [];
  for (let i = 0; i < log.rowCount; i++) {
    if (i === 0 || at(i - 1, 0) !== at(i, 0)) starts.push(at(i, 2), at(i, 3));
    if (i + 1 < log.rowCount && at(i + 1, 0) === at(i, 0)) keep.push(i);
  }
  const n = keep.length;
  return {
    count: n, stateDim: 2, actionDim: 1, stateNames: ['level_upper_m', 'level_lower_m'], actionNames: ['inflow_valve_pct'],
    states: Float64Array.from(keep.flatMap((i) => [at(i, 2), at(i, 3)])), actions: Float64Array.from(keep, (i) => at(i, 4)),
    rewards: Float64Array.from(keep, (i) => -at(i, 5)), nextStates: Float64Array.from(keep.flatMap((i) => [at(i + 1, 2), at(i + 1, 3)])),
    terminal: new Uint8Array(n), episode: Int32Array.from(keep, (i) => at(i, 0) - 1), episodeCount: starts.length / 2,
    startStates: Float64Array.from(starts), sourceLine: Int32Array.from(keep, (i) => i + 2),
  };
}

/** Matrix-product FLOPs of one training step (forward and backward) on a batch of b rows. */
function flopsPerStep(s: FitSession, b: number): number {
  const m = multiplyAddsPerRow(s.layout), first = s.layout.layers[0];
  return 2 * b * m + 2 * b * m + 2 * b * (m - first.inputs * first.units);
}

/** Step rate, target pass and their FLOP rates for one backend, on a session of the default fit. */
async function measureBackend(data: TransitionSet, backend: TfBackendName, steps: number): Promise<Record<string, number>> {
  const failure = await loadBackend(backend, wasmPath);
  if (failure) throw new Error(failure);
  const policy = createGaussianPolicy(tankTunedPolicy, 2);
  const s = createFitSession({ data, policy, discount: tankDiscount, quadratureNodes: QUADRATURE_NODES, seed: 1, settings, method: { ...defaultNetworkMethod, linearPartDegree: LINEAR_PART_DEGREE } });
  try {
    const n = s.rows.training.inputs.shape[0], rows = n * (1 + s.next.training.pointsPerState);
    hiddenFeatureRows(s.net.theta, s.layout, s.net.activation, s.rows.training.inputs, s.next.training).dispose(); // warm-up
    let t = performance.now();
    const features = hiddenFeatureRows(s.net.theta, s.layout, s.net.activation, s.rows.training.inputs, s.next.training);
    features.nextHidden.dataSync();
    const passSeconds = seconds(t);
    t = performance.now();
    const sums = lastLayerTotals(s.linear.training.tensors, features, s.linearTotal);
    const sumsSeconds = seconds(t);
    s.batches.setTargets(tf.tidy(() => tf.reshape(tf.slice(features.hidden, [0, 0], [-1, 1]), [-1]) as tf.Tensor1D));
    features.dispose();
    const guard = { lossLimit: Infinity, pace: createPacer(50), checkBackend: () => undefined };
    await trainSteps(s.net, s.batches, 20, guard); // warm-up: kernels compiled, buffers grown
    t = performance.now();
    await trainSteps(s.net, s.batches, steps, guard);
    const stepSeconds = seconds(t) / steps;
    return {
      [`${backend}StepsPerSecond`]: 1 / stepSeconds,
      [`${backend}TrainingGflops`]: flopsPerStep(s, s.batches.batchSize) / stepSeconds / 1e9,
      [`${backend}FeaturePassSeconds`]: passSeconds,
      [`${backend}FeaturePassRows`]: rows,
      [`${backend}FeaturePassGflops`]: featurePassFlop(s.layout, rows) / passSeconds / 1e9,
      [`${backend}LastLayerSumsSeconds`]: sumsSeconds,
      [`${backend}LastLayerSumsGflops`]: lastLayerSumsFlop(n, s.linearTotal.dim, sums.dim - s.linearTotal.dim) / sumsSeconds / 1e9,
      [`${backend}OuterIterationSeconds`]: passSeconds + sumsSeconds + settings.stepsPerIteration * stepSeconds,
    };
  } finally {
    s.dispose();
  }
}

/** The same step through TF.js autodiff and through the layers API, for the choice of training loop. */
async function measureAlternatives(steps: number): Promise<Record<string, number>> {
  await loadBackend('wasm', wasmPath);
  const b = settings.batchSize, x = tf.randomNormal([b, 3], 0, 1, 'float32', 1) as tf.Tensor2D, y = tf.randomNormal([b, 1], 0, 1, 'float32', 2) as tf.Tensor2D;
  const layout = networkLayout(3, settings.hiddenLayers);
  const theta = tf.variable(tf.randomNormal([layout.size], 0, 0.1, 'float32', 3) as tf.Tensor1D);
  const optimizer = tf.train.adam(settings.learningRate);
  const autodiff = () => tf.tidy(() => optimizer.minimize(() => tf.mean(tf.square(tf.sub(forwardPass(theta, layout, 'relu', x).output, y))) as tf.Scalar, true, [theta])!.dataSync());
  const model = tf.sequential({ layers: [...settings.hiddenLayers.map((units, i) => tf.layers.dense({ units, activation: 'relu', ...(i === 0 ? { inputShape: [3] } : {}) })), tf.layers.dense({ units: 1 })] });
  model.compile({ optimizer: tf.train.adam(settings.learningRate), loss: 'meanSquaredError' });
  const rate = async (step: () => unknown) => {
    for (let i = 0; i < 10; i++) await step();
    const t = performance.now();
    for (let i = 0; i < steps; i++) await step();
    return steps / seconds(t);
  };
  const result = { wasmAutodiffStepsPerSecond: await rate(autodiff), wasmLayersApiStepsPerSecond: await rate(() => model.trainOnBatch(x, y)) };
  tf.dispose([x, y, theta]);
  optimizer.dispose();
  model.dispose();
  return result;
}

/** The default fit end to end on wasm (stopping rule on, as in a project with default settings). */
async function measureFit(data: TransitionSet): Promise<Record<string, number | string>> {
  const policy = createGaussianPolicy(tankTunedPolicy, 2);
  const t = performance.now();
  const fit = await fitNetworkFqe({ data, policy, discount: tankDiscount, quadratureNodes: QUADRATURE_NODES, seed: 1, settings: { ...settings, backend: 'wasm' }, wasmPath });
  const fitSeconds = seconds(t);
  const result = {
    wasmFitSeconds: fitSeconds, wasmFitOuterIterations: fit.history.length, wasmFitStatus: fit.status, wasmFitSecondsPerIteration: fitSeconds / fit.history.length,
    wasmFitAdamStepsPerSecond: fit.work.adamSteps / fit.work.stepSeconds, wasmFitGflops: fit.work.flop / fit.work.seconds / 1e9,
  };
  fit.dispose();
  return result;
}

export async function runNetworkBench(): Promise<Record<string, number | string>> {
  const data = tankTransitions();
  const wasm = await measureBackend(data, 'wasm', 300);
  const cpu = await measureBackend(data, 'cpu', 20);
  const alternatives = await measureAlternatives(100);
  const fit = await measureFit(data);
  return {
    transitions: data.count, network: `${settings.hiddenLayers.join('-')} ${settings.activation}, batch ${settings.batchSize}`,
    ...wasm, ...cpu, ...alternatives, ...fit,
    // cpu end to end is too slow to run here; the same iterations at the measured cpu rates:
    cpuFitSecondsEstimated: (fit.wasmFitOuterIterations as number) * cpu.cpuOuterIterationSeconds,
    peakRssMiB: process.resourceUsage().maxRSS / 1024,
  };
}

if (process.argv[1] && fileURLToPath(import.meta.url) === process.argv[1]) {
  const figures = await runNetworkBench();
  for (const [key, value] of Object.entries(figures)) console.log(`${key.padEnd(34)} ${typeof value === 'number' ? value.toPrecision(4) : value}`);
}
