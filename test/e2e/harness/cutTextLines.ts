/**
 * Lines of text against the boxes around them (findings 3 and 4 of harness/cutText.ts's rule), and the
 * part of each line a person sees, which the overlaps compare. Runs in the page: self-contained.
 */
import type { CutTools } from './cutTextTools';

/** A line of text as seen: its text node, the element holding it, and the part its clipping ancestors let through. */
export interface SeenLine { node: Text; el: Element; r: DOMRect }

/**
 * One line of text against its ancestors: the nearest that draws a box must hold it, one that clips
 * sideways must not cut it unless by an ellipsis with a title. Returns the line as far as the clipping
 * ancestors let it be seen, or null where none of it is (screen-reader text, a row scrolled out of its
 * table's box).
 */
export function lineInBoxes(el: Element, line: DOMRect, t: CutTools): DOMRect | null {
  let boxChecked = false, cutChecked = false, seenPart = line;
  for (let a: Element | null = el; a && a !== document.documentElement; a = a.parentElement) {
    if (t.unseenBox(a)) return null;
    const s = t.style(a), box = a.getBoundingClientRect();
    if (!boxChecked && s.overflowX === 'visible' && t.drawsBox(a)) {
      boxChecked = true;
      t.say('spill', t.nameOf(a), Math.max(line.right - box.right, box.left - line.left));
    }
    if (s.overflowX === 'visible' && s.overflowY === 'visible') continue;
    const left = box.left + a.clientLeft, top = box.top + a.clientTop, right = left + a.clientWidth, bottom = top + a.clientHeight;
    if (s.overflowX !== 'visible' && !cutChecked) {
      cutChecked = true; // past a scroll box, text is reached by scrolling (whether it may scroll sideways is finding 5)
      const px = Math.max(line.right - right, left - line.left), tip = el.closest('[title]')?.getAttribute('title');
      const meant = s.textOverflow === 'ellipsis' && tip !== undefined && t.fold(tip).includes(t.fold(a.textContent));
      if (!['auto', 'scroll'].includes(s.overflowX) && !meant) t.say('cut', t.nameOf(a), px);
    }
    const x0 = s.overflowX === 'visible' ? seenPart.left : Math.max(seenPart.left, left), x1 = s.overflowX === 'visible' ? seenPart.right : Math.min(seenPart.right, right);
    const y0 = s.overflowY === 'visible' ? seenPart.top : Math.max(seenPart.top, top), y1 = s.overflowY === 'visible' ? seenPart.bottom : Math.min(seenPart.bottom, bottom);
    if (x1 - x0 <= 0.5 || y1 - y0 <= 0.5) return null;
    seenPart = new DOMRect(x0, y0, x1 - x0, y1 - y0);
  }
  return seenPart;
}

/** Every visible line of text under `root`, each checked against its boxes by `inBoxes` (lineInBoxes, passed in: the page knows no imports). */
export function seenLines(root: Element, t: CutTools, inBoxes: typeof lineInBoxes): SeenLine[] {
  const lines: SeenLine[] = [];
  const walker = document.createTreeWalker(root, NodeFilter.SHOW_TEXT);
  const range = document.createRange();
  for (let node = walker.nextNode() as Text | null; node; node = walker.nextNode() as Text | null) {
    const el = node.parentElement;
    if (!el || !node.data.trim() || ['OPTION', 'SCRIPT', 'STYLE', 'TITLE', 'TEXTAREA'].includes(el.tagName) || !t.seen(el)) continue;
    // A closed <details>' own text (not its summary's) is laid out but not drawn; checkVisibility sees only the <details>.
    if (el instanceof HTMLDetailsElement && !el.open) continue;
    range.selectNodeContents(node);
    for (const r of range.getClientRects()) {
      if (r.width <= 0.5 || r.height <= 0.5) continue;
      const line = inBoxes(el, r, t);
      if (line) lines.push({ node, el, r: line });
    }
  }
  return lines;
}

/** 5. Sideways scrolling: the window, and scroll boxes that hold no table. */
export function measureSideways(root: Element, t: CutTools): void {
  const page = document.documentElement;
  t.say('sideways', 'the window', page.scrollWidth - page.clientWidth);
  for (const box of root.querySelectorAll('*')) {
    const s = t.style(box);
    if ((s.overflowX === 'auto' || s.overflowX === 'scroll') && t.seen(box) && !box.querySelector(':scope > table')) t.say('sideways', t.nameOf(box), box.scrollWidth - box.clientWidth);
  }
}
