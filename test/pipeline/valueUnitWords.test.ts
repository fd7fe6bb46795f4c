/**
 * J's unit said once where a table states it (pipeline/valueUnitWords.ts): the project's unit after "in",
 * and in plain words where the project gives none — the samples' J read "—" as their unit before. The
 * schema's optional `columns.reward.unit` is what a user fills in (README, project file).
 */
import { policyValueAxisTitle, type PolicyValueChartProps } from '../../src/figures/charts/policyValueChart';
import { describe, expect, it } from 'vitest';
import { NO_UNIT_GIVEN, valueColumnHead, valueSenseSentence, valueUnitText, valueUnitWords } from '../../src/pipeline/valueUnitWords';
import { valueAxisLabel, valueUnit as reportValueUnit, type ReportInput } from '../../src/pipeline/report/reportInput';
import { projectSchema, type ProjectDocument } from '../../src/project/schema';
import { policyValueLabel, valueUnit as findingsValueUnit } from '../../src/renderer/src/screens/findings/plotLabels';

describe('the unit of J in words', () => {
  it('says the unit a project gives, and "no unit given" for none or a blank one', () => {
    expect(valueUnitWords('€')).toBe('in €');
    expect(valueUnitWords('')).toBe(NO_UNIT_GIVEN);
    expect(valueUnitWords(undefined)).toBe('no unit given');
  });

  it('reads the unit from the project schema, where a user gives it (columns.reward.unit)', () => {
    const reward = projectSchema.shape.columns.shape.reward;
    const parsed = reward.parse({ kind: 'column', column: 'cost', sense: 'cost', unit: '€' });
    expect(valueUnitWords(parsed.unit)).toBe('in €');
    // The schema holds the unit trimmed (project/unitText.ts): a padded or blank one reads as the trimmed one.
    expect(valueUnitWords(reward.parse({ kind: 'column', column: 'cost', sense: 'cost', unit: ' kWh ' }).unit)).toBe('in kWh');
    expect(valueUnitWords(reward.parse({ kind: 'column', column: 'cost', sense: 'cost', unit: '   ' }).unit)).toBe(NO_UNIT_GIVEN);
    expect(valueUnitWords(reward.parse({ kind: 'expression', expression: 'a^2', sense: 'cost' }).unit)).toBe('no unit given');
  });

  it('says what J is once for the Findings\' answer and values tables, in the project\'s sense', () => {
    expect(valueSenseSentence('cost', '€')).toBe('J is the expected discounted cost from the start states on, in € (lower is better)');
    expect(valueSenseSentence('reward', undefined)).toBe('J is the expected discounted reward from the start states on, no unit given (higher is better)');
  });
});

describe('one writer says the unit for every host', () => {
  // The unit reaches the words as the schema holds it (trimmed where the project is read, project/unitText.ts;
  // test/project/unitText.test.ts checks the state, action and cost units): the unit, and for an empty or
  // absent one the words "no unit given" and a bare head.
  const held = (unit: string | undefined) => projectSchema.shape.columns.shape.reward.parse({ kind: 'column', column: 'cost', sense: 'cost', ...(unit === undefined ? {} : { unit }) }).unit;
  const doc = (unit: string | undefined) => ({ columns: { reward: { kind: 'column', column: 'cost', sense: 'cost', unit: held(unit) } } }) as unknown as ProjectDocument;
  const input = (unit: string | undefined) => ({ project: doc(unit), evaluation: { valueSense: 'cost' } }) as unknown as ReportInput;
  const cases: [string | undefined, string, string, string, string][] = [
    // unit as typed, unit shown, words, column head, axis title
    ['  € ', '€', 'in €', 'J (€)', 'J, discounted cost (€)'],
    ['', '', NO_UNIT_GIVEN, 'J', 'J, discounted cost'],
    [undefined, '', NO_UNIT_GIVEN, 'J', 'J, discounted cost'],
  ];
  it.each(cases)('unit %j reads %j in the words, heads, report and Findings', (typed, shown, words, head, axis) => {
    expect(valueUnitText(held(typed))).toBe(shown);
    expect(valueUnitWords(held(typed))).toBe(words);
    expect(valueColumnHead('J', held(typed))).toBe(head);
    expect(reportValueUnit(input(typed))).toBe(shown);
    expect(valueAxisLabel(input(typed), 'J')).toBe(axis);
    expect(findingsValueUnit(doc(typed))).toBe(shown);
    expect(policyValueLabel('cost', findingsValueUnit(doc(typed)))).toBe(axis);
    // The comparison chart's axis (app and its PNG/SVG export) reads the same words, then the sense.
    expect(policyValueAxisTitle({ evaluation: { valueSense: 'cost' } as PolicyValueChartProps['evaluation'], theme: 'light', unit: shown })).toBe(`${axis}: lower is better`);
  });
});
