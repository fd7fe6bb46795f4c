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

/** More than this many pixels is a finding (layout rounds to fractions of a pixel; the slack of svgLayout.ts). */
export const CUT_SLACK_PX = 1;

export interface CutFinding { kind: 'select' | 'input' | 'textarea' | 'cut' | 'spill' | 'sideways' | 'overlap'; text: string; px: number }

/** Findings inside `rootSelector` (the whole page by default), one per element and kind, largest first. */
export function cutTextFindings(page: Page, rootSelector = 'body'): Promise<CutFinding[]> {
  return page.evaluate(measureCutText, { rootSelector, slack: CUT_SLACK_PX });
}

/** One finding as a line of the review's report, with where it was seen ("tank-levels findings 1280 dark"). */
export function cutTextLine(where: string, f: CutFinding): string {
  const said = { select: 'select cuts its choice', input: 'field cuts its value', textarea: 'text box cuts its text', cut: 'text cut by its box', spill: 'text runs out of its box', sideways: 'scrolls sideways', overlap: 'text overlaps' }[f.kind];
  return `${where}: ${said} “${f.text}” by ${f.px.toFixed(0)} px`;
}

/** Runs in the page: self-contained (Playwright sends its source). */
function measureCutText({ rootSelector, slack }: { rootSelector: string; slack: number }): CutFinding[] {
  const root = document.querySelector(rootSelector);
  if (!root) return [];
  scrollTo(0, 0); // the sticky bars in their own place, over nothing
  const found = new Map<string, CutFinding>();
  const say = (kind: CutFinding['kind'], text: string, px: number) => {
    const key = `${kind}\u0000${text}`, was = found.get(key);
    if (px > slack && (!was || was.px < px)) found.set(key, { kind, text: text.replace(/\s+/g, ' ').trim().slice(0, 80), px });
  };
  const fold = (s: string | null | undefined) => (s ?? '').replace(/\s+/g, ' ').trim();
  const styles = new Map<Element, CSSStyleDeclaration>();
  const style = (e: Element) => styles.get(e) ?? styles.set(e, getComputedStyle(e)).get(e)!;
  const seen = (e: Element) => e.checkVisibility({ opacityProperty: true, visibilityProperty: true });
  // Screen-reader text: a box of 2 px or less that clips (the app's .sr-only).
  const unseenBox = (e: Element) => { const s = style(e); return s.overflowX !== 'visible' && ((e as HTMLElement).clientWidth <= 2 || (e as HTMLElement).clientHeight <= 2); };
  const nameOf = (e: Element) => fold((e as HTMLElement).dataset?.testid ? `${e.tagName.toLowerCase()}[${(e as HTMLElement).dataset.testid}] ${e.textContent}` : `${e.tagName.toLowerCase()} ${e.textContent}`);
  const canvas = document.createElement('canvas').getContext('2d')!;
  const textWidth = (text: string, s: CSSStyleDeclaration) => {
    canvas.font = `${s.fontStyle} ${s.fontWeight} ${s.fontSize} ${s.fontFamily}`;
    return canvas.measureText(text).width;
  };

  const drawsBox = (e: Element) => {
    const s = style(e);
    if (s.display === 'inline' || s.display === 'contents') return false;
    const border = ['top', 'right', 'bottom', 'left'].some((side) => parseFloat(s.getPropertyValue(`border-${side}-width`)) > 0 && s.getPropertyValue(`border-${side}-style`) !== 'none');
    return border || !/^(rgba\(0, 0, 0, 0\)|transparent)$/.test(s.backgroundColor) || ['TD', 'TH', 'BUTTON'].includes(e.tagName);
  };
  /**
   * One line of text against its ancestors (findings 3 and 4): the nearest that draws a box must hold it,
   * one that clips sideways must not cut it unless by an ellipsis with a title. Returns the line as far as
   * the clipping ancestors let it be seen (for the overlaps), or null where none of it is (screen-reader
   * text, a row scrolled out of its table's box).
   */
  const horizontally = (el: Element, line: DOMRect): DOMRect | null => {
    let boxChecked = false, cutChecked = false, seenPart = line;
    for (let a: Element | null = el; a && a !== document.documentElement; a = a.parentElement) {
      if (unseenBox(a)) return null;
      const s = style(a), box = a.getBoundingClientRect();
      if (!boxChecked && s.overflowX === 'visible' && drawsBox(a)) {
        boxChecked = true;
        say('spill', nameOf(a), Math.max(line.right - box.right, box.left - line.left));
      }
      if (s.overflowX === 'visible' && s.overflowY === 'visible') continue;
      const left = box.left + a.clientLeft, top = box.top + a.clientTop, right = left + a.clientWidth, bottom = top + a.clientHeight;
      if (s.overflowX !== 'visible' && !cutChecked) {
        cutChecked = true; // past a scroll box, text is reached by scrolling (whether it may scroll sideways is finding 5)
        const px = Math.max(line.right - right, left - line.left), tip = el.closest('[title]')?.getAttribute('title');
        const meant = s.textOverflow === 'ellipsis' && tip !== undefined && fold(tip).includes(fold(a.textContent));
        if (!['auto', 'scroll'].includes(s.overflowX) && !meant) say('cut', nameOf(a), px);
      }
      const x0 = s.overflowX === 'visible' ? seenPart.left : Math.max(seenPart.left, left), x1 = s.overflowX === 'visible' ? seenPart.right : Math.min(seenPart.right, right);
      const y0 = s.overflowY === 'visible' ? seenPart.top : Math.max(seenPart.top, top), y1 = s.overflowY === 'visible' ? seenPart.bottom : Math.min(seenPart.bottom, bottom);
      if (x1 - x0 <= 0.5 || y1 - y0 <= 0.5) return null;
      seenPart = new DOMRect(x0, y0, x1 - x0, y1 - y0);
    }
    return seenPart;
  };

  // 1. Selects: the chrome is the auto width of a copy holding one empty option (its border, padding and arrow).
  for (const select of root.querySelectorAll('select')) {
    if (!seen(select) || select.selectedIndex < 0) continue;
    const copy = document.createElement('select');
    copy.className = select.className;
    copy.style.cssText = 'position:absolute;visibility:hidden;width:auto;min-width:0;max-width:none;';
    copy.append(new Option(''));
    select.parentElement!.append(copy);
    const chrome = copy.getBoundingClientRect().width;
    copy.remove();
    const text = select.options[select.selectedIndex].text, label = `${fold(select.labels?.[0]?.textContent) || select.getAttribute('aria-label') || 'select'}${select.dataset.testid ? ` [${select.dataset.testid}]` : ''}`;
    say('select', `${label}: ${text}`, textWidth(text, style(select)) + chrome - select.getBoundingClientRect().width);
  }
  // 2. Text and number fields: the value against the content box.
  for (const input of root.querySelectorAll<HTMLInputElement>('input:not([type]), input[type="text"], input[type="number"]')) {
    if (!seen(input) || !input.value) continue;
    const s = style(input), room = input.clientWidth - parseFloat(s.paddingLeft) - parseFloat(s.paddingRight);
    const label = fold(input.labels?.[0]?.textContent) || input.getAttribute('aria-label') || input.id;
    say('input', `${label}: ${input.value}`, textWidth(input.value, s) - room);
  }

  // 7 (in the rule's numbering). Text boxes: more lines than they show, unless 12 lines high or more.
  for (const area of root.querySelectorAll('textarea')) {
    if (!seen(area)) continue;
    const s = style(area), lineHeight = parseFloat(s.lineHeight) || 1.2 * parseFloat(s.fontSize);
    const label = fold(area.labels?.[0]?.textContent) || area.getAttribute('aria-label') || area.id;
    if (area.clientHeight < 12 * lineHeight) say('textarea', `${label}: ${area.value}`, area.scrollHeight - area.clientHeight);
  }

  // Every visible line of text, with the element holding it and the part of it its clipping ancestors let through.
  const lines: { node: Text; el: Element; r: DOMRect }[] = [];
  const walker = document.createTreeWalker(root, NodeFilter.SHOW_TEXT);
  const range = document.createRange();
  for (let node = walker.nextNode() as Text | null; node; node = walker.nextNode() as Text | null) {
    const el = node.parentElement;
    if (!el || !node.data.trim() || ['OPTION', 'SCRIPT', 'STYLE', 'TITLE', 'TEXTAREA'].includes(el.tagName) || !seen(el)) continue;
    // A closed <details>' own text (not its summary's) is laid out but not drawn; checkVisibility sees only the <details>.
    if (el instanceof HTMLDetailsElement && !el.open) continue;
    range.selectNodeContents(node);
    for (const r of range.getClientRects()) {
      if (r.width <= 0.5 || r.height <= 0.5) continue;
      const line = horizontally(el, r);
      if (line) lines.push({ node, el, r: line });
    }
  }
  // 5. Sideways scrolling: the window, and scroll boxes that hold no table.
  const page = document.documentElement;
  say('sideways', 'the window', page.scrollWidth - page.clientWidth);
  for (const box of root.querySelectorAll('*')) {
    const s = style(box);
    if ((s.overflowX === 'auto' || s.overflowX === 'scroll') && seen(box) && !box.querySelector(':scope > table')) say('sideways', nameOf(box), box.scrollWidth - box.clientWidth);
  }

  // 6. Overlaps: lines of different text nodes, and lines against controls they are not inside (sweep by top).
  const controls = [...root.querySelectorAll('select, textarea, input:not([type="checkbox"]):not([type="radio"]):not([type="range"]):not([type="hidden"])')].filter(seen);
  // Runs of one block (a paragraph, a cell, an SVG <text>) lie side by side by design: only different blocks are compared.
  // In an SVG a line with a superscript is written as sibling <text> pieces under one transform, raised less than a font size: its first piece stands for it.
  const at = (e: Element, k: string) => parseFloat(e.getAttribute(k) ?? '0') || 0;
  const sameLine = (a: Element, b: Element | null) => b?.tagName === 'text' && a.getAttribute('transform') === b.getAttribute('transform')
    && Math.abs(at(a, 'y') - at(b, 'y')) < Math.max(at(a, 'font-size'), at(b, 'font-size'), 1);
  const svgLine = (t: Element): Element => (sameLine(t, t.previousElementSibling) ? svgLine(t.previousElementSibling!) : t);
  const blockOf = (e: Element): Element => {
    const svgText = e.closest('svg text');
    if (svgText) return svgLine(svgText);
    return style(e).display === 'inline' && e.parentElement ? blockOf(e.parentElement) : e;
  };
  const boxes = [...lines.map((l) => ({ owner: blockOf(l.el) as Node, el: blockOf(l.el), r: l.r, text: fold(l.node.data) })),
    ...controls.map((c) => ({ owner: c as Node, el: c, r: c.getBoundingClientRect(), text: nameOf(c) || (c as HTMLInputElement).value }))]
    .sort((a, b) => a.r.top - b.r.top);
  for (let i = 0; i < boxes.length; i++) {
    const a = boxes[i];
    for (let j = i + 1; j < boxes.length && boxes[j].r.top < a.r.bottom - slack; j++) {
      const b = boxes[j];
      if (a.owner === b.owner || a.el.contains(b.el) || b.el.contains(a.el)) continue;
      const w = Math.min(a.r.right, b.r.right) - Math.max(a.r.left, b.r.left), h = Math.min(a.r.bottom, b.r.bottom) - Math.max(a.r.top, b.r.top);
      if (w > slack && h > slack) say('overlap', `${a.text.slice(0, 40)}” and “${b.text.slice(0, 40)}`, Math.min(w, h));
    }
  }
  return [...found.values()].sort((x, y) => y.px - x.px);
}
