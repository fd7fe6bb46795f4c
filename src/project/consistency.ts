/**
 * Checks across fields that a per-field schema cannot express: each candidate against the columns
 * (candidateConsistency.ts), the derived states (derivedStateConsistency.ts), unique names, next
 * states and start states of the right length, surface axes that are states.
 */
import type { Problem } from '../core/result';
import type { ProjectDocument } from './schema';
import { checkCandidate, writtenCandidate, writtenCandidatePath } from './candidateConsistency';
import { checkDerivedStates } from './derivedStateConsistency';
import { checkRetuneMaps } from './retuneMapConsistency';

/**
 * `written`, when given, is the document as the file holds it (before the schema's defaults and
 * the reading of older field names), so a problem in an older-style candidate names the field as
 * written there ("gain[0]", "std") rather than as it is held ("form.gain[0]", "dither").
 */
export function checkProjectConsistency(doc: ProjectDocument, fileName: string, written?: unknown): Problem[] {
  const problems: Problem[] = [];
  const stateCount = doc.columns.states.length;
  const at = (path: string) => `${fileName}, ${path}`;
  doc.candidates.forEach((c, i) => {
    const where = `candidates[${i}] "${c.name}"`;
    checkCandidate(doc, c, (path, message) => {
      const asWritten = writtenCandidatePath(writtenCandidate(written, i), path);
      problems.push({ where: at(`${where}.${asWritten}`), field: ['candidates', i, ...fieldKeys(asWritten)], message });
    });
  });
  checkDerivedStates(doc, (path, message) => problems.push({ where: at(path), field: fieldKeys(path), message }));
  checkRetuneMaps(doc, (path, message) => problems.push({ where: at(path), field: fieldKeys(path), message }));
  const names = new Set<string>();
  doc.candidates.forEach((c, i) => {
    if (names.has(c.name)) problems.push({ where: at(`candidates[${i}].name`), field: ['candidates', i, 'name'], message: `the name "${c.name}" is used by another candidate; names must be unique` });
    names.add(c.name);
  });
  if (doc.columns.nextState.kind === 'columns' && doc.columns.nextState.columns.length !== stateCount) {
    problems.push({ where: at('columns.nextState.columns'), field: ['columns', 'nextState', 'columns'], message: `expected ${stateCount} next-state column(s), one per state column` });
  }
  if (doc.columns.timestamp !== undefined && doc.columns.episode.kind === 'timeGap' && doc.columns.timestamp !== doc.columns.episode.column) {
    problems.push({ where: at('columns.timestamp'), field: ['columns', 'timestamp'], message: `"${doc.columns.timestamp}" differs from the column whose time gaps mark the runs "${doc.columns.episode.column}"; use one timestamp column` });
  }
  if (doc.startStates.kind === 'given') {
    doc.startStates.states.forEach((s, i) => {
      if (s.length !== stateCount) problems.push({ where: at(`startStates.states[${i}]`), field: ['startStates', 'states', i], message: `expected ${stateCount} value(s), one per state column` });
    });
  }
  if (doc.surface) {
    const stateNames = doc.columns.states.map((s) => s.column);
    for (const axis of ['xState', 'yState'] as const) {
      if (!stateNames.includes(doc.surface[axis])) problems.push({ where: at(`surface.${axis}`), field: ['surface', axis], message: `"${doc.surface[axis]}" is not one of the state columns (${stateNames.join(', ')})` });
    }
  }
  return problems;
}

/** "form.loops[0].measurement" → ["form", "loops", 0, "measurement"] (paths this module writes itself). */
function fieldKeys(path: string): (string | number)[] {
  return path.split(/\.|(?=\[)/).map((key) => (/^\[\d+\]$/.test(key) ? Number(key.slice(1, -1)) : key));
}
