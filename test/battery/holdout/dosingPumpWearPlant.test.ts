/**
 * The hold-out dosing loop whose pump wears (dosingPumpWearPlant.ts) is what its doc comment says: the pump
 * delivers 2 per unit speed at the first run and 1.6 at the last, on a straight line; at each delivery the
 * residual rests where the chlorine balance puts it (closed form: c* = g·(b + K)/(1 + g·K) under
 * u = b − K·(c − 1)), which the log's first and last runs show; and at small amplitude the END plant under the
 * logging controller costs what the discrete Lyapunov solution says (a linear plant; Bertsekas vol. I §4.1).
 */
import { describe, expect, it } from 'vitest';
import type { RandomSource } from '../../../src/core/random';
import { DELIVERY, TARGET_MG_L, deliveryAtRun, dosingDynamics, dosingPumpWearPlant } from './dosingPumpWearPlant';
import { dosingEndPlantCosts, restResidual } from './dosingEndCost';

const quiet: RandomSource = { normal: () => 0, uniform: () => 0.5, integer: () => 0 };

describe('hold-out chlorine dosing whose pump delivers 20 % less by the end of the log', () => {
  it('rests at 1 mg/L with u = 1/g, for the new tube and the worn one', () => {
    for (const g of [DELIVERY.first, DELIVERY.last]) {
      const next = new Float64Array(2);
      dosingDynamics(g).step(Float64Array.of(TARGET_MG_L, 0), Float64Array.of(1 / g), quiet, next);
      expect(next[0]).toBeCloseTo(TARGET_MG_L, 14);
    }
  });

  it('delivers 2 at the first run and 1.6 at the last, on a straight line', () => {
    expect(deliveryAtRun(0, 250)).toBe(2);
    expect(deliveryAtRun(249, 250)).toBeCloseTo(1.6, 14);
    expect(deliveryAtRun(124.5, 250)).toBeCloseTo(1.8, 14);
  });

  it('logs a residual that sags as the tube wears: the first and last runs sit where the chlorine balance puts them', () => {
    const plant = dosingPumpWearPlant(), data = plant.simulate({ transitions: 100_000, seed: 3 }), runs = data.episodeCount, tenth = Math.floor(runs / 10);
    const meanOver = (from: number, to: number) => {
      let sum = 0, n = 0, expected = 0;
      for (let i = 0; i < data.count; i++) if (data.episode[i] >= from && data.episode[i] < to) { sum += data.states[2 * i]; n++; expected += restResidual(deliveryAtRun(data.episode[i], runs)); }
      return { logged: sum / n, expected: expected / n };
    };
    const first = meanOver(0, tenth), last = meanOver(runs - tenth, runs);
    expect(Math.abs(first.logged - first.expected)).toBeLessThan(0.01);
    expect(Math.abs(last.logged - last.expected)).toBeLessThan(0.01);
    expect(first.expected - last.expected).toBeGreaterThan(0.09); // 0.995 against 0.896: the drift is there to be seen
  });

  it('at small amplitude, the end plant under the logging controller costs what the discrete Lyapunov solution says', () => {
    const { closed, run } = dosingEndPlantCosts(dosingPumpWearPlant(), 5);
    expect(Math.abs(run.value - closed)).toBeLessThan(4 * run.standardError + 0.01 * closed);
  });
});
