/**
 * The hold-out dosing loop whose pump wears late (dosingPumpLateWearPlant.ts) is what its doc comment says: the
 * delivery is 2 per unit speed up to 60 % of the runs and then falls on a straight line to 1.6 at the last run;
 * at each delivery the residual rests where the chlorine balance puts it (closed form c* = g·(b + K)/(1 + g·K)
 * under u = b − K·(c − 1)), which the log's first half and last tenth show; and at small amplitude the END plant
 * under the logging controller costs what the discrete Lyapunov solution says (a linear plant; Bertsekas vol. I
 * §4.1, from memory).
 */
import { describe, expect, it } from 'vitest';
import { DELIVERY } from './dosingPumpWearPlant';
import { dosingPumpLateWearPlant, lateDeliveryAtRun } from './dosingPumpLateWearPlant';
import { dosingEndPlantCosts, restResidual } from './dosingEndCost';

describe('hold-out chlorine dosing whose pump holds for 60 % of the log and then wears 20 %', () => {
  it('delivers 2 up to 60 % of the runs, then falls on a straight line to 1.6 at the last run', () => {
    expect(lateDeliveryAtRun(0, 251)).toBe(DELIVERY.first);
    expect(lateDeliveryAtRun(150, 251)).toBe(DELIVERY.first); // the knee: 0.6 · 250
    expect(lateDeliveryAtRun(200, 251)).toBeCloseTo(1.8, 14); // half-way from the knee to the end
    expect(lateDeliveryAtRun(250, 251)).toBeCloseTo(DELIVERY.last, 14);
    expect(lateDeliveryAtRun(0, 1)).toBe(DELIVERY.last);
  });

  it('logs a flat residual through the first half and a sagged one in the last tenth, where the chlorine balance puts them', () => {
    const plant = dosingPumpLateWearPlant(), data = plant.simulate({ transitions: 100_000, seed: 3 }), runs = data.episodeCount, tenth = Math.floor(runs / 10);
    const meanOver = (from: number, to: number) => {
      let sum = 0, n = 0;
      for (let i = 0; i < data.count; i++) if (data.episode[i] >= from && data.episode[i] < to) { sum += data.states[2 * i]; n++; }
      return sum / n;
    };
    const first = meanOver(0, tenth), middle = meanOver(4 * tenth, 5 * tenth), last = meanOver(runs - tenth, runs);
    expect(Math.abs(first - restResidual(2))).toBeLessThan(0.01); // 1 mg/L: the new tube
    expect(Math.abs(middle - restResidual(2))).toBeLessThan(0.01); // no wear yet at 40–50 % of the runs
    let expected = 0;
    for (let e = runs - tenth; e < runs; e++) expected += restResidual(lateDeliveryAtRun(e, runs)) / tenth;
    expect(Math.abs(last - expected)).toBeLessThan(0.01);
    expect(first - last).toBeGreaterThan(0.06); // the late drift is there to be seen
  });

  it('at small amplitude, the end plant under the logging controller costs what the discrete Lyapunov solution says', () => {
    const { closed, run } = dosingEndPlantCosts(dosingPumpLateWearPlant(), 7);
    expect(Math.abs(run.value - closed)).toBeLessThan(4 * run.standardError + 0.01 * closed);
  });
});
