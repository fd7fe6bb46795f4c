/**
 * The batched Bellman targets of networkNextInputs.ts against a direct float64 computation:
 * r + γ(1 − done)·E_{a'~π} Q(s', a') with the expectation by expectUnderPolicy (actionQuadrature.ts,
 * one state at a time) over the same network evaluated row by row. A clipped policy makes the
 * number of quadrature points vary by state (point masses at the bounds), which exercises the padding.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import * as tf from '@tensorflow/tfjs';
import { expectUnderPolicy, quadratureNodesAt } from '../../../src/core/actionQuadrature';
import { fitStateActionStandardiser } from '../../../src/core/features/standardiser';
import { createNetworkActionValue } from '../../../src/core/fqe/networkActionValue';
import { bellmanTargets, createNextInputs, type NextInputs } from '../../../src/core/fqe/networkNextInputs';
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

describe('bellmanTargets', () => {
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

  it('equal r + γ(1 − done)·Σ w_j Q(s′, a′_j) computed state by state', () => {
    const { targets } = bellmanTargets(theta, layout, 'tanh', next, rows.training.base);
    const batched = targets.dataSync();
    targets.dispose();
    const q = createNetworkActionValue({ theta: tf.clone(theta), layout, activation: 'tanh', standardiser, output, backend: 'cpu', stateDim: 2, actionDim: 1 });
    const one = new Float64Array(3), value = new Float64Array(1);
    for (let i = 0; i < data.count; i++) {
      let expected = data.rewards[i];
      if (!terminal[i]) {
        const s = data.nextStates.subarray(2 * i, 2 * i + 2);
        const future = expectUnderPolicy(policy, s, (a) => {
          one.set(s);
          one[2] = a[0];
          q.evaluate(one, 1, value);
          return value[0];
        }, nodes).value;
        expected += discount * future;
      }
      // Float32 network and sums; values are of order |offset| ≈ 10, so 1e-4 absolute is rounding.
      expect(output.offset + output.scale * batched[i]).toBeCloseTo(expected, 4);
    }
    q.dispose();
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
    const t = bellmanTargets(theta, layout, 'relu', next, rows.training.base);
    t.targets.dispose();
    expect(tf.memory().numTensors).toBe(start + 1 + 2 * next.chunks.length + 2);
  });
});
