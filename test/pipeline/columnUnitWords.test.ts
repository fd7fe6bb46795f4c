/**
 * The Plant log's column table says "no unit given" only where a unit could be given: a run label or
 * an end-of-run flag has none (common practice: identifiers and flags are dimensionless), so its cell
 * reads "—". Role names are the import's own (data/columnPlan.ts).
 */
import { describe, expect, it } from 'vitest';
import { columnUnitText } from '../../src/pipeline/columnUnitWords';
import { END_OF_RUN_ROLE, RUN_ROLE } from '../../src/data/columnPlan';
import { NO_UNIT_GIVEN } from '../../src/pipeline/valueUnitWords';

describe('columnUnitText', () => {
  it('writes the unit the project gives, whatever the role', () => {
    expect(columnUnitText(['state'], '°C')).toBe('°C');
    expect(columnUnitText(['cost'], '€')).toBe('€');
  });
  it('says a measured quantity has no unit given', () => {
    expect(columnUnitText(['state'], undefined)).toBe(NO_UNIT_GIVEN);
    expect(columnUnitText(['cost'], undefined)).toBe(NO_UNIT_GIVEN);
    expect(columnUnitText([RUN_ROLE, 'state'], undefined)).toBe(NO_UNIT_GIVEN);
  });
  it('writes "—" for a run label or an end-of-run flag alone', () => {
    expect(columnUnitText([RUN_ROLE], undefined)).toBe('—');
    expect(columnUnitText([END_OF_RUN_ROLE], undefined)).toBe('—');
  });
});
