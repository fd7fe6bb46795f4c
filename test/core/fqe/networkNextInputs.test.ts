/**
 * The batched next-state averages of the hidden features (networkNextInputs.ts and
 * networkHiddenFeatures.ts) against a direct float64 computation: γ(1 − done)·E_{a'~π} h_j(s', a')
 * for each hidden unit j, with the expectation by expectUnderPolicy (actionQuadrature.ts, one state
 * at a time) over the same network evaluated row by row. A clipped policy makes the number of
 * quadrature points vary by state (point masses at the bounds), which exercises the padding.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import * as tf from '@tensorflow/tfjs';
import { expectUnderPolicy, quadratureNodesAt } from '../../../src/core/actionQuadrature';
import { fitStateActionStandardiser } from '../../../src/core/features/standardiser';
import { hiddenFeatures } from '../../../src/core/fqe/networkForward';
import { hiddenFeatureRows } from '../../../src/core/fqe/networkHiddenFeatures';
import { createNextInputs, type NextInputs } from '../../../src/core/fqe/networkNextInputs';
import { standardiseInto } from '../../../src/core/fqe/networkTrainingSet';
import { outputScaleOf } from '../../../src/core/fqe/networkOutputScale';
import { networkLayout } from '../../../src/core/fqe/networkParameters';
import { createTrainingSet, type NetworkTrainingSet } from '../../../src/core/fqe/networkTrainingSet';
import { splitEpisodes } from '../../../src/core/fqe/networkEpisodeSplit';
import { FqeOptionsError } from '../../../src/core/fqe/fqeErrors';
import { createGaussianPolicy } from '../../../src/core/policy';
import { createRandom } from '../../../src/core/random';
import type { TransitionSet } from '../../../src/core/transitions';
import { simulateTankLevels } from '../../../sample-projects/tank-levels/simulate';
import { tankLogTransitions } from './simulatedTransitions';

const logged = tankLogTransitions(simulateTankLevels({ runs: 4, stepsPerRun: 26, seed: 9 }).rows, 104);
// Transition 7 ends its episode early; its s' is unknown (NaN) and must not be bootstrapped from.
const terminal = logged.terminal.slice();
terminal[7] = 1;
const nextStates = logged.nextStates.slice();
nextStates[14] = nextStates[15] = NaN;
const data: TransitionSet = { ...logged, terminal, nextStates };
// Valve limits 30–47 % around the 45 % setpoint: most states put mass on the upper bound, some on neither, some on both.
const policy = createGaussianPolicy({ offset: [189], gain: [[-60, -90]], std: [1.5], bounds: { lo: [30], hi: [47], mode: 'clip' } }, 2);
const discount = 0.9, nodes = 4;

const spec = fitStateActionStandardiser(data).spec;
const standardiser = { mean: Float64Array.from(spec.mean), scale: Float64Array.from(spec.scale) };
const output = outputScaleOf(data.rewards, discount);
const layout = networkLayout(3, [8]);

describe('next-state averages of the hidden features', () => {
  let start: number, rows: NetworkTrainingSet, next: NextInputs, theta: tf.Tensor1D;

  beforeAll(async () => {
    await tf.setBackend('cpu');
    start = tf.memory().numTensors;
    rows = createTrainingSet(data, splitEpisodes(data, 0, createRandom(1)), standardiser, output, discount);
    next = createNextInputs(data, rows.training.transitions, policy, nodes, standardiser, discount);
    theta = tf.randomNormal([layout.size], 0, 0.5, 'float32', 21) as tf.Tensor1D;
  });

  afterAll(() => {
    tf.dispose(theta);
    next.dispose();
    rows.dispose();
    expect(tf.memory().numTensors).toBe(start);
  });

  it('equal γ(1 − done)·Σ w_j h(s′, a′_j) computed state by state', () => {
    const features = hiddenFeatureRows(theta, layout, 'tanh', rows.training.inputs, next);
    const batched = features.nextHidden.dataSync(), units = features.nextHidden.shape[1];
    features.dispose();
    const z = new Float32Array(3), hiddenAt = (s: ArrayLike<number>, a: number): Float32Array => {
      standardiseInto(s, 0, 0, 2, standardiser, z, 0);
      standardiseInto([a], 0, 2, 1, standardiser, z, 2);
      const h = tf.tidy(() => hiddenFeatures(theta, layout, 'tanh', tf.tensor2d(z, [1, 3])));
      const values = h.dataSync() as Float32Array;
      h.dispose();
      return values;
    };
    for (let i = 0; i < data.count; i++) {
      const row = rows.training.transitions.indexOf(i);
      for (let j = 0; j < units; j++) {
        let expected = 0;
        if (!terminal[i]) {
          const s = data.nextStates.subarray(2 * i, 2 * i + 2);
          expected = discount * expectUnderPolicy(policy, s, (a) => hiddenAt(s, a[0])[j], nodes).value;
        }
        // Float32 network and sums of K ≤ 6 terms of size ≤ 1: 1e-5 absolute is rounding.
        expect(batched[row * units + j]).toBeCloseTo(expected, 5);
      }
    }
  });

  it('pads every state to the largest rule size (clipped rules add point masses at the bounds)', () => {
    expect(next.pointsPerState).toBe(nodes + 2);
    const counts = new Set<number>();
    for (let i = 0; i < data.count; i++) if (!terminal[i]) counts.add(quadratureNodesAt(policy, data.nextStates.subarray(2 * i, 2 * i + 2), nodes).count);
    expect(counts.size).toBeGreaterThan(1); // some states really have shorter rules, so padding is exercised
    expect(next.chunks.reduce((sum, c) => sum + c.states, 0)).toBe(data.count);
  });

  it('refuses a next-input matrix beyond its memory budget, naming quadratureNodes', () => {
    const threeActions = createGaussianPolicy({ offset: [0, 0, 0], gain: [[0, 0], [0, 0], [0, 0]], std: [1, 1, 1] }, 2);
    const wide: TransitionSet = { ...data, count: 400_000, actionDim: 3 };
    expect(() => createNextInputs(wide, new Int32Array(0), threeActions, 20, standardiser, discount)).toThrow(FqeOptionsError);
    expect(() => createNextInputs(wide, new Int32Array(0), threeActions, 20, standardiser, discount)).toThrow(/quadratureNodes: 20 nodes per action dimension give 8000 points/);
  });

  it('keeps only its result: θ, the chunks (inputs, weights) and the rows (inputs, base) remain', () => {
    hiddenFeatureRows(theta, layout, 'relu', rows.training.inputs, next).dispose();
    expect(tf.memory().numTensors).toBe(start + 1 + 2 * next.chunks.length + 2);
  });
});
