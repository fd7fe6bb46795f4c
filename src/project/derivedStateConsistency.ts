/**
 * Checks of the derived states (columns.derived) that the schema cannot express. The one that
 * matters most: a derived state must not depend on the action the candidate is choosing, else the
 * policy's input would depend on its own output; the previous action is allowed (it is fixed
 * before the choice), and so are its values further back. A value k rows back is Markov only with
 * the values 1 … k − 1 rows back of the same source among the states: it is refused without them.
 * Why the others are Markov under a candidate: src/data/derivedStates.ts.
 */
import { previousSteps, type DerivedStateSpec, type ProjectDocument } from './schema';

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
        add(`${where}.${field}`, `"${column}" is an action column: a derived state may use the candidate’s own action only as its previous value (kind "previous"), because anything else would make the state depend on the action being chosen`);
      }
    }
    const needsTime = (d.kind === 'errorIntegral' || d.kind === 'filtered') && d.periodSeconds === undefined;
    if (needsTime && timestamp === undefined) add(`${where}.periodSeconds`, 'give the sample period in seconds, or name a timestamp column (columns.timestamp) so Δt comes from the log');
  });
  checkLagChains(derived, new Set(doc.columns.states.map((s) => s.column)), add);
  const usesDerived = doc.columns.states.some((s) => names.has(s.column));
  if (usesDerived && doc.columns.nextState.kind === 'columns') {
    add('columns.nextState', 'derived states need next states from the next row of the same run (nextState "nextRow"), since they are computed along each run');
  }
}

/**
 * p^k_{t+1} = x_{t+1−k} = p^{k−1}_t: a value k rows back used as a state needs the values 1 … k − 1
 * rows back of the same source among the states too, else the next state is not a function of this
 * one and the logged action (a dead time the state forgets).
 */
function checkLagChains(derived: readonly DerivedStateSpec[], states: Set<string>, add: (path: string, message: string) => void): void {
  derived.forEach((d, i) => {
    const k = d.kind === 'previous' ? previousSteps(d) : 1;
    if (d.kind !== 'previous' || k === 1 || !states.has(d.name)) return;
    const held = (j: number) => derived.some((x) => x.kind === 'previous' && x.source === d.source && previousSteps(x) === j && states.has(x.name));
    const missing = Array.from({ length: k - 1 }, (_, j) => j + 1).filter((j) => !held(j));
    if (missing.length === 0) return;
    const rows = missing.map(String).join(', ');
    add(`columns.derived[${i}].steps`, `"${d.name}", the value of "${d.source}" ${k} rows back, is a valid state only with ${k === 2 ? 'its value 1 row back' : `its values 1 to ${k - 1} rows back`} among the states (next row it becomes the value ${k - 1} row${k === 2 ? '' : 's'} back, which the state must already hold); missing: ${rows} row(s) back. Add each as a derived state (kind "previous", source "${d.source}", steps ${missing[0]}…) with the role "state"`);
  });
}
