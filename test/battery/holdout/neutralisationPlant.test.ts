/**
 * The hold-out neutralisation tank (neutralisationPlant.ts) is what its doc comment says: the pH map
 * and its inverse agree; the map is steep at neutral (slope 1.2/0.01 = 120 pH per unit of base,
 * the derivative of asinh at 0 being 1) and flat far from it, as a titration curve of a strong acid
 * and base is (common practice); held at neutral with the valve at its bias and no noise the tank
 * stays put (mass balance); and the reagent valve is at its closed limit on a share of the log.
 */
import { describe, expect, it } from 'vitest';
import type { RandomSource } from '../../../src/core/random';
import { baseExcessOf, neutralisationDynamics, neutralisationPlant, phOf } from './neutralisationPlant';

const quiet: RandomSource = { normal: () => 0, uniform: () => 0.5, integer: () => 0 };

describe('hold-out neutralisation tank with a steep pH map and a clipped reagent valve', () => {
  it('maps base excess to pH and back, steeply at neutral and flatly far from it', () => {
    for (const ph of [2, 5.5, 7, 8.25, 12]) expect(phOf(baseExcessOf(ph))).toBeCloseTo(ph, 10);
    const h = 1e-7;
    expect((phOf(h) - phOf(-h)) / (2 * h)).toBeCloseTo(120, 3);
    expect((phOf(0.2 + h) - phOf(0.2 - h)) / (2 * h)).toBeLessThan(10);
  });

  it('holds neutral at the valve bias without noise (mass balance)', () => {
    const next = new Float64Array(2);
    const cost = neutralisationDynamics.step(Float64Array.of(7, 0), Float64Array.of(0.1), quiet, next);
    expect(next[0]).toBeCloseTo(7, 12);
    expect(next[1]).toBe(0);
    expect(cost).toBeCloseTo(0.05, 12); // reagent only: 0.5·0.1
  });

  it('logs the valve at a limit on a share of the rows, the same for the same seed', () => {
    const plant = neutralisationPlant(), data = plant.simulate({ transitions: 20_000, seed: 2 });
    const atLimit = data.actions.filter((u) => u <= 0 || u >= 1).length / data.count;
    expect(atLimit).toBeGreaterThan(0.01);
    expect(plant.simulate({ transitions: 20_000, seed: 2 }).states).toEqual(data.states);
  });
});
