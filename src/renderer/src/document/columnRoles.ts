/**
 * The role each CSV column plays in the project, read from and written to the document's
 * `columns` section. Giving a column a role keeps the rest of the document in shape: a new state
 * adds a zero gain entry to every candidate (and an empty next-state column), a new action adds an
 * offset, a gain row, a standard deviation and open bounds; removing one removes those entries.
 * Single roles (reward, episode, timestamp, terminal) move from their old column to the new one.
 *
 * A timestamp splits the runs at its gaps while no column labels the runs (columns.episode
 * timeGap); next to a run label it is the log's clock only (columns.timestamp), which may start
 * again in each run (run time), so the two roles can be held by two columns at once.
 */
import type { CandidateSpec, ColumnRoles, ProjectDocument } from '../../../project/schema';
import { candidateWithActionInserted, candidateWithActionRemoved, candidateWithStateInserted, candidateWithStateRemoved } from '../../../project/candidateColumns';

export type ColumnRole =
  | 'unused' | 'state' | 'action' | 'reward' | 'cost' | 'episode' | 'timestamp' | 'terminal'
  /** The next-state column of the named state column. */
  | `next:${string}`;

export function roleOf(columns: ColumnRoles, column: string): ColumnRole {
  if (columns.states.some((s) => s.column === column)) return 'state';
  if (columns.actions.some((a) => a.column === column)) return 'action';
  if (columns.reward.kind === 'column' && columns.reward.column === column) return columns.reward.sense;
  if (columns.episode.kind === 'column' && columns.episode.column === column) return 'episode';
  if (columns.episode.kind === 'timeGap' && columns.episode.column === column) return 'timestamp';
  if (columns.timestamp === column) return 'timestamp';
  if (columns.terminal === column) return 'terminal';
  if (columns.nextState.kind === 'columns') {
    const index = columns.nextState.columns.indexOf(column);
    if (index >= 0 && columns.states[index]) return `next:${columns.states[index].column}`;
  }
  return 'unused';
}

/** The document with `column` in `role` (header: the CSV's column names, for ordering). */
export function assignRole(doc: ProjectDocument, header: readonly string[], column: string, role: ColumnRole): ProjectDocument {
  let next = releaseColumn(doc, column);
  if (role === 'state') next = addState(next, header, column);
  else if (role === 'action') next = addAction(next, header, column);
  else if (role === 'reward' || role === 'cost') next = withColumns(next, { reward: { kind: 'column', column, sense: role } });
  else if (role === 'episode') next = withRunLabel(next, column);
  else if (role === 'timestamp') next = withTimestamp(next, column);
  else if (role === 'terminal') next = withColumns(next, { terminal: column });
  else if (role.startsWith('next:')) next = setNextState(next, role.slice('next:'.length), column);
  return next;
}

export function setUnit(doc: ProjectDocument, column: string, unit: string): ProjectDocument {
  const relabel = (s: { column: string; unit: string }) => (s.column === column ? { ...s, unit } : s);
  return withColumns(doc, { states: doc.columns.states.map(relabel), actions: doc.columns.actions.map(relabel) });
}

function withColumns(doc: ProjectDocument, change: Partial<ColumnRoles>): ProjectDocument {
  return { ...doc, columns: { ...doc.columns, ...change } };
}

function mapCandidates(doc: ProjectDocument, f: (c: CandidateSpec) => CandidateSpec): ProjectDocument {
  return { ...doc, candidates: doc.candidates.map(f) };
}

/** A run label; a timestamp that split the runs at its gaps stays as the log's clock. */
function withRunLabel(doc: ProjectDocument, column: string): ProjectDocument {
  const c = doc.columns;
  const clock = c.episode.kind === 'timeGap' ? c.episode.column : c.timestamp;
  return withColumns(doc, { episode: { kind: 'column', column }, timestamp: clock });
}

/** Beside a run label, the log's clock; with none, the clock whose gaps split the runs (one timestamp column either way). */
function withTimestamp(doc: ProjectDocument, column: string): ProjectDocument {
  if (doc.columns.episode.kind === 'column') return withColumns(doc, { timestamp: column });
  return withColumns(doc, { episode: { kind: 'timeGap', column }, timestamp: undefined });
}

/** The document with `column` in no role at all. */
function releaseColumn(doc: ProjectDocument, column: string): ProjectDocument {
  const c = doc.columns;
  let next = doc;
  const stateIndex = c.states.findIndex((s) => s.column === column);
  if (stateIndex >= 0) next = removeState(next, stateIndex);
  const actionIndex = c.actions.findIndex((a) => a.column === column);
  if (actionIndex >= 0) next = removeAction(next, actionIndex);
  const n = next.columns;
  if (n.reward.kind === 'column' && n.reward.column === column) next = withColumns(next, { reward: { ...n.reward, column: '' } });
  if (n.episode.kind === 'column' && n.episode.column === column && n.timestamp !== undefined) {
    next = withColumns(next, { episode: { kind: 'timeGap', column: n.timestamp }, timestamp: undefined }); // the clock splits the runs again
  } else if (n.episode.kind !== 'single' && n.episode.column === column) next = withColumns(next, { episode: { kind: 'single' } });
  if (n.terminal === column) next = withColumns(next, { terminal: undefined });
  if (n.timestamp === column) next = withColumns(next, { timestamp: undefined });
  if (n.nextState.kind === 'columns' && n.nextState.columns.includes(column)) {
    next = withNextColumns(next, n.nextState.columns.map((x) => (x === column ? '' : x)));
  }
  return next;
}

/** Where a new signal goes among existing ones: after those that come earlier in the header. */
function insertionIndex(existing: readonly { column: string }[], header: readonly string[], column: string): number {
  const position = header.indexOf(column);
  return existing.filter((s) => header.indexOf(s.column) < position).length;
}

function inserted<T>(list: readonly T[], index: number, item: T): T[] {
  return [...list.slice(0, index), item, ...list.slice(index)];
}

function removed<T>(list: readonly T[], index: number): T[] {
  return list.filter((_, i) => i !== index);
}

function addState(doc: ProjectDocument, header: readonly string[], column: string): ProjectDocument {
  const at = insertionIndex(doc.columns.states, header, column);
  let next = withColumns(doc, { states: inserted(doc.columns.states, at, { column, unit: '' }) });
  if (doc.columns.nextState.kind === 'columns') next = withNextColumns(next, inserted(doc.columns.nextState.columns, at, ''));
  return mapCandidates(next, (c) => candidateWithStateInserted(c, at));
}

function removeState(doc: ProjectDocument, index: number): ProjectDocument {
  const name = doc.columns.states[index].column;
  let next = withColumns(doc, { states: removed(doc.columns.states, index) });
  if (doc.columns.nextState.kind === 'columns') next = withNextColumns(next, removed(doc.columns.nextState.columns, index));
  if (doc.surface && (doc.surface.xState === name || doc.surface.yState === name)) next = { ...next, surface: undefined };
  return mapCandidates(next, (c) => candidateWithStateRemoved(c, index));
}

function addAction(doc: ProjectDocument, header: readonly string[], column: string): ProjectDocument {
  const at = insertionIndex(doc.columns.actions, header, column);
  const ds = doc.columns.states.length;
  const next = withColumns(doc, { actions: inserted(doc.columns.actions, at, { column, unit: '' }) });
  return mapCandidates(next, (c) => candidateWithActionInserted(c, at, ds));
}

function removeAction(doc: ProjectDocument, index: number): ProjectDocument {
  const next = withColumns(doc, { actions: removed(doc.columns.actions, index) });
  return mapCandidates(next, (c) => candidateWithActionRemoved(c, index));
}

/** Next-state columns aligned with the states ('' where none is given yet); all empty → next row. */
function withNextColumns(doc: ProjectDocument, columns: string[]): ProjectDocument {
  return withColumns(doc, { nextState: columns.every((x) => x === '') ? { kind: 'nextRow' } : { kind: 'columns', columns } });
}

function setNextState(doc: ProjectDocument, stateColumn: string, column: string): ProjectDocument {
  const index = doc.columns.states.findIndex((s) => s.column === stateColumn);
  if (index < 0) return doc;
  const current = doc.columns.nextState.kind === 'columns' ? [...doc.columns.nextState.columns] : doc.columns.states.map(() => '');
  current[index] = column;
  return withNextColumns(doc, current);
}
