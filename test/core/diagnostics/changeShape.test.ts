/**
 * Where a per-run series changed, and whether as a step or a drift (src/core/diagnostics/changeShape.ts),
 * against outside facts: a small table's split and line computed by hand, noiseless steps and lines
 * (classified and located exactly), the closed-form share a straight line leaves to the best step, and the
 * run-order check on logs built with a retune or a drift, a few wild runs among them.
 */
import { describe, expect, it } from 'vitest';
import { bestStep, changeShape, lineFit } from '../../../src/core/diagnostics/changeShape';
import { averageRanks, runOrderTrends, type RunOrderData } from '../../../src/core/diagnostics/runOrder';
import { shownTrends } from '../../../src/core/diagnostics/runOrderFinding';
import { createRandom } from '../../../src/core/random';

const positions = (n: number) => Array.from({ length: n }, (_, i) => i);

describe('the single step and the line on a small table (by hand)', () => {
  const y = [1, 2, 1, 6, 7, 6];

  it('the best split leaves (1, 2, 1) | (6, 7, 6): RSS = 2/3 + 2/3', () => {
    // By hand, RSS(k) for k = 1…5: 29.2, 22.5, 4/3, 17.5, 33.2 — the least at k = 3.
    const step = bestStep(y);
    expect(step.after).toBe(3);
    expect(step.rss).toBeCloseTo(4 / 3, 12);
  });

  it('the line on x = 0…5: slope Sxy/Sxx = 22.5/17.5 = 9/7, RSS = SST − Sxy²/Sxx = 233/6 − 405/14 = 208/21', () => {
    const line = lineFit(positions(6), y);
    expect(line.slope).toBeCloseTo(9 / 7, 12);
    expect(line.intercept).toBeCloseTo(23 / 6 - (9 / 7) * 2.5, 12);
    expect(line.rss).toBeCloseTo(208 / 21, 12);
    expect(changeShape(positions(6), y)).toMatchObject({ kind: 'step', after: 3 });
  });
});

describe('noiseless series', () => {
  it('a step at any split is a step, located exactly', () => {
    const n = 20;
    for (let after = 1; after < n; after++) {
      const y = positions(n).map((i) => (i < after ? 0.12 : 0.3));
      expect(changeShape(positions(n), y)).toMatchObject({ kind: 'step', after });
      // Ranks of a noiseless step are a step too (ties take their average rank): the same answer.
      expect(changeShape(positions(n), averageRanks(y))).toMatchObject({ kind: 'step', after });
    }
  });

  it('a straight line is a drift, rising or falling, at even or uneven run positions', () => {
    const x = [0, 1, 2, 4, 7, 8, 9, 13, 14, 20];
    for (const slope of [0.7, -0.02]) {
      const shape = changeShape(x, x.map((v) => 2 + slope * v));
      expect(shape?.kind).toBe('drift');
      expect(shape?.lineRss).toBeLessThan(1e-20);
    }
  });

  it('a straight line of n equally spaced values leaves the best step ((n/2)² − 1)/(n² − 1) of its sum of squares (closed form: each half of a discrete uniform)', () => {
    // Var of 1…h is (h² − 1)/12; two halves of h = n/2 against the whole: 2·h·(h² − 1)/12 ÷ n·(n² − 1)/12.
    for (const n of [10, 20, 250]) {
      const y = positions(n), sst = (n * (n * n - 1)) / 12;
      const step = bestStep(y);
      expect(step.after).toBe(n / 2);
      expect(step.rss / sst).toBeCloseTo(((n / 2) ** 2 - 1) / (n * n - 1), 12);
    }
  });

  it('too short a series has no shape', () => {
    expect(changeShape([0, 1], [1, 2])).toBeNull();
  });
});

/** x' = 0.8·x + b·u + w under u = −k·x + dither; `run(r)` sets (k, b); runs listed in `wild` get a gain of 1.5 (a wild per-run fit, still a stable loop). */
function loggedRuns(runs: number, seed: number, run: (r: number) => { k: number; b: number }, wild: number[] = []): RunOrderData {
  const random = createRandom(seed), steps = 100, n = runs * steps;
  const states = new Float64Array(n), actions = new Float64Array(n), nextStates = new Float64Array(n), episode = new Int32Array(n);
  for (let r = 0, i = 0; r < runs; r++) {
    const { k, b } = run(r), gain = wild.includes(r) ? 1.5 : k;
    let x = random.normal();
    for (let t = 0; t < steps; t++, i++) {
      const u = -gain * x + 0.1 * random.normal(), next = 0.8 * x + b * u + 0.1 * random.normal();
      states[i] = x; actions[i] = u; nextStates[i] = next; episode[i] = r;
      x = next;
    }
  }
  return { count: n, stateDim: 1, actionDim: 1, states, actions, nextStates, episode };
}

describe('the change the run-order finding leads with', () => {
  it('a controller retuned at run 70 of 200, with three wild runs: a step located at run 70', () => {
    for (const seed of [1, 2, 3]) {
      const result = runOrderTrends(loggedRuns(200, seed, (r) => ({ k: r < 70 ? 0.2 : 0.5, b: 0.5 }), [10, 120, 199]), 10);
      const lead = shownTrends(result)[0];
      expect(lead).toMatchObject({ block: 'law', input: 0 });
      expect(lead.change).toEqual({ kind: 'step', run: 70, clear: true });
    }
  });

  it('a plant whose response to the action falls steadily: a drift', () => {
    for (const seed of [1, 2, 3]) {
      const result = runOrderTrends(loggedRuns(200, seed, (r) => ({ k: 0.4, b: 0.5 - 0.2 * (r / 200) })), 10);
      const lead = shownTrends(result)[0];
      expect(lead).toMatchObject({ block: 'model', input: 1 });
      expect(lead.change?.kind).toBe('drift');
    }
  });
});
