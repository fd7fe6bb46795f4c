/**
 * The hold-out blending tank (blendingTankPlant.ts), the first plant with two actions, is what its
 * doc comment says. Outside sources: the steady-state mass and energy balances of a well-mixed tank
 * worked by hand (common practice): with both valves held, inflow equals outflow, 0.1·(u_h + u_c) =
 * 0.1·√h, so h* = (u_h + u_c)², and the heat in equals the heat out, u_h·(70 − T) + u_c·(10 − T) = 0,
 * so T* = (70·u_h + 10·u_c)/(u_h + u_c), the flow-weighted mean of the supply temperatures.
 * The 'warmer' candidate's closed loop settles where T* = 10 + 60·u_h with u_h = 0.4 − 0.02·(T* − 22)
 * (its total flow is 1 at h = 1, so the level stays at 1): T* = 22 + 12/2.2 = 27.4545… °C.
 */
import { describe, expect, it } from 'vitest';
import { createGaussianPolicy, sampleAction } from '../../../src/core/policy';
import type { RandomSource } from '../../../src/core/random';
import { blendingTankDynamics, blendingTankPlant } from './blendingTankPlant';

const quiet: RandomSource = { normal: () => 0, uniform: () => 0.5, integer: () => 0 };

/** Noise-free steps from (T, h), with the valves either held or set by a policy's mean (no dither). */
function settle(start: [number, number], valves: (s: Float64Array, a: Float64Array) => void, steps = 3000) {
  const s = Float64Array.from(start), a = new Float64Array(2), next = new Float64Array(2);
  for (let t = 0; t < steps; t++) {
    valves(s, a);
    blendingTankDynamics.step(s, a, quiet, next);
    s.set(next);
  }
  return s;
}

describe('hold-out blending tank with a hot and a cold valve (two actions)', () => {
  it('holds 22 °C and 1 m with the hot valve at 0.2 and the cold at 0.8, paying only for heating', () => {
    const next = new Float64Array(2);
    const cost = blendingTankDynamics.step(Float64Array.of(22, 1), Float64Array.of(0.2, 0.8), quiet, next);
    expect(next[0]).toBeCloseTo(22, 12); // 0.2·48 = 0.8·12
    expect(next[1]).toBeCloseTo(1, 12); // 0.1·(0.2 + 0.8) = 0.1·√1
    expect(cost).toBeCloseTo(0.4 * 0.2, 12);
  });

  it('settles with held valves at the hand-worked balance h* = (u_h + u_c)², T* = flow-weighted supply temperature', () => {
    const s = settle([40, 1.5], (_, a) => { a[0] = 0.3; a[1] = 0.5; });
    expect(s[1]).toBeCloseTo(0.64, 8);
    expect(s[0]).toBeCloseTo((70 * 0.3 + 10 * 0.5) / 0.8, 8); // 32.5 °C
  });

  it("settles under the 'warmer' candidate's mean at 22 + 12/2.2 °C and 1 m (hand-worked)", () => {
    const warmer = createGaussianPolicy(blendingTankPlant().candidates.find((c) => c.name === 'warmer')!.spec, 2);
    const s = settle([22, 1], (state, a) => sampleAction(warmer, state, quiet, a));
    expect(s[0]).toBeCloseTo(22 + 12 / 2.2, 6);
    expect(s[1]).toBeCloseTo(1, 6);
  });

  it('logs both valves at their limits on a share of the rows (hot shut, cold fully open), the same for the same seed', () => {
    const plant = blendingTankPlant(), data = plant.simulate({ transitions: 40_000, seed: 3 });
    expect(plant.actionDim).toBe(2);
    let hotShut = 0, coldOpen = 0;
    for (let i = 0; i < data.count; i++) {
      const hot = data.actions[2 * i], cold = data.actions[2 * i + 1];
      expect(hot).toBeGreaterThanOrEqual(0);
      expect(cold).toBeLessThanOrEqual(1);
      if (hot === 0) hotShut++;
      if (cold === 1) coldOpen++;
    }
    expect(hotShut / data.count).toBeGreaterThan(0.005);
    expect(coldOpen / data.count).toBeGreaterThan(0.005);
    expect(plant.simulate({ transitions: 40_000, seed: 3 }).actions).toEqual(data.actions);
  });
});
