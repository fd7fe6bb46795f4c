/** A project over an in-memory log (its columns named as the log's), linear fitted Q-evaluation with polynomial features of degree 2; for the assessment tests. */
import type { TransitionSet } from '../../src/core/transitions';
import { projectSchema } from '../../src/project/schema';

export function linearProjectFor(data: TransitionSet, discount: number, candidates: unknown[], name = 'evidence check') {
  return projectSchema.parse({
    format: 'setpoint-critic-project', version: 1, name, data: { path: 'none.csv' },
    columns: {
      states: data.stateNames.map((column) => ({ column })), actions: data.actionNames.map((column) => ({ column })),
      reward: { kind: 'column', column: 'r', sense: 'reward' },
    },
    discount, approximator: { kind: 'linear', features: { kind: 'polynomial', degree: 2 } }, candidates,
  });
}
