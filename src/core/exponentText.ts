/**
 * A number too small or too large for fixed notation, written once for every host. Typeset text (the
 * app, the figures, the report) writes it as a power of ten, "9.88 × 10⁻¹¹" (ISO 80000-1 §7.3 writes a
 * power of ten with ×; common practice): "9.88e−11" is a programmer's notation and "9.88e-11" read on a
 * card as a difference. The terminal writes the ASCII exponent form "9.88e-11", which a user can type,
 * search and paste into a script or a spreadsheet as it reads. The host is named by its minus sign: the
 * typeset text's U+2212, the terminal's hyphen-minus (figures/parts/uncertainNumber.ts re-exports both).
 * The space around × is a no-break space (U+00A0), so a line never ends at "9.88 ×".
 */

/** The minus sign of typeset numbers (ISO 80000-2; typographic practice). */
export const TRUE_MINUS = '\u2212';
/** The terminal's minus: the hyphen-minus a user would type. */
export const ASCII_MINUS = '-';
export type Minus = typeof TRUE_MINUS | typeof ASCII_MINUS;

/** The no-break space (U+00A0) that holds a number to its unit sign or to "× 10ⁿ" in typeset text. */
export const NO_BREAK_SPACE = '\u00a0';

const SUPERSCRIPT_DIGITS = '⁰¹²³⁴⁵⁶⁷⁸⁹';

/** "10⁻¹¹" from −11; "10⁰" from 0. */
export function powerOfTen(exponent: number): string {
  const digits = String(Math.abs(exponent)).replace(/\d/g, (d) => SUPERSCRIPT_DIGITS[Number(d)]);
  return `10${exponent < 0 ? '⁻' : ''}${digits}`;
}

/**
 * `v` in exponent form with `fractionDigits` digits after the mantissa's point (trailing zeros dropped
 * unless `keepZeros`): typeset "9.88 × 10⁻¹¹", terminal "9.88e-11". A mantissa of 1 stays ("1 × 10⁻⁵"),
 * so the form never changes with the value.
 */
export function exponentText(v: number, fractionDigits: number, minus: Minus = TRUE_MINUS, keepZeros = false): string {
  const [mantissa, exponent] = v.toExponential(Math.min(100, Math.max(0, fractionDigits))).split('e');
  const m = keepZeros ? mantissa : mantissa.replace(/(\.\d*?)0+$/, '$1').replace(/\.$/, '');
  const e = Number(exponent);
  if (minus === ASCII_MINUS) return `${m}e${e}`;
  return `${m.replace('-', TRUE_MINUS)}${NO_BREAK_SPACE}×${NO_BREAK_SPACE}${powerOfTen(e)}`;
}
