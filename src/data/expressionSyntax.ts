/**
 * The reward/cost expression language: arithmetic over column names and numbers, read by a
 * hand-written recursive-descent parser into a tree (never eval or Function), so a project file
 * can hold a formula without being able to run code.
 *
 * Grammar (lowest precedence first; `^` binds tighter than unary minus, as in mathematics, so
 * -x^2 = -(x^2), and is right-associative, 2^3^2 = 2^9):
 *   expression := term (("+" | "-") term)*
 *   term       := unary (("*" | "/") unary)*
 *   unary      := ("-" | "+") unary | power
 *   power      := primary ("^" unary)?
 *   primary    := number | column | function "(" expression ("," expression)* ")" | "(" expression ")"
 * Numbers always use "." as the decimal mark (1.5, 2e-3), whatever the file uses.
 * Columns: a plain name of letters, digits and "_" (not starting with a digit), or any name in
 * backticks, e.g. `inlet flow (m³/h)`; a backtick inside a quoted name is written twice.
 * Functions: abs(x), exp(x), log(x) (natural), sqrt(x), min(x, y, …), max(x, y, …), clamp(x, lo, hi).
 */
import { ExpressionError } from './expressionError';

export type BinaryOperator = '+' | '-' | '*' | '/' | '^';
export type FunctionName = 'abs' | 'exp' | 'log' | 'sqrt' | 'min' | 'max' | 'clamp';

/** A node of the expression tree; `index` is the 0-based character where it starts. */
export type ExpressionNode =
  | { kind: 'number'; value: number; index: number }
  | { kind: 'column'; name: string; index: number }
  | { kind: 'negate'; operand: ExpressionNode; index: number }
  | { kind: 'binary'; operator: BinaryOperator; left: ExpressionNode; right: ExpressionNode; index: number }
  | { kind: 'call'; name: FunctionName; args: ExpressionNode[]; index: number };

const ARITY: Record<FunctionName, { min: number; max: number }> = {
  abs: { min: 1, max: 1 }, exp: { min: 1, max: 1 }, log: { min: 1, max: 1 }, sqrt: { min: 1, max: 1 },
  min: { min: 2, max: Infinity }, max: { min: 2, max: Infinity }, clamp: { min: 3, max: 3 },
};

type TokenType = 'number' | 'name' | 'operator' | '(' | ')' | ',' | 'end';
/** `quoted` marks a backticked name, which is always a column, never a function. */
interface Token { type: TokenType; text: string; index: number; quoted?: boolean }

const NUMBER = /^(?:\d+\.?\d*|\.\d+)(?:[eE][+-]?\d+)?/;
const NAME = /^[A-Za-z_][A-Za-z0-9_]*/;

/** Split the source into tokens; `name` tokens carry the unquoted column or function name. */
function tokenize(source: string): Token[] {
  const tokens: Token[] = [];
  let i = 0;
  while (i < source.length) {
    const ch = source[i];
    if (/\s/.test(ch)) { i++; continue; }
    const rest = source.slice(i);
    const number = NUMBER.exec(rest);
    const name = NAME.exec(rest);
    if (number) { tokens.push({ type: 'number', text: number[0], index: i }); i += number[0].length; }
    else if (name) { tokens.push({ type: 'name', text: name[0], index: i }); i += name[0].length; }
    else if (ch === '`') i = readQuotedName(source, i, tokens);
    else if ('+-−*/^'.includes(ch)) { tokens.push({ type: 'operator', text: ch === '−' ? '-' : ch, index: i }); i++; }
    else if (ch === '(' || ch === ')' || ch === ',') { tokens.push({ type: ch, text: ch, index: i }); i++; }
    else throw new ExpressionError(`unexpected character "${ch}"; expected a number, a column name, an operator (+ - * / ^) or a parenthesis`, source, i);
  }
  tokens.push({ type: 'end', text: '', index: source.length });
  return tokens;
}

function readQuotedName(source: string, start: number, tokens: Token[]): number {
  let name = '';
  let i = start + 1;
  for (;;) {
    if (i >= source.length) throw new ExpressionError('this quoted column name is not closed; expected a closing backtick `', source, start);
    if (source[i] === '`') {
      if (source[i + 1] !== '`') break;
      name += '`';
      i += 2;
    } else name += source[i++];
  }
  if (name.trim() === '') throw new ExpressionError('empty column name between backticks', source, start);
  tokens.push({ type: 'name', text: name, index: start, quoted: true });
  return i + 1;
}

/** Parse an expression; throws ExpressionError pointing at the offending character. */
export function parseExpression(source: string): ExpressionNode {
  const tokens = tokenize(source);
  let position = 0;
  const peek = (): Token => tokens[position];
  const next = (): Token => tokens[position++];
  const isOperator = (...ops: string[]): boolean => peek().type === 'operator' && ops.includes(peek().text);

  function expression(): ExpressionNode {
    let left = term();
    while (isOperator('+', '-')) {
      const op = next();
      left = { kind: 'binary', operator: op.text as BinaryOperator, left, right: term(), index: left.index };
    }
    return left;
  }
  function term(): ExpressionNode {
    let left = unary();
    while (isOperator('*', '/')) {
      const op = next();
      left = { kind: 'binary', operator: op.text as BinaryOperator, left, right: unary(), index: left.index };
    }
    return left;
  }
  function unary(): ExpressionNode {
    if (isOperator('-', '+')) {
      const op = next();
      const operand = unary();
      return op.text === '-' ? { kind: 'negate', operand, index: op.index } : operand;
    }
    return power();
  }
  function power(): ExpressionNode {
    const base = primary();
    if (!isOperator('^')) return base;
    next();
    return { kind: 'binary', operator: '^', left: base, right: unary(), index: base.index };
  }
  function primary(): ExpressionNode {
    const token = next();
    if (token.type === 'number') return { kind: 'number', value: Number(token.text), index: token.index };
    if (token.type === '(') {
      const inner = expression();
      expect(')', 'a closing parenthesis ")"');
      return inner;
    }
    if (token.type === 'name') {
      if (!token.quoted && peek().type === '(') return call(token);
      return { kind: 'column', name: token.text, index: token.index };
    }
    throw new ExpressionError(`${describe(token)}; expected a number, a column name or "("`, source, token.index);
  }
  function call(nameToken: Token): ExpressionNode {
    const name = nameToken.text;
    if (!Object.hasOwn(ARITY, name)) { // not `in`: that would accept "constructor"
      throw new ExpressionError(`unknown function "${name}"; expected one of ${Object.keys(ARITY).join(', ')}`, source, nameToken.index);
    }
    next(); // "("
    const args = [expression()];
    while (peek().type === ',') { next(); args.push(expression()); }
    expect(')', 'a closing parenthesis ")" or "," before the next argument');
    const { min, max } = ARITY[name as FunctionName];
    if (args.length < min || args.length > max) {
      const wanted = min === max ? `${min}` : `at least ${min}`;
      throw new ExpressionError(`${name} takes ${wanted} argument${min === 1 && max === 1 ? '' : 's'}, got ${args.length}`, source, nameToken.index);
    }
    return { kind: 'call', name: name as FunctionName, args, index: nameToken.index };
  }
  function expect(type: TokenType, what: string): void {
    const token = next();
    if (token.type !== type) throw new ExpressionError(`${describe(token)}; expected ${what}`, source, token.index);
  }

  if (source.trim() === '') throw new ExpressionError('the expression is empty; expected a formula such as -abs(level - 2)', source, 0);
  const tree = expression();
  if (peek().type !== 'end') throw new ExpressionError(`${describe(peek())}; expected an operator or the end of the expression`, source, peek().index);
  return tree;
}

function describe(token: Token): string {
  return token.type === 'end' ? 'the expression ends too early' : `unexpected "${token.text}"`;
}

/** Every column the expression reads, each once, with the position of its first use. */
export function expressionColumns(tree: ExpressionNode): { name: string; index: number }[] {
  const seen = new Map<string, number>();
  const visit = (node: ExpressionNode): void => {
    if (node.kind === 'column') { if (!seen.has(node.name)) seen.set(node.name, node.index); }
    else if (node.kind === 'negate') visit(node.operand);
    else if (node.kind === 'binary') { visit(node.left); visit(node.right); }
    else if (node.kind === 'call') node.args.forEach(visit);
  };
  visit(tree);
  return [...seen].map(([name, index]) => ({ name, index }));
}
