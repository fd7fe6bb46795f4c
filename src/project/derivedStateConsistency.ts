/**
 * Checks of the derived states (columns.derived) that the schema cannot express. The one that
 * matters most: a derived state must not depend on the action the candidate is choosing, else the
 * policy's input would depend on its own output; the previous action is allowed (it is fixed
 * before the choice). Why the others are Markov under a candidate: src/data/derivedStates.ts.
 */
import type { ProjectDocument } from './schema';

export function checkDerivedStates(doc: ProjectDocument, add: (path: string, message: string) => void): void {
  const derived = doc.columns.derived ?? [];
  if (derived.length === 0) return;
  const actions = doc.columns.actions.map((a) => a.column), names = new Set<string>();
  const timestamp = doc.columns.timestamp ?? (doc.columns.episode.kind === 'timeGap' ? doc.columns.episode.column : undefined);
  derived.forEach((d, i) => {
    const where = `columns.derived[${i}]`;
    if (names.has(d.name)) add(`${where}.name`, `the name "${d.name}" is used by another derived state; names must be unique`);
    names.add(d.name);
    if (actions.includes(d.name)) add(`${where}.name`, `"${d.name}" is an action column; a derived state needs a name of its own`);
    const sources = d.kind === 'errorIntegral'
      ? [['measurement', d.measurement], ...(typeof d.setpoint === 'string' ? [['setpoint', d.setpoint]] : [])]
      : [['source', d.source]];
    for (const [field, column] of sources) {
      if (names.has(column) || derived.some((x) => x.name === column)) add(`${where}.${field}`, `"${column}" is a derived state; derived states are computed from file columns only`);
      if (actions.includes(column) && d.kind !== 'previous') {
        add(`${where}.${field}`, `"${column}" is an action column: a derived state may use the candidate's own action only as its previous value (kind "previous"), because anything else would make the state depend on the action being chosen`);
      }
    }
    const needsTime = (d.kind === 'errorIntegral' || d.kind === 'filtered') && d.periodSeconds === undefined;
    if (needsTime && timestamp === undefined) add(`${where}.periodSeconds`, 'give the sample period in seconds, or name a timestamp column (columns.timestamp) so Δt comes from the log');
  });
  const usesDerived = doc.columns.states.some((s) => names.has(s.column));
  if (usesDerived && doc.columns.nextState.kind === 'columns') {
    add('columns.nextState', 'derived states need next states from the next row of the same run (nextState "nextRow"), since they are computed along each run');
  }
}
