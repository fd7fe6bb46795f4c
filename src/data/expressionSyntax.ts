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
 * Numbers use "." as the decimal mark (1.5, 2e-3); when the data file uses a decimal comma, "0,5"
 * is read too and ";" separates function arguments (expressionTokens.ts).
 * Columns: a plain name of letters, digits and "_" (not starting with a digit), or any name in
 * backticks, e.g. `inlet flow (m³/h)`; a backtick inside a quoted name is written twice.
 * Functions: abs(x), exp(x), log(x) (natural), sqrt(x), min(x, y, …), max(x, y, …), clamp(x, lo, hi);
 * clamp's limits, when both are constants, must not cross (lo ≤ hi).
 *
 * Bounded: at most MAX_EXPRESSION_LENGTH characters, MAX_EXPRESSION_DEPTH levels of nesting and
 * MAX_EXPRESSION_OPERATIONS operations (src/core/limits.ts); beyond them the expression is
 * refused with a message, never a stack overflow.
 */
import { MAX_EXPRESSION_DEPTH, MAX_EXPRESSION_LENGTH, MAX_EXPRESSION_OPERATIONS } from '../core/limits';
import { ExpressionError } from './expressionError';
import { tokenize, type Token, type TokenOptions, type TokenType } from './expressionTokens';

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

/** Parse an expression; throws ExpressionError pointing at the offending character. */
export function parseExpression(source: string, options: TokenOptions = {}): ExpressionNode {
  if (source.trim() === '') throw new ExpressionError('the expression is empty; expected a formula such as -abs(level - 2)', source, 0);
  if (source.length > MAX_EXPRESSION_LENGTH) {
    throw new ExpressionError(`the expression is ${source.length} characters long; at most ${MAX_EXPRESSION_LENGTH} are allowed (write a shorter formula)`, source, MAX_EXPRESSION_LENGTH);
  }
  const parser = new Parser(source, options);
  const tree = parser.expression();
  parser.expectEnd();
  return tree;
}

/** One method per grammar rule (recursive descent: Aho, Lam, Sethi & Ullman, "Compilers", §4.4). */
class Parser {
  private readonly tokens: Token[];
  private position = 0;
  private depth = 0;
  private operations = 0;

  constructor(private readonly source: string, options: TokenOptions) {
    this.tokens = tokenize(source, options);
  }

  expression(): ExpressionNode {
    let left = this.term();
    while (this.isOperator('+', '-')) left = this.binary(left, () => this.term());
    return left;
  }

  expectEnd(): void {
    const token = this.peek();
    if (token.type !== 'end') throw this.error(`${describe(token)}; expected an operator or the end of the expression`, token);
  }

  private term(): ExpressionNode {
    let left = this.unary();
    while (this.isOperator('*', '/')) left = this.binary(left, () => this.unary());
    return left;
  }

  private unary(): ExpressionNode {
    if (!this.isOperator('-', '+')) return this.power();
    const op = this.next();
    const operand = this.nested(op, () => this.unary());
    if (op.text === '+') return operand;
    this.count(op);
    return { kind: 'negate', operand, index: op.index };
  }

  /** Parse one level deeper; refuse nesting beyond MAX_EXPRESSION_DEPTH at `token`. */
  private nested(token: Token, parse: () => ExpressionNode): ExpressionNode {
    if (++this.depth > MAX_EXPRESSION_DEPTH) {
      throw this.error(`the expression nests more than ${MAX_EXPRESSION_DEPTH} levels deep (parentheses, functions, signs and powers); write it flatter`, token);
    }
    try {
      return parse();
    } finally {
      this.depth--;
    }
  }

  /** Count one operation at `token`; refuse more than MAX_EXPRESSION_OPERATIONS. */
  private count(token: Token): void {
    if (++this.operations > MAX_EXPRESSION_OPERATIONS) {
      throw this.error(`the expression has more than ${MAX_EXPRESSION_OPERATIONS} operations; write a shorter formula`, token);
    }
  }

  private power(): ExpressionNode {
    const base = this.primary();
    // The exponent is a unary: right-associative (2^3^2 = 2^9) and allows 2^-1.
    return this.isOperator('^') ? this.binary(base, () => this.unary()) : base;
  }

  private primary(): ExpressionNode {
    const token = this.next();
    if (token.type === 'number') return { kind: 'number', value: Number(token.text), index: token.index };
    if (token.type === '(') {
      const inner = this.nested(token, () => this.expression());
      this.expect(')', 'a closing parenthesis ")"');
      return inner;
    }
    if (token.type === 'name') {
      if (!token.quoted && this.peek().type === '(') return this.call(token);
      return { kind: 'column', name: token.text, index: token.index };
    }
    throw this.error(`${describe(token)}; expected a number, a column name or "("`, token);
  }

  private call(nameToken: Token): ExpressionNode {
    const name = nameToken.text;
    if (!Object.hasOwn(ARITY, name)) { // not `in`: that would accept "constructor"
      throw this.error(`unknown function "${name}"; expected one of ${Object.keys(ARITY).join(', ')}`, nameToken);
    }
    this.next(); // "("
    this.count(nameToken);
    const args = [this.nested(nameToken, () => this.expression())];
    while (this.peek().type === ',') {
      this.next();
      args.push(this.nested(nameToken, () => this.expression()));
    }
    this.expect(')', 'a closing parenthesis ")" or "," before the next argument');
    const { min, max } = ARITY[name as FunctionName];
    if (args.length < min || args.length > max) {
      const wanted = min === max ? `${min} argument${min === 1 ? '' : 's'}` : `at least ${min} arguments`;
      throw this.error(`${name} takes ${wanted}, got ${args.length}`, nameToken);
    }
    if (name === 'clamp') this.checkClampLimits(args, nameToken);
    return { kind: 'call', name: name as FunctionName, args, index: nameToken.index };
  }

  /** clamp(x, lo, hi) with constant limits lo > hi can only give nonsense: refused here. */
  private checkClampLimits(args: ExpressionNode[], nameToken: Token): void {
    const lo = constantValue(args[1]), hi = constantValue(args[2]);
    if (lo !== undefined && hi !== undefined && !(lo <= hi)) {
      throw this.error(`clamp’s lower limit ${lo} is above its upper limit ${hi}; write clamp(x, lower, upper)`, nameToken);
    }
  }

  private binary(left: ExpressionNode, right: () => ExpressionNode): ExpressionNode {
    const token = this.next();
    this.count(token);
    const operator = token.text as BinaryOperator;
    return { kind: 'binary', operator, left, right: token.text === '^' ? this.nested(token, right) : right(), index: left.index };
  }

  private expect(type: TokenType, what: string): void {
    const token = this.next();
    if (token.type !== type) throw this.error(`${describe(token)}; expected ${what}`, token);
  }

  private isOperator(...ops: string[]): boolean {
    const token = this.peek();
    return token.type === 'operator' && ops.includes(token.text);
  }

  private peek(): Token {
    return this.tokens[this.position];
  }

  private next(): Token {
    return this.tokens[this.position++];
  }

  private error(reason: string, token: Token): ExpressionError {
    return new ExpressionError(reason, this.source, token.index);
  }
}

function describe(token: Token): string {
  return token.type === 'end' ? 'the expression ends too early' : `unexpected "${token.text}"`;
}

/** The value of a subtree without columns (numbers, signs, operators and functions of numbers), else undefined. */
export function constantValue(node: ExpressionNode): number | undefined {
  if (node.kind === 'number') return node.value;
  if (node.kind === 'negate') {
    const x = constantValue(node.operand);
    return x === undefined ? undefined : -x;
  }
  if (node.kind === 'binary') {
    const a = constantValue(node.left), b = constantValue(node.right);
    if (a === undefined || b === undefined) return undefined;
    return { '+': a + b, '-': a - b, '*': a * b, '/': a / b, '^': a ** b }[node.operator];
  }
  return undefined;
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
