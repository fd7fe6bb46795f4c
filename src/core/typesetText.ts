/**
 * Text written for every host, typeset where the host typesets: the pipeline's messages (findings,
 * the checks' notes, the range's cut) are shared with the command line and write the terminal's forms
 * ("[-3.4, 12.3]", "9.88e-11"); the app and the report show them with the true minus (U+2212) and
 * the power of ten ("9.88 × 10⁻¹¹"), as every table beside them writes numbers (core/exponentText.ts).
 * Only a hyphen that opens a number is changed, never one inside a word ("linear-quadratic").
 */
import { NO_BREAK_SPACE, powerOfTen, TRUE_MINUS } from './exponentText';

/** "9.88e-11" → "9.88 × 10⁻¹¹", "[-3.4, 12.3]" → "[−3.4, 12.3]"; the digits as written. */
export function typesetText(text: string): string {
  return text
    .replace(/(^|[^\w.])(-?\d+(?:\.\d+)?)e([+-]?\d+)\b/g, (_, before: string, m: string, e: string) => `${before}${m.replace('-', TRUE_MINUS)}${NO_BREAK_SPACE}×${NO_BREAK_SPACE}${powerOfTen(Number(e))}`)
    .replace(/(^|[\s[(,=])-(?=\d|\.\d)/g, `$1${TRUE_MINUS}`);
}
