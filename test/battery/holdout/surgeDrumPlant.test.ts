/**
 * The hold-out surge drum (surgeDrumPlant.ts) is what its doc comment says: held at the normal level
 * with the feed at nominal and the valve at 0.5 it stays put (mass balance); upsets arrive at the
 * stated rate (binomial standard error); their sizes have Student's t tails with 3 degrees of
 * freedom — the two-sided 5 % point of t₃ is 3.182 (t tables, e.g. Abramowitz & Stegun Table 26.10;
 * value from memory), against 0.15 % beyond it for a normal law — and in the log a few runs carry most
 * of the cost, which is what makes the plant worth having.
 */
import { describe, expect, it } from 'vitest';
import { createRandom, type RandomSource } from '../../../src/core/random';
import { UPSET_LIMIT, UPSET_RATE, feedUpset, studentT3, surgeDrumDynamics, surgeDrumPlant } from './surgeDrumPlant';

const quiet: RandomSource = { normal: () => 0, uniform: () => 0.5, integer: () => 0 };

describe('hold-out surge drum with rare, heavy-tailed feed upsets', () => {
  it('holds the normal level with the valve at 0.5 and no upset (mass balance)', () => {
    const next = new Float64Array(2);
    const cost = surgeDrumDynamics.step(Float64Array.of(0, 0), Float64Array.of(0.5), quiet, next);
    expect(Array.from(next)).toEqual([0, 0]);
    expect(cost).toBe(0);
  });

  it('draws t₃ sizes with 5 % beyond ±3.182, and upsets at the stated rate within their limit', () => {
    const rng = createRandom(11), n = 200_000;
    let beyond = 0;
    for (let i = 0; i < n; i++) if (Math.abs(studentT3(rng)) > 3.182) beyond++;
    expect(Math.abs(beyond / n - 0.05)).toBeLessThan(4 * Math.sqrt((0.05 * 0.95) / n));
    let upsets = 0, largest = 0;
    for (let i = 0; i < 1_000_000; i++) {
      const j = feedUpset(rng);
      if (j !== 0) upsets++;
      largest = Math.max(largest, Math.abs(j));
    }
    expect(Math.abs(upsets / 1e6 - UPSET_RATE)).toBeLessThan(4 * Math.sqrt((UPSET_RATE * (1 - UPSET_RATE)) / 1e6));
    expect(largest).toBeLessThanOrEqual(UPSET_LIMIT);
  });

  it('logs runs of which the costliest tenth carry more than half of the cost, the same for the same seed', () => {
    const plant = surgeDrumPlant(), data = plant.simulate({ transitions: 100_000, seed: 2 });
    const runCost = new Float64Array(data.episodeCount);
    for (let i = 0; i < data.count; i++) runCost[data.episode[i]] -= data.rewards[i];
    const sorted = Array.from(runCost).sort((a, b) => b - a), total = sorted.reduce((a, b) => a + b, 0);
    const top = sorted.slice(0, Math.ceil(sorted.length / 10)).reduce((a, b) => a + b, 0);
    expect(top / total).toBeGreaterThan(0.5);
    expect(plant.simulate({ transitions: 100_000, seed: 2 }).states).toEqual(data.states);
  });
});
