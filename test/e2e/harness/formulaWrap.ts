/**
 * A formula broken across lines: every text node of the page (or of `within`) holding one of `formulas`
 * is measured character by character (Range.getBoundingClientRect), and a formula whose characters sit
 * on more than one line is reported with its text (a space and a no-break space match alike). The Method step's "(1/(1 − γ))" broke as "(1/(1 −" | "γ))"
 * at 1280 px, seen only in a picture (core/formulaText.ts holds a formula with no-break spaces).
 */
import type { Page } from 'playwright-core';

export function brokenFormulas(page: Page, formulas: readonly string[], within = 'body'): Promise<string[]> {
  return page.evaluate(({ formulas, within }) => {
    const root = document.querySelector(within);
    if (!root) return [];
    const found: string[] = [];
    const walker = document.createTreeWalker(root, NodeFilter.SHOW_TEXT);
    for (let node = walker.nextNode(); node; node = walker.nextNode()) {
      // Spaces of either kind match, so a formula written with plain spaces is found too (and is seen to break).
      const text = (node.textContent ?? '').replace(/\u00a0/g, ' ');
      for (const formula of formulas.map((f) => f.replace(/\u00a0/g, ' '))) {
        for (let at = text.indexOf(formula); at >= 0; at = text.indexOf(formula, at + 1)) {
          const boxes: DOMRect[] = [];
          for (let i = at; i < at + formula.length; i++) {
            const range = document.createRange();
            range.setStart(node, i);
            range.setEnd(node, i + 1);
            const box = range.getBoundingClientRect();
            if (box.width > 0) boxes.push(box);
          }
          // A glyph from a fallback font (γ) may sit a pixel or two off its neighbours: a new line starts below the first one's bottom.
          if (boxes.some((b) => b.top >= boxes[0].bottom - 1)) found.push(`"${formula}" breaks across lines in “${text.slice(0, 80)}”`);
        }
      }
    }
    return found;
  }, { formulas, within });
}
