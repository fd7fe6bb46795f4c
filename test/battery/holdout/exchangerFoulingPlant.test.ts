/**
 * The hold-out exchanger whose tubes foul (exchangerFoulingPlant.ts) is what its doc comment says: the steam
 * gain 40 °C at the first run and 32 °C at the last, on a straight line; under the logging law the outlet rests
 * where the heat balance puts it (closed form T* = (50 + g·(0.75 + 0.05·80))/(1 + 0.05·g): 80 °C clean,
 * 77.69 °C fouled), which the log's first and last runs show; the clean plant is exchangerPlant.ts's to the
 * last bit; and at small amplitude the END plant under the logging law costs what the discrete Lyapunov
 * solution says (a linear plant; Bertsekas, "Dynamic Programming and Optimal Control", vol. I, §4.1).
 */
import { describe, expect, it } from 'vitest';
import { feedbackCostToGo } from '../../../src/core/lq';
import { createRandom, type RandomSource } from '../../../src/core/random';
import { SETPOINT_C, exchangerDynamics, exchangerDynamicsAt } from './exchangerPlant';
import { STEAM_GAIN, exchangerFoulingPlant, steamGainAtRun } from './exchangerFoulingPlant';
import { smallAmplitudeQuadraticValue } from './smallAmplitude';

const quiet: RandomSource = { normal: () => 0, uniform: () => 0.5, integer: () => 0 };
const restOutlet = (g: number) => (50 + g * (0.75 + 0.05 * SETPOINT_C)) / (1 + 0.05 * g);

describe('hold-out steam exchanger whose tubes foul through the log', () => {
  it('loses 20 % of its steam gain on a straight line from the first run to the last', () => {
    expect(steamGainAtRun(0, 250)).toBe(40);
    expect(steamGainAtRun(249, 250)).toBeCloseTo(32, 13);
    expect(steamGainAtRun(124.5, 250)).toBeCloseTo(36, 13);
  });

  it('rests where the heat balance puts it under the logging law, clean and fouled', () => {
    expect(restOutlet(STEAM_GAIN.first)).toBeCloseTo(80, 12);
    for (const g of [STEAM_GAIN.first, STEAM_GAIN.last]) {
      const t = restOutlet(g), next = new Float64Array(2);
      exchangerDynamicsAt(g).step(Float64Array.of(t, 0), Float64Array.of(0.75 + 0.05 * (SETPOINT_C - t)), quiet, next);
      expect(next[0]).toBeCloseTo(t, 12);
    }
  });

  it('is exchangerPlant.ts\'s exchanger, draw for draw, with clean tubes', () => {
    const a = createRandom(3), b = createRandom(3), s = Float64Array.of(78, 0.4), u = Float64Array.of(0.6), x = new Float64Array(2), y = new Float64Array(2);
    expect(exchangerDynamicsAt(40).step(s, u, a, x)).toBe(exchangerDynamics.step(s, u, b, y));
    expect(x).toEqual(y);
  });

  it('logs an outlet that sags as the tubes foul: the first and last tenths sit at the heat balance\'s rest', () => {
    const plant = exchangerFoulingPlant(), data = plant.simulate({ transitions: 100_000, seed: 3 }), runs = data.episodeCount, tenth = Math.floor(runs / 10);
    const meanOver = (from: number, to: number) => {
      let sum = 0, n = 0, expected = 0;
      for (let i = 0; i < data.count; i++) if (data.episode[i] >= from && data.episode[i] < to) { sum += data.states[2 * i]; n++; expected += restOutlet(steamGainAtRun(data.episode[i], runs)); }
      return { logged: sum / n, expected: expected / n };
    };
    const first = meanOver(0, tenth), last = meanOver(runs - tenth, runs);
    // The valve clips at 0 and 1 and the dither is 0.1: the logged mean sits within 0.1 °C of the unclipped rest.
    expect(Math.abs(first.logged - first.expected)).toBeLessThan(0.1);
    expect(Math.abs(last.logged - last.expected)).toBeLessThan(0.1);
    expect(first.expected - last.expected).toBeGreaterThan(2);
  });

  it('at small amplitude, the END plant under the logging law costs what the discrete Lyapunov solution says', () => {
    const plant = exchangerFoulingPlant(), g = STEAM_GAIN.last, rest = restOutlet(g), restAction = 0.75 + 0.05 * (SETPOINT_C - rest);
    // State (T, d): T′ = 0.8·T + 0.2·d + 0.2·g·valve, d′ = 0.9·d; law valve = valve* − 0.05·(T − T*): u = −F·x with F = (0.05, 0).
    // Below 80 °C the cost's quadratic part about T* is (T − T*)² (weight 1).
    const closed = feedbackCostToGo({
      stateDim: 2, actionDim: 1, dynamics: Float64Array.of(0.8, 0.2, 0, 0.9), inputGain: Float64Array.of(0.2 * g, 0),
      processNoiseCovariance: Float64Array.of(0.3 ** 2, 0, 0, 0.5 ** 2), stateWeight: Float64Array.of(1, 0, 0, 0), actionWeight: Float64Array.of(0),
    }, { feedbackGain: Float64Array.of(0.05, 0), bias: Float64Array.of(0), noiseCovariance: Float64Array.of(0.1 ** 2) }, plant.discount);
    const run = smallAmplitudeQuadraticValue({
      dynamics: plant.dynamics, rest: [rest, 0], restAction, gain: [-0.05, 0], std: 0.1,
      weights: [1, 0], discount: plant.discount, scale: 0.01, rollouts: 3000, seed: 5,
    });
    expect(Math.abs(run.value - closed.constant)).toBeLessThan(4 * run.standardError + 0.01 * closed.constant);
  });
});
