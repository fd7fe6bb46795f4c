/**
 * The hold-out level loop with a backlashed inlet valve (backlashLevelPlant.ts) is what its doc
 * comment says: the stem follows the play (backlash) operator — it stays put while the command moves
 * within the dead band and is dragged at the band's edge, so a sweep up and back down traces a loop
 * 2h wide (Krasnosel'skii & Pokrovskii, Systems with Hysteresis, 1989, the play operator; from
 * memory) and the same command gives different flows; with the stem held the level is an AR(1)
 * process, whose discounted quadratic cost has a closed form (stationary variance σ²/(1 − φ²) and
 * E[x_t²] = φ^{2t}x₀² + σ²(1 − φ^{2t})/(1 − φ²): common practice), which the rollout truth
 * reproduces within its standard error; and the log holds both kinds of row, stem held and stem moved.
 */
import { describe, expect, it } from 'vitest';
import type { RandomSource } from '../../../src/core/random';
import { rolloutTruth } from '../rolloutTruth';
import { BACKLASH_HALF_BAND, backlashLevelDynamics, backlashLevelPlant, stemAfter } from './backlashLevelPlant';

const quiet: RandomSource = { normal: () => 0, uniform: () => 0.5, integer: () => 0 };

describe('hold-out level loop with a backlashed inlet valve', () => {
  it('holds the normal level with the stem and the command at 0.5, at no cost', () => {
    const next = new Float64Array(2);
    const cost = backlashLevelDynamics.step(Float64Array.of(0, 0.5), Float64Array.of(0.5), quiet, next);
    expect(Array.from(next)).toEqual([0, 0.5]);
    expect(cost).toBe(0);
  });

  it('moves the stem as a play operator: the same command, different flows; a sweep traces a loop 2h wide', () => {
    const h = BACKLASH_HALF_BAND, a = new Float64Array(2), b = new Float64Array(2);
    backlashLevelDynamics.step(Float64Array.of(0, 0.47), Float64Array.of(0.5), quiet, a);
    backlashLevelDynamics.step(Float64Array.of(0, 0.53), Float64Array.of(0.5), quiet, b);
    expect(a[1]).toBe(0.47); // within the band: the stem stays
    expect(b[1]).toBe(0.53);
    expect(b[0] - a[0]).toBeCloseTo(0.3 * 0.06, 12); // same command, different flow into the tank
    // Sweep the command 0.2 → 0.8 → 0.2: going up the stem trails by h, coming down it leads by h.
    let stem = 0.2;
    const up: number[] = [], down: number[] = [];
    for (let k = 0; k <= 60; k++) up.push((stem = stemAfter(stem, 0.2 + 0.01 * k)));
    for (let k = 60; k >= 0; k--) down.push((stem = stemAfter(stem, 0.2 + 0.01 * k)));
    expect(up[30]).toBeCloseTo(0.5 - h, 12);
    expect(down[30]).toBeCloseTo(0.5 + h, 12);
    expect(stemAfter(0.99, 1.2)).toBe(1); // held within the valve's travel
  });

  it('with the stem held (command 0.5, no dither), the rollout truth equals the closed form of the AR(1) level', () => {
    const gamma = 0.96, phi2 = 0.81, s2 = 0.02 ** 2, x0 = 0.1;
    const exact = -10 * (x0 * x0 / (1 - gamma * phi2) + (s2 / (1 - phi2)) * (1 / (1 - gamma) - 1 / (1 - gamma * phi2)));
    const held = { offset: [0.5], gain: [[0, 0]], std: [1e-12] };
    const truth = rolloutTruth(backlashLevelDynamics, held, gamma, { name: 'one', description: '', states: Float64Array.of(x0, 0.5), count: 1 }, { rolloutsPerStart: 4000, seed: 5 });
    expect(Math.abs(truth.value - exact)).toBeLessThan(4 * truth.standardError);
    expect(truth.standardError).toBeLessThan(0.01 * Math.abs(exact));
  });

  it('logs rows where the dither leaves the stem still and rows where it moves it, the same for the same seed', () => {
    const plant = backlashLevelPlant(), data = plant.simulate({ transitions: 20_000, seed: 2 });
    let still = 0;
    for (let i = 0; i < data.count; i++) if (data.nextStates[i * 2 + 1] === data.states[i * 2 + 1]) still++;
    expect(still / data.count).toBeGreaterThan(0.2);
    expect(still / data.count).toBeLessThan(0.8);
    expect(plant.simulate({ transitions: 20_000, seed: 2 }).states).toEqual(data.states);
  });
});
