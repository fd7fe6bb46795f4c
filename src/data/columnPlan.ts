/**
 * Which header fields the column roles refer to, and how each is read. All naming faults are
 * found here, before any data row is read: missing columns (with the closest header name),
 * ambiguous duplicate names, a next-state list that does not match the states, and unknown
 * names in the reward expression (pointed at with a caret).
 */
import type { ColumnRoles } from '../project/schema';
import { importProblem, type ImportProblem } from './importProblem';
import type { ColumnKind, ColumnRequest } from './columnReader';
import { suggestionFor } from '../core/closestName';
import { ExpressionError } from './expressionError';
import { expressionColumns, parseExpression, type ExpressionNode } from './expressionSyntax';

export interface ColumnPlan {
  readonly requests: ColumnRequest[];
  readonly rewardExpression?: ExpressionNode;
  /** Each used column with its roles, for the summary ("state", "action", …). */
  readonly roles: Map<string, string[]>;
  readonly warnings: ImportProblem[];
}

/** The roles of a column that holds an identifier or a flag, which has no unit (the Plant log's column table says so). */
export const RUN_ROLE = 'run', END_OF_RUN_ROLE = 'end of run';

export function planColumns(header: readonly string[], roles: ColumnRoles, fileName: string, decimalMark: '.' | ',' = '.'): { plan?: ColumnPlan; problems: ImportProblem[] } {
  const problems: ImportProblem[] = [];
  const where = `${fileName}, header (line 1)`;
  const fields = fieldPositions(header);
  const requests = new Map<string, ColumnRequest>();
  const used = new Map<string, string[]>();
  const use = (name: string, kind: ColumnKind, role: string, setting: string): void => {
    const positions = fields.get(name);
    if (!positions) {
      problems.push(importProblem('missing-column', where, `no column named "${name}" (${setting})${suggestionFor(name, header)}`));
      return;
    }
    if (positions.length > 1) {
      const list = positions.map((p) => p + 1).join(' and ');
      problems.push(importProblem('duplicate-column', where, `the column name "${name}" (${setting}) appears in fields ${list}; rename one so the column is unambiguous`));
      return;
    }
    requests.set(`${kind}:${name}`, { name, field: positions[0], kind });
    used.set(name, [...(used.get(name) ?? []), role]);
  };
  const derived = roles.derived ?? [];
  planDerived(roles, header, use, problems, where);
  roles.states.forEach((s, i) => {
    if (!derived.some((d) => d.name === s.column)) use(s.column, 'number', 'state', `state ${i + 1}`);
  });
  roles.actions.forEach((a, i) => use(a.column, 'number', 'action', `action ${i + 1}`));
  const rewardExpression = planReward(roles, header, fileName, use, problems, decimalMark);
  planNextState(roles, use, problems, fileName);
  if (roles.episode.kind === 'column') use(roles.episode.column, 'label', RUN_ROLE, 'run column');
  const timestamp = timestampColumnOf(roles);
  if (timestamp !== undefined) use(timestamp, 'timestamp', 'timestamp', roles.episode.kind === 'timeGap' ? 'timestamp column for runs' : 'timestamp column');
  if (roles.terminal !== undefined) use(roles.terminal, 'flag', END_OF_RUN_ROLE, 'end-of-run column');
  if (problems.length > 0) return { problems };
  return { plan: { requests: [...requests.values()], rewardExpression, roles: used, warnings: duplicateWarnings(fields, used, where) }, problems };
}

/** Derived states read file columns (their sources) and must not share a name with one. */
function planDerived(roles: ColumnRoles, header: readonly string[], use: Use, problems: ImportProblem[], where: string): void {
  (roles.derived ?? []).forEach((d, i) => {
    if (header.includes(d.name)) {
      problems.push(importProblem('derived-name-clash', where, `the derived state "${d.name}" (columns.derived[${i}]) has the name of a column in the file; give it a name of its own`));
    }
    const setting = `derived state "${d.name}"`;
    if (d.kind === 'errorIntegral') {
      use(d.measurement, 'number', 'derived-state input', `${setting}, measurement`);
      if (typeof d.setpoint === 'string') use(d.setpoint, 'number', 'derived-state input', `${setting}, setpoint`);
    } else {
      use(d.source, 'number', 'derived-state input', `${setting}, source`);
    }
  });
}

function fieldPositions(header: readonly string[]): Map<string, number[]> {
  const fields = new Map<string, number[]>();
  header.forEach((name, i) => fields.set(name, [...(fields.get(name) ?? []), i]));
  return fields;
}

type Use = (name: string, kind: ColumnKind, role: string, setting: string) => void;

function planReward(roles: ColumnRoles, header: readonly string[], fileName: string, use: Use, problems: ImportProblem[], decimalMark: '.' | ','): ExpressionNode | undefined {
  const reward = roles.reward;
  const role = reward.sense === 'cost' ? 'cost' : 'reward';
  if (reward.kind === 'column') {
    use(reward.column, 'number', role, `${role} column`);
    return undefined;
  }
  const where = `${fileName}, ${role} expression`;
  try {
    const tree = parseExpression(reward.expression, { decimalMark });
    for (const { name, index } of expressionColumns(tree)) {
      if (header.includes(name)) use(name, 'number', `${role} input`, `${role} expression`);
      else problems.push(importProblem('expression-unknown-column', where, new ExpressionError(`no column named "${name}"${suggestionFor(name, header)}`, reward.expression, index).message));
    }
    return tree;
  } catch (error) {
    if (!(error instanceof ExpressionError)) throw error;
    problems.push(importProblem('expression-syntax', where, error.message));
    return undefined;
  }
}

function planNextState(roles: ColumnRoles, use: Use, problems: ImportProblem[], fileName: string): void {
  if (roles.nextState.kind !== 'columns') return;
  const { columns } = roles.nextState;
  if (columns.length !== roles.states.length) {
    const expected = `${roles.states.length} next-state column${roles.states.length === 1 ? '' : 's'}`;
    problems.push(importProblem('next-state-count', `${fileName}, next-state columns`, `expected ${expected} (one per state, in the order of the states), got ${columns.length}`));
    return;
  }
  columns.forEach((c, i) => use(c, 'number', 'next state', `next state ${i + 1}`));
}

function duplicateWarnings(fields: Map<string, number[]>, used: Map<string, string[]>, where: string): ImportProblem[] {
  return [...fields]
    .filter(([name, positions]) => positions.length > 1 && !used.has(name) && name !== '')
    .map(([name, positions]) => importProblem('unused-duplicate-column', where, `the column name "${name}" appears in fields ${positions.map((p) => p + 1).join(' and ')}; it is not used, so this does no harm`));
}

/** The timestamp column: the one a time-gap episode rule names, else the optional timestamp role. */
export function timestampColumnOf(roles: ColumnRoles): string | undefined {
  return roles.episode.kind === 'timeGap' ? roles.episode.column : roles.timestamp;
}
