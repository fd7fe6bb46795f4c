/**
 * Tokens of the reward/cost expression language (grammar in expressionSyntax.ts): numbers,
 * plain names, `backticked` column names, operators, parentheses and argument separators.
 * Numbers take "." as the decimal mark; when the data file uses a decimal comma they also take
 * "," between digits (0,5), and ";" separates function arguments — as spreadsheets do in
 * decimal-comma locales (common practice). A comma followed by a space still separates.
 */
import { ExpressionError } from './expressionError';

export type TokenType = 'number' | 'name' | 'operator' | '(' | ')' | ',' | 'end';
/** `quoted` marks a backticked name, which is always a column, never a function. */
export interface Token { type: TokenType; text: string; index: number; quoted?: boolean }

const NUMBER = /^(?:\d+\.?\d*|\.\d+)(?:[eE][+-]?\d+)?/;
const NUMBER_DECIMAL_COMMA = /^(?:\d+[.,]\d+|\d+\.?|[.,]\d+)(?:[eE][+-]?\d+)?/;

export interface TokenOptions {
  /** The data file's decimal mark: with ",", "0,5" is a number and ";" separates arguments. */
  decimalMark?: '.' | ',';
}
const NAME = /^[A-Za-z_][A-Za-z0-9_]*/;

/** Split the source into tokens; `name` tokens carry the unquoted column or function name. */
export function tokenize(source: string, options: TokenOptions = {}): Token[] {
  const numberPattern = options.decimalMark === ',' ? NUMBER_DECIMAL_COMMA : NUMBER;
  const tokens: Token[] = [];
  let i = 0;
  while (i < source.length) {
    const ch = source[i];
    if (/\s/.test(ch)) { i++; continue; }
    const rest = source.slice(i);
    const number = numberPattern.exec(rest);
    const name = NAME.exec(rest);
    if (number) { tokens.push({ type: 'number', text: number[0].replace(',', '.'), index: i }); i += number[0].length; }
    else if (name) { tokens.push({ type: 'name', text: name[0], index: i }); i += name[0].length; }
    else if (ch === '`') i = readQuotedName(source, i, tokens);
    else if ('+-−*/^'.includes(ch)) { tokens.push({ type: 'operator', text: ch === '−' ? '-' : ch, index: i }); i++; }
    else if (ch === '(' || ch === ')' || ch === ',') { tokens.push({ type: ch, text: ch, index: i }); i++; }
    else if (ch === ';' && options.decimalMark === ',') { tokens.push({ type: ',', text: ch, index: i }); i++; }
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
