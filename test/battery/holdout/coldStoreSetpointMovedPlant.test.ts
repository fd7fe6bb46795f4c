/**
 * The hold-out cold store whose setpoint moved halfway through its log, gains kept
 * (coldStoreSetpointMovedPlant.ts), is what its doc comment says: each half's law rests where the heat
 * balance 0.02·(25 − T) = 1.8·u puts it (closed form); its log holds one gain and two offsets, which least
 * squares of the logged action on the temperature recovers half by half (ordinary least squares is unbiased
 * when the dither is independent of the state: common practice); and its reward is today's cost on every row.
 */
import { describe, expect, it } from 'vitest';
import type { RandomSource } from '../../../src/core/random';
import { SETPOINT_C, coldStoreDynamics } from './coldStoreRetunedPlant';
import { NUDGED_SETPOINT_C, OLD_SETPOINT_C, coldStoreSetpointMovedPlant, restTemperature } from './coldStoreSetpointMovedPlant';
import { loggedLawByRuns } from './loggedLawByRuns';

const quiet: RandomSource = { normal: () => 0, uniform: () => 0.5, integer: () => 0 };

describe('hold-out cold store whose setpoint moved halfway through the log, gains kept', () => {
  it('rests where the heat balance puts each half’s law: −21.929 °C (−22 set), −20.482 °C (−20.5 set), −20 °C today', () => {
    // T* = (0.5 − 1.8·0.5 + 1.8·0.3·sp)/(0.02 + 1.8·0.3), worked by hand: (−0.4 − 11.88)/0.56 and (−0.4 − 11.07)/0.56.
    for (const [setpoint, expected] of [[OLD_SETPOINT_C, -12.28 / 0.56], [NUDGED_SETPOINT_C, -11.47 / 0.56], [SETPOINT_C, SETPOINT_C]]) {
      const rest = restTemperature(0.5, 0.3, setpoint), u = 0.5 + 0.3 * (rest - setpoint), next = new Float64Array(2);
      expect(rest).toBeCloseTo(expected, 12);
      coldStoreDynamics.step(Float64Array.of(rest, 0), Float64Array.of(u), quiet, next);
      expect(next[0]).toBeCloseTo(rest, 12);
    }
  });

  it('logs one gain and two offsets, as least squares recovers them half by half, and today’s cost on every row', () => {
    const data = coldStoreSetpointMovedPlant().simulate({ transitions: 100_000, seed: 4 }), half = data.episodeCount / 2;
    const before = loggedLawByRuns(data, 0, half, SETPOINT_C), today = loggedLawByRuns(data, half, data.episodeCount, SETPOINT_C);
    // On T + 20: u = 0.5 + 0.3·(T + 22) = 1.1 + 0.3·(T + 20) before the move, 0.5 + 0.3·(T + 20) after (clipping is rare at ±0.3 K).
    expect(Math.abs(before.slope - 0.3)).toBeLessThan(0.01);
    expect(Math.abs(today.slope - 0.3)).toBeLessThan(0.01);
    expect(Math.abs(before.intercept - 1.1)).toBeLessThan(0.01);
    expect(Math.abs(today.intercept - 0.5)).toBeLessThan(0.01);
    expect(Math.abs(before.residualSd - 0.05)).toBeLessThan(0.003);
    // The first half sits near its rest point, ~1.93 K below today's setpoint, and pays today's cost for it.
    expect(Math.abs(before.meanState - restTemperature(0.5, 0.3, OLD_SETPOINT_C))).toBeLessThan(0.05);
    expect(Math.abs(today.meanState - SETPOINT_C)).toBeLessThan(0.05);
    for (const i of [0, data.count - 1]) {
      const t = data.states[2 * i], u = data.actions[i], next = new Float64Array(2);
      const cost = coldStoreDynamics.step(Float64Array.of(t, data.states[2 * i + 1]), Float64Array.of(u), quiet, next);
      expect(-data.rewards[i]).toBeCloseTo(cost, 12);
    }
  });
});
