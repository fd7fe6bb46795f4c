/**
 * The action-value slices with two actions: along one action the other is held at a value the
 * candidate can take — its median action, the unlimited mean clipped into the valve's range (the
 * median of a clipped normal is the clipped mean; common practice) — not at the unlimited mean,
 * which here lies beyond the cold valve's open end. Q is a closed form given by hand, so the slice's
 * values are known exactly: Q(s, a) = s₁ − (a₁ − 0.3)² − 2·(a₂ − 0.5)².
 */
import { describe, expect, it } from 'vitest';
import type { ActionValueFunction } from '../../src/core/actionValue';
import { createGaussianPolicy } from '../../src/core/policy';
import type { TransitionSet } from '../../src/core/transitions';
import { actionSlices } from '../../src/pipeline/assessSlices';
import type { CandidateModel } from '../../src/pipeline/model/candidateModel';

const q: ActionValueFunction = {
  stateDim: 1, actionDim: 2,
  evaluate(inputs, count, out) {
    for (let i = 0; i < count; i++) {
      const s = inputs[3 * i], a1 = inputs[3 * i + 1], a2 = inputs[3 * i + 2];
      out[i] = s - (a1 - 0.3) ** 2 - 2 * (a2 - 0.5) ** 2;
    }
  },
};

/** A log of 200 rows of one state and two valves within [0, 1]. */
function log(): TransitionSet {
  const n = 200, states = Float64Array.from({ length: n }, (_, i) => i / n);
  const actions = Float64Array.from({ length: 2 * n }, (_, k) => (k % 2 === 0 ? 0.2 + 0.3 * ((k / 2) % 7) / 7 : 0.6 + 0.3 * (((k - 1) / 2) % 5) / 5));
  return {
    count: n, stateDim: 1, actionDim: 2, stateNames: ['s'], actionNames: ['hot', 'cold'], states, actions, nextStates: states,
    rewards: new Float64Array(n), terminal: new Uint8Array(n), episode: new Int32Array(n), episodeCount: 1, startStates: Float64Array.of(0),
    sourceLine: Int32Array.from({ length: n }, (_, i) => i + 2),
  };
}

describe('action-value slices with two actions', () => {
  it('holds the other valve at the candidate’s median action (its mean clipped at the valve’s end), a value it can take', () => {
    // Cold valve mean 1.4 at every state, beyond its open end: the candidate holds it at 1 (a point mass of Φ(2) ≈ 0.98).
    const policy = createGaussianPolicy({ offset: [0.3, 1.4], gain: [[0], [0]], std: [0.1, 0.2], bounds: { lo: [0, 0], hi: [1, 1], mode: 'clip' } }, 1);
    const slices = actionSlices({ policy, fit: { q } } as unknown as CandidateModel, log(), 1);
    const alongHot = slices.filter((s) => s.actionIndex === 0);
    expect(alongHot.length).toBe(3);
    for (const s of alongHot) {
      s.actions.forEach((a1, i) => expect(s.values[i]).toBeCloseTo(s.state[0] - (a1 - 0.3) ** 2 - 2 * (1 - 0.5) ** 2, 12));
    }
    const alongCold = slices.filter((s) => s.actionIndex === 1);
    for (const s of alongCold) {
      expect(s.actions[s.actions.length - 1]).toBe(1); // not past the valve's end
      s.actions.forEach((a2, i) => expect(s.values[i]).toBeCloseTo(s.state[0] - 0 - 2 * (a2 - 0.5) ** 2, 12));
    }
  });
});
