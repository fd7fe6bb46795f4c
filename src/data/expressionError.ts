/** A fault in a reward/cost expression, located at a character of its source. */
export class ExpressionError extends Error {
  /** 0-based index of the offending character in `source`. */
  readonly index: number;
  readonly source: string;
  readonly reason: string;

  constructor(reason: string, source: string, index: number) {
    super(`${reason} (character ${index + 1})\n${caretDisplay(source, index)}`);
    this.name = 'ExpressionError';
    this.reason = reason;
    this.source = source;
    this.index = index;
  }
}

/** Characters of the expression shown around the caret (a long one is cut with "…" on either side). */
const SHOWN = 60;

/** The expression with a caret under character `index`, as two indented lines; control characters shown as spaces. */
export function caretDisplay(source: string, index: number): string {
  const from = Math.max(0, Math.min(index - SHOWN / 2, source.length - SHOWN));
  const to = Math.min(source.length, from + SHOWN);
  const shown = (from > 0 ? '…' : '') + source.slice(from, to).replace(/[\p{Cc}\p{Cf}]/gu, ' ') + (to < source.length ? '…' : '');
  const caret = index - from + (from > 0 ? 1 : 0);
  return `  ${shown}\n  ${' '.repeat(Math.max(0, caret))}^`;
}
