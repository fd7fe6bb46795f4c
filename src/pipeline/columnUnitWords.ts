/**
 * The unit cell of a column table — the Plant log's import table and the report's Data table — for a
 * column that is not a timestamp: the unit the project gives (a state's, an action's, a derived state's
 * or the cost's, as the document holds it, project/unitText.ts); "—" (not applicable) for a column used only as a run label or an end-of-run flag,
 * which has no unit to give; else the plain words for a unit not given (pipeline/valueUnitWords.ts).
 */
import { END_OF_RUN_ROLE, RUN_ROLE } from '../data/columnPlan';
import { NO_UNIT_GIVEN } from './valueUnitWords';
import type { ProjectDocument } from '../project/schema';

/** Roles (data/columnPlan.ts) whose columns hold an identifier or a flag. */
const UNITLESS_ROLES: readonly string[] = [RUN_ROLE, END_OF_RUN_ROLE];

export function columnUnitText(roles: readonly string[], given: string | undefined): string {
  if (given !== undefined) return given;
  return roles.length > 0 && roles.every((r) => UNITLESS_ROLES.includes(r)) ? '—' : NO_UNIT_GIVEN;
}

/** Each column's unit as the project holds it (trimmed, project/unitText.ts): states, actions, the reward or cost, derived states. */
export function columnUnits(doc: Pick<ProjectDocument, 'columns'>): Map<string, string> {
  const c = doc.columns, units = new Map<string, string>();
  for (const s of [...c.states, ...c.actions]) if (s.unit) units.set(s.column, s.unit);
  for (const d of c.derived ?? []) if (d.unit) units.set(d.name, d.unit);
  if (c.reward.kind === 'column' && c.reward.unit) units.set(c.reward.column, c.reward.unit);
  return units;
}
