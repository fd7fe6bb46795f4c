/**
 * The unit cell of the Plant log's column table for a column that is not a timestamp: the unit the
 * project gives; "—" (not applicable) for a column used only as a run label or an end-of-run flag,
 * which has no unit to give; else the plain words for a unit not given (pipeline/valueUnitWords.ts).
 */
import { END_OF_RUN_ROLE, RUN_ROLE } from '../../../../data/columnPlan';
import { NO_UNIT_GIVEN } from '../../../../pipeline/valueUnitWords';

/** Roles (data/columnPlan.ts) whose columns hold an identifier or a flag. */
const UNITLESS_ROLES: readonly string[] = [RUN_ROLE, END_OF_RUN_ROLE];

export function columnUnitText(roles: readonly string[], given: string | undefined): string {
  if (given !== undefined) return given;
  return roles.length > 0 && roles.every((r) => UNITLESS_ROLES.includes(r)) ? '—' : NO_UNIT_GIVEN;
}
