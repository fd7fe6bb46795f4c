/**
 * The reward of every row: a column, or an expression evaluated over columns; a cost is negated
 * so that estimators always maximise. Rows where the result is not finite (log of 0, a division
 * by zero) are reported with the inputs that produced them.
 */
import type { ColumnRoles } from '../project/schema';
import { expressionBounds } from './expressionBounds';
import { evaluateExpression } from './expressionEvaluation';
import { expressionColumns, type ExpressionNode } from './expressionSyntax';
import type { RowProblems } from './rowProblems';
import type { RewardBounds } from '../core/transitions';

/**
 * The rewards as sign · values: `values` are the rule's own (the column, or the expression's result:
 * a cost as a cost), `sign` is −1 for a cost. The negated copy is never made as an array of the
 * records' size: each reader forms sign · values[r] where it reads it (the transitions, the summary's
 * statistics), the same double the copy held (negation is exact in IEEE 754), and the trend draws
 * `values` as they are.
 */
export interface RewardValues {
  readonly values: Float64Array; // records
  readonly sign: 1 | -1;
}

export function rewardColumn(
  rule: ColumnRoles['reward'], tree: ExpressionNode | undefined, numbers: Map<string, Float64Array>,
  recordCount: number, problems: RowProblems,
): RewardValues {
  const raw = rule.kind === 'column'
    ? numbers.get(rule.column)!
    : evaluateExpression(tree!, (name) => numbers.get(name)!, recordCount);
  if (tree) reportNonFinite(raw, tree, numbers, rule.sense, problems);
  if (rule.kind === 'column') reportOutsideDeclared(raw, rule, problems);
  return { values: raw, sign: rule.sense === 'cost' ? -1 : 1 };
}

/** raw: the expression's values before a cost is negated, so messages show what the user wrote. */
function reportNonFinite(
  raw: Float64Array, tree: ExpressionNode, numbers: Map<string, Float64Array>, sense: string, problems: RowProblems,
): void {
  const inputs = expressionColumns(tree).map(({ name }) => name);
  for (let r = 0; r < raw.length; r++) {
    if (Number.isFinite(raw[r]) || problems.isBad(r)) continue;
    const values = inputs.map((name) => `${name} = ${numbers.get(name)![r]}`).join(', ');
    problems.add(r, undefined, 'reward-not-finite', `the ${sense} expression gives ${raw[r]} here (${values}); check for log or sqrt of a negative number, division by zero, and clamp limits that cross (lower above upper)`);
  }
}

/** A logged value past what the project declares the column never leaves: a bad row, named with the declaration. */
function reportOutsideDeclared(raw: Float64Array, rule: Extract<ColumnRoles['reward'], { kind: 'column' }>, problems: RowProblems): void {
  const lo = rule.atLeast ?? -Infinity, hi = rule.atMost ?? Infinity;
  if (lo === -Infinity && hi === Infinity) return;
  for (let r = 0; r < raw.length; r++) {
    const v = raw[r];
    if (!(v < lo || v > hi) || problems.isBad(r)) continue;
    const [side, bound, field] = v < lo ? ['below', lo, 'atLeast'] : ['above', hi, 'atMost'];
    problems.add(r, rule.column, 'reward-outside-declared', `the ${rule.sense} is ${v} here, ${side} ${bound}, which the project declares it never is (columns.reward.${field}); fix the row, or the declaration if the ${rule.sense}’s definition allows it`);
  }
}

/**
 * The bounds every step's reward keeps whatever the plant does, in reward sense (a cost's negated):
 * from the formula (expressionBounds.ts), or as the project declares them for a column; undefined
 * when nothing bounds it.
 */
export function certainRewardBounds(rule: ColumnRoles['reward'], tree: ExpressionNode | undefined): RewardBounds | undefined {
  const [lo, hi] = rule.kind === 'column' ? [rule.atLeast ?? -Infinity, rule.atMost ?? Infinity] : tree ? expressionBounds(tree) : [-Infinity, Infinity];
  if (lo === -Infinity && hi === Infinity) return undefined;
  const from = rule.kind === 'column' ? 'declaration' : 'formula';
  return rule.sense === 'cost' ? { lower: 0 - hi, upper: 0 - lo, from } : { lower: lo, upper: hi, from };
}
