/**
 * A formula written into running text, held on one line: its spaces become no-break spaces (U+00A0),
 * so "(1/(1 − γ))" never wraps as "(1/(1 −" | "γ))". Chromium's line breaking (Unicode UAX #14) finds no
 * other break inside such a group: none after the solidus before "(", none at the minus sign or a
 * bracket (measured in Chromium with the app's own stylesheet, 2026-12-05, every viewport width 700 to
 * 1920 px; the help line under the Method step's discount broke at 1280 px with plain spaces). The one
 * way left to break it is a box narrower than the formula itself, where the app's `overflow-wrap: anywhere`
 * (app.css, .panel) may split it rather than spill out of the box. Where nothing wraps, plain text files,
 * each no-break space is written as a plain space, so a search typed with spaces finds the formula: the
 * command line's text and --json (cli/terminal.ts) and the app's table CSV and clipboard copy
 * (renderer components/tableText.ts plainCellText). The report (HTML, PDF) is laid out in lines and keeps them.
 */
import { NO_BREAK_SPACE } from './exponentText';

/** The formula with every space a no-break space: formulaText('1/(1 − γ)'). */
export function formulaText(text: string): string {
  return text.replace(/ /g, NO_BREAK_SPACE);
}

/** The effective horizon of a discount γ in logged steps, as every sentence writes it (common practice). */
export const HORIZON_FORMULA = formulaText('1/(1 − γ)');
