/**
 * Every unit is trimmed once, where the document is read (project/unitText.ts): the schema holds a state's,
 * an action's, a derived state's and the cost's unit without its surrounding spaces, so a label, a table
 * head, a trend's legend or the words about J read it as held and trim nothing. Typed " € ", "" or left
 * out, for a state, an action and the cost column; a saved project reads back the same, and what a user
 * typed between the spaces ("kg / h") is kept. Expected values written by hand from the rule (common
 * practice: a unit is written without padding, SI Brochure §5.4.3 puts one space between number and unit).
 */
import { describe, expect, it } from 'vitest';
import { parseProjectText, serializeProject } from '../../src/project/projectFile';
import { PROJECT_FORMAT, type ProjectDocument } from '../../src/project/schema';
import { heldUnit } from '../../src/project/unitText';
import { actionLabel, stateLabel, valueUnit } from '../../src/renderer/src/screens/findings/plotLabels';
import { columnUnits } from '../../src/pipeline/columnUnitWords';
import { trendOfImport } from '../../src/data/trendSeries';
import { valueColumnHead, valueUnitWords } from '../../src/pipeline/valueUnitWords';
import { dataSection } from '../../src/pipeline/report/reportOverview';
import type { ReportInput } from '../../src/pipeline/report/reportInput';

type Typed = string | undefined;
const project = (state: Typed, action: Typed, cost: Typed, derived: Typed = undefined) => ({
  format: PROJECT_FORMAT, version: 1, name: 'units', data: { path: 'log.csv' },
  columns: {
    states: [{ column: 'level', ...(state === undefined ? {} : { unit: state }) }, { column: 'level_prev' }],
    actions: [{ column: 'valve', ...(action === undefined ? {} : { unit: action }) }],
    reward: { kind: 'column', column: 'cost', sense: 'cost', ...(cost === undefined ? {} : { unit: cost }) },
    derived: [{ kind: 'previous', name: 'level_prev', source: 'level', ...(derived === undefined ? {} : { unit: derived }) }],
  },
  discount: 0.95, approximator: { kind: 'linear', features: { kind: 'polynomial', degree: 2 } },
  candidates: [{ name: 'A', offset: [50], gain: [[-2, 0.1]], std: [1] }],
});

function read(doc: unknown): ProjectDocument {
  const r = parseProjectText(JSON.stringify(doc), 'units.spcritic');
  if (!r.ok) throw new Error(r.problems.map((p) => `${p.where}: ${p.message}`).join('; '));
  return r.value.document;
}

describe('a unit is held trimmed where the project is read', () => {
  // typed (state, action and cost alike), held for a state or action, held for the cost
  const cases: [Typed, string, string | undefined][] = [[' € ', '€', '€'], ['', '', ''], [undefined, '', undefined]];

  it.each(cases)('typed %j: held as %j, and every host reads it as held', (typed, held, heldCost) => {
    const doc = read(project(typed, typed, typed, typed));
    expect(doc.columns.states[0].unit).toBe(held);
    expect(doc.columns.actions[0].unit).toBe(held);
    expect(doc.columns.reward.unit).toBe(heldCost);
    expect(doc.columns.derived?.[0].unit).toBe(held);
    expect(stateLabel(doc, 0)).toBe(held ? `level (${held})` : 'level');
    expect(actionLabel(doc, 0)).toBe(held ? `valve (${held})` : 'valve');
    expect(valueUnit(doc)).toBe(held);
    expect(valueUnitWords(doc.columns.reward.unit)).toBe(held ? `in ${held}` : 'no unit given');
    expect(valueColumnHead('J', doc.columns.reward.unit)).toBe(held ? `J (${held})` : 'J');
    const units = columnUnits(doc);
    for (const column of ['level', 'valve', 'cost', 'level_prev']) expect(units.get(column)).toBe(held || undefined);
    const numbers = new Map([['level', Float64Array.of(1, 2)], ['valve', Float64Array.of(3, 4)]]);
    const trend = trendOfImport(doc.columns, numbers, Float64Array.of(5, 6), undefined, 2, (r) => r + 2);
    expect(trend.signals.map((s) => [s.name, s.unit])).toEqual([['level', held], ['valve', held], ['cost', held]]);
    // The report's Data table writes each unit cell as the app's import table does (pipeline/columnUnitWords.ts).
    const column = (name: string, roles: string[]) => ({ name, roles, min: 0, mean: 1, max: 2, std: 1 });
    const summary = { rowCount: 2, usedRowCount: 2, excludedFraction: 0, transitionCount: 1, episodeCount: 1, samplingPeriodSeconds: null,
      columns: [column('level', ['state']), column('valve', ['action']), column('cost', ['cost']), column('level_prev', ['state', 'derived'])] };
    const cells = [...dataSection({ data: { summary, episodeReport: [] }, project: doc } as unknown as ReportInput).html.matchAll(/<tr><td>[^<]*<\/td><td>[^<]*<\/td><td>([^<]*)<\/td>/g)].map((m) => m[1]);
    expect(cells).toEqual(Array(4).fill(held || 'no unit given'));
  });

  it('reads a saved project back the same, with the units as held', () => {
    const doc = read(project(' °C ', '\t% ', ' € '));
    const text = serializeProject(doc);
    expect(text).toContain('"unit": "°C"');
    expect(text).toContain('"unit": "%"');
    expect(text).toContain('"unit": "€"');
    expect(read(JSON.parse(text))).toEqual(doc);
  });

  it('keeps what was typed between the spaces, and checks the cost unit\'s length after the trim', () => {
    expect(read(project(' kg / h ', 'm³/h', ' €  per  MWh ')).columns.reward.unit).toBe('€  per  MWh');
    expect(read(project(' kg / h ', '', '')).columns.states[0].unit).toBe('kg / h');
    const forty = 'x'.repeat(40);
    expect(read(project('', '', `  ${forty}  `)).columns.reward.unit).toBe(forty);
    const r = parseProjectText(JSON.stringify(project('', '', `${forty}x`)), 'units.spcritic');
    expect(r.ok).toBe(false);
    if (!r.ok) expect(r.problems[0].where).toBe('units.spcritic, columns.reward.unit');
  });

  it('holds what a unit field writes the same way (the app\'s Plant log)', () => {
    expect(heldUnit(' € ')).toBe('€');
    expect(heldUnit('kg ')).toBe('kg');
    expect(heldUnit('   ')).toBe('');
    expect(heldUnit('')).toBe('');
  });
});
