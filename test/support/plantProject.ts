/**
 * A battery plant's log as a project document for tests that assess it: the plant's state and
 * action columns, reward column `r` in the reward sense (as `episodeLog.ts` stores it), the plant's
 * discount and the linear approximator with polynomial features of degree 2; the candidates given.
 */
import { projectSchema, type ProjectDocument } from '../../src/project/schema';
import type { BatteryPlant } from '../battery/batteryPlant';

export function plantProject(
  plant: Pick<BatteryPlant, 'stateNames' | 'actionNames' | 'discount'>, name: string, candidates: readonly object[], quadratureNodes = 10,
): ProjectDocument {
  return projectSchema.parse({
    format: 'setpoint-critic-project', version: 1, name, data: { path: 'none.csv' },
    columns: {
      states: plant.stateNames.map((column) => ({ column })), actions: plant.actionNames.map((column) => ({ column })),
      reward: { kind: 'column', column: 'r', sense: 'reward' },
    },
    discount: plant.discount, approximator: { kind: 'linear', features: { kind: 'polynomial', degree: 2 } }, quadratureNodes,
    candidates,
  });
}
