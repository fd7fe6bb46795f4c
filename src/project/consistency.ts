/**
 * Checks across fields that a per-field schema cannot express: a candidate's gain must have one row
 * per action and one column per state, bounds one limit per action, surface axes must be states.
 */
import type { Problem } from '../core/result';
import type { ProjectDocument } from './schema';

export function checkProjectConsistency(doc: ProjectDocument, fileName: string): Problem[] {
  const problems: Problem[] = [];
  const stateCount = doc.columns.states.length;
  const actionCount = doc.columns.actions.length;
  const at = (path: string) => `${fileName}, ${path}`;
  doc.candidates.forEach((c, i) => {
    const where = `candidates[${i}] "${c.name}"`;
    if (c.offset.length !== actionCount) problems.push({ where: at(`${where}.offset`), message: `expected ${actionCount} value(s), one per action column, found ${c.offset.length}` });
    if (c.std.length !== actionCount) problems.push({ where: at(`${where}.std`), message: `expected ${actionCount} value(s), one per action column, found ${c.std.length}` });
    if (c.gain.length !== actionCount) problems.push({ where: at(`${where}.gain`), message: `expected ${actionCount} row(s), one per action column, found ${c.gain.length}` });
    c.gain.forEach((row, r) => {
      if (row.length !== stateCount) problems.push({ where: at(`${where}.gain[${r}]`), message: `expected ${stateCount} value(s), one per state column, found ${row.length}` });
    });
    if (c.bounds) {
      for (const side of ['lo', 'hi'] as const) {
        if (c.bounds[side].length !== actionCount) problems.push({ where: at(`${where}.bounds.${side}`), message: `expected ${actionCount} limit(s), one per action column (null for none)` });
      }
      c.bounds.lo.forEach((lo, k) => {
        const hi = c.bounds!.hi[k];
        if (lo !== null && hi !== null && hi !== undefined && !(lo < hi)) problems.push({ where: at(`${where}.bounds`), message: `lower limit ${lo} must be below upper limit ${hi} for action ${k + 1}` });
      });
    }
  });
  const names = new Set<string>();
  doc.candidates.forEach((c, i) => {
    if (names.has(c.name)) problems.push({ where: at(`candidates[${i}].name`), message: `the name "${c.name}" is used by another candidate; names must be unique` });
    names.add(c.name);
  });
  if (doc.columns.nextState.kind === 'columns' && doc.columns.nextState.columns.length !== stateCount) {
    problems.push({ where: at('columns.nextState.columns'), message: `expected ${stateCount} next-state column(s), one per state column` });
  }
  if (doc.columns.timestamp !== undefined && doc.columns.episode.kind === 'timeGap' && doc.columns.timestamp !== doc.columns.episode.column) {
    problems.push({ where: at('columns.timestamp'), message: `"${doc.columns.timestamp}" differs from the time-gap episode column "${doc.columns.episode.column}"; use one timestamp column` });
  }
  if (doc.startStates.kind === 'given') {
    doc.startStates.states.forEach((s, i) => {
      if (s.length !== stateCount) problems.push({ where: at(`startStates.states[${i}]`), message: `expected ${stateCount} value(s), one per state column` });
    });
  }
  if (doc.surface) {
    const stateNames = doc.columns.states.map((s) => s.column);
    for (const axis of ['xState', 'yState'] as const) {
      if (!stateNames.includes(doc.surface[axis])) problems.push({ where: at(`surface.${axis}`), message: `"${doc.surface[axis]}" is not one of the state columns (${stateNames.join(', ')})` });
    }
  }
  return problems;
}
