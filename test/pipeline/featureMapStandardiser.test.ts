import { describe, expect, it, vi } from 'vitest';
import { fitStateActionStandardiser } from '../../src/core/features/standardiser';
import type { TransitionSet } from '../../src/core/transitions';
import { featureMapFor } from '../../src/pipeline/plan/featureMapFor';

// Counted, so the test sees the fit made once per log (the cache), not only that its numbers are right.
vi.mock('../../src/core/features/standardiser', async (original) => {
  const actual = await original<typeof import('../../src/core/features/standardiser')>();
  return { ...actual, fitStateActionStandardiser: vi.fn(actual.fitStateActionStandardiser) };
});

/** Invented log: two states and one action of different scales, n rows. */
function log(n: number, shift: number): TransitionSet {
  const states = Float64Array.from({ length: 2 * n }, (_, i) => Math.sin(i * 0.37) * (i % 2 ? 40 : 0.3) + shift);
  const actions = Float64Array.from({ length: n }, (_, i) => Math.cos(i * 1.3) * 5 - shift);
  return {
    count: n, stateDim: 2, actionDim: 1, stateNames: ['x1', 'x2'], actionNames: ['u'], states, actions,
    rewards: new Float64Array(n), nextStates: states.slice(), terminal: new Uint8Array(n), episode: new Int32Array(n), episodeCount: 1,
    startStates: states.slice(0, 2), sourceLine: new Int32Array(n),
  };
}

const polynomial = (degree: number) => ({ kind: 'linear' as const, features: { kind: 'polynomial' as const, degree }, ridge: 1e-6, tolerance: 1e-8, maxIterations: 500 });

describe('feature maps of several degrees on one log share its standardiser', () => {
  it('every map carries the numbers a fresh fit gives, to the last bit, and another log gets its own', () => {
    const a = log(500, 0), b = log(500, 3), fresh = fitStateActionStandardiser(a).spec;
    for (const degree of [1, 2, 3, 4]) {
      const spec = featureMapFor(polynomial(degree), a).polynomial!.standardiser;
      expect(spec.mean).toEqual(fresh.mean);
      expect(spec.scale).toEqual(fresh.scale);
    }
    // A set built from another (a spread with new states) is a new key, so never reads the old entry.
    const moved = { ...a, states: a.states.map((v) => v + 10) };
    expect(featureMapFor(polynomial(2), moved).polynomial!.standardiser).toEqual(fitStateActionStandardiser(moved).spec);
    expect(featureMapFor(polynomial(2), b).polynomial!.standardiser).toEqual(fitStateActionStandardiser(b).spec);
    expect(featureMapFor(polynomial(2), b).polynomial!.standardiser.mean).not.toEqual(fresh.mean);
  });

  it('fits the standardiser once per log, however many degrees ask for it', () => {
    const c = log(300, 1), fit = vi.mocked(fitStateActionStandardiser), before = fit.mock.calls.length;
    for (const degree of [1, 2, 3, 4, 2]) featureMapFor(polynomial(degree), c);
    expect(fit.mock.calls.length - before).toBe(1);
  });
});
