import { describe, expect, it } from 'vitest';
import { fitStateActionStandardiser } from '../../src/core/features/standardiser';
import type { TransitionSet } from '../../src/core/transitions';
import { featureMapFor } from '../../src/pipeline/plan/featureMapFor';

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
    expect(featureMapFor(polynomial(2), b).polynomial!.standardiser).toEqual(fitStateActionStandardiser(b).spec);
    expect(featureMapFor(polynomial(2), b).polynomial!.standardiser.mean).not.toEqual(fresh.mean);
  });
});
