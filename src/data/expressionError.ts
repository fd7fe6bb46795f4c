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

/** The expression with a caret under character `index`, as two indented lines. */
export function caretDisplay(source: string, index: number): string {
  const oneLine = source.replace(/[\r\n\t]/g, ' ');
  return `  ${oneLine}\n  ${' '.repeat(Math.max(0, index))}^`;
}
