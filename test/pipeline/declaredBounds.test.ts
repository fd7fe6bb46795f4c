/**
 * The bounds the present controller's model reads from the project (src/pipeline/plan/declaredBounds.ts):
 * every candidate's position limits per action, either mode, without repeats, nulls left out. The
 * reference is the project document written here (a wiring check: no numerics of its own).
 */
import { describe, expect, it } from 'vitest';
import { declaredActionBounds } from '../../src/pipeline/plan/declaredBounds';
import { projectSchema } from '../../src/project/schema';

const candidate = (name: string, bounds?: unknown) => ({ name, offset: [0.5, 0.5], gain: [[0], [0]], std: [0.1, 0.1], ...(bounds ? { bounds } : {}) });

describe('declaredActionBounds', () => {
  it('collects each action’s declared limits over the candidates, clip and truncate alike', () => {
    const project = projectSchema.parse({
      format: 'setpoint-critic-project', version: 1, name: 'two valves', data: { path: 'none.csv' },
      columns: { states: [{ column: 's' }], actions: [{ column: 'hot' }, { column: 'cold' }], reward: { kind: 'column', column: 'r', sense: 'cost' } },
      discount: 0.95, approximator: { kind: 'linear', features: { kind: 'polynomial', degree: 2 } },
      candidates: [
        candidate('clipped', { lo: [0, 0], hi: [1, null], mode: 'clip' }),
        candidate('truncated', { lo: [0, 0.1], hi: [0.9, 1], mode: 'truncate' }),
        candidate('free'),
      ],
    });
    expect(declaredActionBounds(project, 2)).toEqual({ lo: [[0], [0, 0.1]], hi: [[1, 0.9], [1]] });
  });
});
