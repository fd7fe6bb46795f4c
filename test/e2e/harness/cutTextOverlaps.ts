/**
 * Text lying over other text (finding 6 of harness/cutText.ts's rule): lines of different blocks
 * (paragraph, cell, SVG <text>), and lines against form controls they are not inside, compared in a
 * sweep by top. Runs in the page: self-contained.
 */
import type { SeenLine } from './cutTextLines';
import type { CutTools } from './cutTextTools';

/**
 * The block a line belongs to: runs of one block lie side by side by design, so only different blocks
 * are compared. In an SVG a line with a superscript is written as sibling <text> pieces under one
 * transform, raised less than a font size: its first piece stands for it.
 */
export function blockOf(e: Element, t: CutTools): Element {
  const at = (x: Element, k: string) => parseFloat(x.getAttribute(k) ?? '0') || 0;
  const sameLine = (a: Element, b: Element | null) => b?.tagName === 'text' && a.getAttribute('transform') === b.getAttribute('transform')
    && Math.abs(at(a, 'y') - at(b, 'y')) < Math.max(at(a, 'font-size'), at(b, 'font-size'), 1);
  const svgLine = (x: Element): Element => (sameLine(x, x.previousElementSibling) ? svgLine(x.previousElementSibling!) : x);
  const block = (x: Element): Element => {
    const svgText = x.closest('svg text');
    if (svgText) return svgLine(svgText);
    return t.style(x).display === 'inline' && x.parentElement ? block(x.parentElement) : x;
  };
  return block(e);
}

/** 6. Overlaps of the seen lines' blocks and the visible controls, each pair once (`block` is blockOf, passed in: the page knows no imports). */
export function measureOverlaps(root: Element, lines: SeenLine[], t: CutTools, block: typeof blockOf): void {
  const controls = [...root.querySelectorAll('select, textarea, input:not([type="checkbox"]):not([type="radio"]):not([type="range"]):not([type="hidden"])')].filter(t.seen);
  const boxes = [...lines.map((l) => ({ owner: block(l.el, t) as Node, el: block(l.el, t), r: l.r, text: t.fold(l.node.data) })),
    ...controls.map((c) => ({ owner: c as Node, el: c, r: c.getBoundingClientRect(), text: t.nameOf(c) || (c as HTMLInputElement).value }))]
    .sort((a, b) => a.r.top - b.r.top);
  for (let i = 0; i < boxes.length; i++) {
    const a = boxes[i];
    for (let j = i + 1; j < boxes.length && boxes[j].r.top < a.r.bottom - t.slack; j++) {
      const b = boxes[j];
      if (a.owner === b.owner || a.el.contains(b.el) || b.el.contains(a.el)) continue;
      const w = Math.min(a.r.right, b.r.right) - Math.max(a.r.left, b.r.left), h = Math.min(a.r.bottom, b.r.bottom) - Math.max(a.r.top, b.r.top);
      if (w > t.slack && h > t.slack) t.say('overlap', `${a.text.slice(0, 40)}” and “${b.text.slice(0, 40)}`, Math.min(w, h));
    }
  }
}
