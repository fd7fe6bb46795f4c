/**
 * Text a person sees cut off, spilled out of its box or lying over other text, measured in the page as
 * laid out (getBoundingClientRect, Range.getClientRects, clientWidth/scrollWidth, canvas measureText).
 * The rule and what it accepts, written before it was first measured, and its measurements: test/battery/README.md
 * ("Text a person sees cut"). Kinds of finding, each with the pixels cut or overlapping:
 * - select: the selected option's text plus the select's own chrome (border, padding, arrow) is wider than the select;
 * - input: a text or number field's value is wider than its content box;
 * - textarea: a text box under 12 lines high holds more lines than it shows (a taller one scrolls by design);
 * - cut: a line of text reaches past an ancestor with overflow-x hidden or clip;
 * - spill: a line of text reaches past its nearest block ancestor that draws a box (border or background);
 * - sideways: the window, or a scroll box holding no table, scrolls sideways;
 * - overlap: lines of text of two different blocks (paragraph, cell, SVG <text>), or a line and a form control it is not inside, overlap.
 * Accepted by rule: an ellipsis whose words a title gives whole (hover shows them); a table's scroll box
 * scrolling sideways; text not meant to be seen (2 px boxes for screen readers, hidden, zero size).
 * Deterministic: the layout of a given page at a given size, no timing.
 */
import type { Page } from 'playwright-core';
import { measureFields, measureSelects, measureTextBoxes } from './cutTextControls';
import { lineInBoxes, measureSideways, seenLines } from './cutTextLines';
import { blockOf, measureOverlaps } from './cutTextOverlaps';
import { cutTools } from './cutTextTools';

/** More than this many pixels is a finding (layout rounds to fractions of a pixel; the slack of svgLayout.ts). */
export const CUT_SLACK_PX = 1;

export interface CutFinding { kind: 'select' | 'input' | 'textarea' | 'cut' | 'spill' | 'sideways' | 'overlap'; text: string; px: number }

/** Findings inside `rootSelector` (the whole page by default), one per element and kind, largest first. */
export function cutTextFindings(page: Page, rootSelector = 'body'): Promise<CutFinding[]> {
  return page.evaluate(`(${measureCutText})(${JSON.stringify({ rootSelector, slack: CUT_SLACK_PX })}, ${inPage})`);
}

/** One finding as a line of the review's report, with where it was seen ("tank-levels findings 1280 dark"). */
export function cutTextLine(where: string, f: CutFinding): string {
  const said = { select: 'select cuts its choice', input: 'field cuts its value', textarea: 'text box cuts its text', cut: 'text cut by its box', spill: 'text runs out of its box', sideways: 'scrolls sideways', overlap: 'text overlaps' }[f.kind];
  return `${where}: ${said} “${f.text}” by ${f.px.toFixed(0)} px`;
}

/** The measures, each a function of its own file, sent to the page as source in one object (the page knows no imports). */
const MEASURES = { cutTools, measureSelects, measureFields, measureTextBoxes, lineInBoxes, seenLines, measureSideways, blockOf, measureOverlaps };
const inPage = `{ ${Object.entries(MEASURES).map(([name, f]) => `${name}: ${f}`).join(', ')} }`;

/** Runs in the page: self-contained, its measures given (Playwright sends its source). The order of the measures is the rule's. */
function measureCutText({ rootSelector, slack }: { rootSelector: string; slack: number }, m: typeof MEASURES): CutFinding[] {
  const root = document.querySelector(rootSelector);
  if (!root) return [];
  scrollTo(0, 0); // the sticky bars in their own place, over nothing
  const t = m.cutTools(slack);
  m.measureSelects(root, t);
  m.measureFields(root, t);
  m.measureTextBoxes(root, t);
  const lines = m.seenLines(root, t, m.lineInBoxes);
  m.measureSideways(root, t);
  m.measureOverlaps(root, lines, t, m.blockOf);
  return t.findings();
}
