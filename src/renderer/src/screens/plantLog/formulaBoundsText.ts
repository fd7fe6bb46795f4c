/**
 * What a reward formula keeps whatever its columns hold, said beside it in the editor.
 */
import { expressionBounds } from '../../../../data/expressionBounds';
import { parseExpression, type ExpressionNode } from '../../../../data/expressionSyntax';
import { boundSides } from '../../../../figures/parts/boundText';

/**
 * The formula's bounds in a sentence for the editor ("This cost is never below 0 on any row, whatever
 * the plant does: …"); null while it does not parse or when it bounds nothing.
 */
export function formulaBoundsText(source: string, sense: 'reward' | 'cost', decimalComma: boolean): string | null {
  let tree: ExpressionNode;
  try {
    tree = parseExpression(source, { decimalMark: decimalComma ? ',' : '.' });
  } catch {
    return null;
  }
  const [lo, hi] = expressionBounds(tree);
  // Rounded outward (boundText.ts), so the sentence stays true of every row.
  const sides = boundSides(lo, hi);
  if (sides.length === 0) return null;
  return `This ${sense} is never ${sides.join(' nor ')} on any row, whatever the plant does (read from the formula): a range to report is cut where that puts it out of reach of every policy.`;
}
