/**
 * Column roles and the shape of the candidates: after any sequence of role changes the document
 * must pass the project's own consistency rules (src/project/consistency.ts), and a candidate's
 * gain entries must stay with the states they belong to.
 */
import { describe, expect, it } from 'vitest';
import { assignRole, roleOf, setUnit } from '../../../src/renderer/src/document/columnRoles';
import { newProjectDocument } from '../../../src/renderer/src/document/newProject';
import { projectProblems } from '../../../src/renderer/src/document/projectProblems';
import type { ProjectDocument } from '../../../src/project/schema';

const HEADER = ['run', 'time_s', 'level_upper_m', 'level_lower_m', 'inflow_valve_pct', 'cost'];

function mapped(): ProjectDocument {
  let doc = newProjectDocument();
  doc = { ...doc, data: { ...doc.data, path: 'tank-levels.csv' } };
  doc = assignRole(doc, HEADER, 'level_lower_m', 'state');
  doc = assignRole(doc, HEADER, 'level_upper_m', 'state');
  doc = assignRole(doc, HEADER, 'inflow_valve_pct', 'action');
  doc = assignRole(doc, HEADER, 'cost', 'cost');
  doc = assignRole(doc, HEADER, 'run', 'episode');
  return setUnit(doc, 'level_upper_m', 'm');
}

describe('column roles', () => {
  it('reads back every role it writes, states in header order', () => {
    const doc = mapped();
    expect(doc.columns.states.map((s) => s.column)).toEqual(['level_upper_m', 'level_lower_m']);
    expect(doc.columns.states[0].unit).toBe('m');
    expect(HEADER.map((c) => roleOf(doc.columns, c))).toEqual(['episode', 'unused', 'state', 'state', 'action', 'cost']);
  });

  it('keeps candidates consistent as states and actions come and go', () => {
    let doc = mapped();
    doc = { ...doc, candidates: [{ name: 'A', description: '', form: { kind: 'affine', offset: [189], gain: [[-60, -90]] }, dither: [1.5] }] };
    expect(projectProblems(doc)).toEqual([]);
    doc = assignRole(doc, HEADER, 'time_s', 'state'); // time_s comes before the levels in the header
    expect(doc.candidates[0].form).toMatchObject({ gain: [[0, -60, -90]] });
    expect(projectProblems(doc)).toEqual([]);
    doc = assignRole(doc, HEADER, 'level_upper_m', 'unused');
    expect(doc.candidates[0].form).toMatchObject({ gain: [[0, -90]] });
    doc = assignRole(doc, HEADER, 'level_upper_m', 'action');
    expect(doc.candidates[0]).toMatchObject({ form: { offset: [0, 189], gain: [[0, 0], [0, -90]] }, dither: [1, 1.5] });
    expect(projectProblems(doc)).toEqual([]);
  });

  it('moves a single role from one column to another', () => {
    let doc = assignRole(mapped(), HEADER, 'run', 'unused');
    doc = assignRole(doc, HEADER, 'time_s', 'timestamp');
    expect(doc.columns.episode).toEqual({ kind: 'timeGap', column: 'time_s' });
    doc = assignRole(doc, HEADER, 'time_s', 'cost');
    expect(roleOf(doc.columns, 'cost')).toBe('unused');
    expect(doc.columns.episode).toEqual({ kind: 'single' });
  });

  it('a timestamp beside a run label is the log’s clock (it may restart in each run); without the label its gaps split the runs', () => {
    let doc = assignRole(mapped(), HEADER, 'time_s', 'timestamp');
    expect(doc.columns.episode).toEqual({ kind: 'column', column: 'run' });
    expect(doc.columns.timestamp).toBe('time_s');
    expect([roleOf(doc.columns, 'run'), roleOf(doc.columns, 'time_s')]).toEqual(['episode', 'timestamp']);
    doc = assignRole(doc, HEADER, 'run', 'unused');
    expect(doc.columns.episode).toEqual({ kind: 'timeGap', column: 'time_s' });
    expect(doc.columns.timestamp).toBeUndefined();
    doc = assignRole(doc, HEADER, 'run', 'episode');
    expect(doc.columns.episode).toEqual({ kind: 'column', column: 'run' });
    expect(doc.columns.timestamp).toBe('time_s');
    doc = assignRole(doc, HEADER, 'time_s', 'unused');
    expect(doc.columns.timestamp).toBeUndefined();
    expect(doc.columns.episode).toEqual({ kind: 'column', column: 'run' });
  });

  it('collects next-state columns per state and goes back to the next row when none is left', () => {
    let doc = mapped();
    doc = assignRole(doc, HEADER, 'time_s', 'next:level_lower_m');
    expect(doc.columns.nextState).toEqual({ kind: 'columns', columns: ['', 'time_s'] });
    expect(projectProblems(doc).some((p) => p.path.startsWith('columns.nextState'))).toBe(true);
    doc = assignRole(doc, HEADER, 'time_s', 'unused');
    expect(doc.columns.nextState).toEqual({ kind: 'nextRow' });
  });
});
