/**
 * The reward of every row: a column, or an expression evaluated over columns; a cost is negated
 * so that estimators always maximise. Rows where the result is not finite (log of 0, a division
 * by zero) are reported with the inputs that produced them.
 */
import type { ColumnRoles } from '../project/schema';
import { evaluateExpression } from './expressionEvaluation';
import { expressionColumns, type ExpressionNode } from './expressionSyntax';
import type { RowProblems } from './rowProblems';

export function rewardColumn(
  rule: ColumnRoles['reward'], tree: ExpressionNode | undefined, numbers: Map<string, Float64Array>,
  recordCount: number, problems: RowProblems,
): Float64Array {
  const raw = rule.kind === 'column'
    ? numbers.get(rule.column)!
    : evaluateExpression(tree!, (name) => numbers.get(name)!, recordCount);
  const sign = rule.sense === 'cost' ? -1 : 1;
  if (tree) reportNonFinite(raw, tree, numbers, rule.sense, problems);
  const rewards = new Float64Array(recordCount);
  for (let r = 0; r < recordCount; r++) rewards[r] = sign * raw[r];
  return rewards;
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
