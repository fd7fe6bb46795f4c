/**
 * J's unit said once where a table states it (pipeline/valueUnitWords.ts): the project's unit after "in",
 * and in plain words where the project gives none — the samples' J read "—" as their unit before. The
 * schema's optional `columns.reward.unit` is what a user fills in (README, project file).
 */
import { describe, expect, it } from 'vitest';
import { NO_UNIT_GIVEN, valueSenseSentence, valueUnitWords } from '../../src/pipeline/valueUnitWords';
import { projectSchema } from '../../src/project/schema';

describe('the unit of J in words', () => {
  it('says the unit a project gives, and "no unit given" for none or a blank one', () => {
    expect(valueUnitWords('€')).toBe('in €');
    expect(valueUnitWords(' kWh ')).toBe('in kWh');
    expect(valueUnitWords('')).toBe(NO_UNIT_GIVEN);
    expect(valueUnitWords('   ')).toBe('no unit given');
    expect(valueUnitWords(undefined)).toBe('no unit given');
  });

  it('reads the unit from the project schema, where a user gives it (columns.reward.unit)', () => {
    const reward = projectSchema.shape.columns.shape.reward;
    const parsed = reward.parse({ kind: 'column', column: 'cost', sense: 'cost', unit: '€' });
    expect(valueUnitWords(parsed.unit)).toBe('in €');
    expect(valueUnitWords(reward.parse({ kind: 'expression', expression: 'a^2', sense: 'cost' }).unit)).toBe('no unit given');
  });

  it('says what J is once for the Findings\' answer and values tables, in the project\'s sense', () => {
    expect(valueSenseSentence('cost', '€')).toBe('J is the expected discounted cost from the start states on, in € (lower is better)');
    expect(valueSenseSentence('reward', undefined)).toBe('J is the expected discounted reward from the start states on, no unit given (higher is better)');
  });
});
