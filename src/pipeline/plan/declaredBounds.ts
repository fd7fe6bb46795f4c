/**
 * The actuator position limits the project's candidates declare, per action: the one source the
 * present controller's model reads them from (src/core/loggedActionLimits.ts reads a logged extreme
 * exactly at one of them as a limit even below its 0.1 % floor). Both modes count: clip or
 * truncate is how a candidate acts at the bound, the bound itself is taken as the actuator's end (README says to declare bounds where the actuator really stops).
 */
import type { DeclaredActionBounds } from '../../core/loggedActionLimits';
import type { ProjectDocument } from '../../project/schema';

export function declaredActionBounds(project: ProjectDocument, actionDim: number): DeclaredActionBounds {
  const lo = Array.from({ length: actionDim }, (): number[] => []), hi = Array.from({ length: actionDim }, (): number[] => []);
  for (const candidate of project.candidates) {
    const bounds = candidate.bounds;
    if (!bounds) continue;
    for (let j = 0; j < actionDim; j++) {
      const l = bounds.lo[j], h = bounds.hi[j];
      if (typeof l === 'number' && !lo[j].includes(l)) lo[j].push(l);
      if (typeof h === 'number' && !hi[j].includes(h)) hi[j].push(h);
    }
  }
  return { lo, hi };
}
