/**
 * The hold-out product heater with a dead time (pipeHeaterPlant.ts) is what its doc comment says.
 * Outside sources: the steady-state heat balance worked by hand (20 + 50·0.8 = 60 °C); a valve step
 * worked by hand through first order plus dead time (common practice for transport delay): nothing
 * for 4 steps, then a fifth of the remaining gap per step towards the new balance; and the noise-free
 * closed loop of the 'firmer' candidate, x_{t+1} = 0.8·x_t − 0.2·50·0.04·x_{t−4}, whose characteristic
 * polynomial z⁵ − 0.8·z⁴ + 0.4 has its largest root at modulus 0.98193 (period 14.2 steps), computed
 * with numpy.roots outside the project, so its swing shrinks by 0.98193¹⁰⁰ = 0.1615 per 100 steps.
 */
import { describe, expect, it } from 'vitest';
import { createGaussianPolicy, policyMean } from '../../../src/core/policy';
import type { RandomSource } from '../../../src/core/random';
import { DEAD_TIME_STEPS, pipeHeaterDynamics, pipeHeaterPlant } from './pipeHeaterPlant';

const quiet: RandomSource = { normal: () => 0, uniform: () => 0.5, integer: () => 0 };
const held = () => Float64Array.of(60, 0, ...Array<number>(DEAD_TIME_STEPS).fill(0.8));

describe('hold-out product heater with a dead time from the valve to the outlet thermometer', () => {
  it('holds 60 °C with the valve at 0.8 and no inlet deviation, paying only for steam', () => {
    const next = new Float64Array(6);
    const cost = pipeHeaterDynamics.step(held(), Float64Array.of(0.8), quiet, next);
    expect(next[0]).toBeCloseTo(60, 12);
    expect(Array.from(next.subarray(2))).toEqual([0.8, 0.8, 0.8, 0.8]);
    expect(cost).toBeCloseTo(0.8, 12);
  });

  it('shows a valve step from 0.8 to 0.9 only after 4 steps of pipe, then a fifth of the gap per step', () => {
    let s = held();
    const next = new Float64Array(6), outlet: number[] = [];
    for (let t = 0; t < 7; t++) {
      pipeHeaterDynamics.step(s, Float64Array.of(0.9), quiet, next);
      s = Float64Array.from(next);
      outlet.push(s[0]);
    }
    for (let t = 0; t < 4; t++) expect(outlet[t]).toBeCloseTo(60, 12); // T₁ … T₄
    expect(outlet[4]).toBeCloseTo(61, 12); // 60 + 0.2·(65 − 60)
    expect(outlet[5]).toBeCloseTo(61.8, 12); // 61 + 0.2·(65 − 61)
    expect(outlet[6]).toBeCloseTo(62.44, 12); // towards 20 + 50·0.9 = 65 °C
  });

  it("swings after an upset under 'firmer' with the decay of its characteristic root (numpy.roots: 0.98193)", () => {
    const firmer = pipeHeaterPlant().candidates.find((c) => c.name === 'firmer')!.spec;
    const policy = createGaussianPolicy(firmer, 6);
    let s = held();
    s[0] = 61;
    const next = new Float64Array(6), a = new Float64Array(1), deviation: number[] = [];
    for (let t = 0; t < 400; t++) {
      policyMean(policy, s, a);
      pipeHeaterDynamics.step(s, a, quiet, next);
      s = Float64Array.from(next);
      deviation.push(s[0] - 60);
    }
    const rms = (from: number) => Math.sqrt(deviation.slice(from, from + 100).reduce((t, x) => t + x * x, 0) / 100);
    expect(rms(300) / rms(200)).toBeCloseTo(0.1615, 2);
  });

  it('logs a valve that never holds the memory of the pipe in the measured states, the same for the same seed', () => {
    const plant = pipeHeaterPlant(), data = plant.simulate({ transitions: 20_000, seed: 2 });
    expect(plant.stateNames.slice(2)).toHaveLength(DEAD_TIME_STEPS);
    for (let i = 1; i < data.count; i++) {
      if (data.episode[i] !== data.episode[i - 1]) continue;
      expect(data.states[i * 6 + 2]).toBe(data.actions[i - 1]); // the valve one step ago is the logged action
    }
    expect(plant.simulate({ transitions: 20_000, seed: 2 }).states).toEqual(data.states);
  });
});
