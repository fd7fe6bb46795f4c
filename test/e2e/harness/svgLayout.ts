/**
 * Text layout of an exported SVG as Chromium lays it out: every <text> element's box, then the
 * faults — two boxes that overlap by more than 1 px both ways, or a box that leaves the image.
 * Used on the plot page's exports (plots.test.ts) and on the files the app itself wrote.
 */
import type { Locator, Page } from 'playwright-core';

export interface TextBox { text: string; left: number; top: number; right: number; bottom: number }
export interface SvgLayout { width: number; height: number; texts: TextBox[] }

/** Pairs of text boxes that overlap by more than 1 px both ways, and boxes that leave the image. */
export function layoutFaults(laid: SvgLayout): string[] {
  const faults: string[] = [], t = laid.texts, slack = 1;
  for (const b of t) {
    if (b.left < -slack || b.top < -slack || b.right > laid.width + slack || b.bottom > laid.height + slack) faults.push(`"${b.text}" leaves the image (${b.left.toFixed(1)}, ${b.top.toFixed(1)})–(${b.right.toFixed(1)}, ${b.bottom.toFixed(1)})`);
  }
  for (let i = 0; i < t.length; i++) {
    for (let j = i + 1; j < t.length; j++) {
      const w = Math.min(t[i].right, t[j].right) - Math.max(t[i].left, t[j].left), h = Math.min(t[i].bottom, t[j].bottom) - Math.max(t[i].top, t[j].top);
      if (w > slack && h > slack) faults.push(`"${t[i].text}" overlaps "${t[j].text}" by ${w.toFixed(1)} × ${h.toFixed(1)} px`);
    }
  }
  return faults;
}

/** The text boxes of an SVG document placed at its pixel size in `page` (removed again afterwards). */
export function svgLayoutIn(page: Page, svg: string, widthPx: number, heightPx: number): Promise<SvgLayout> {
  return page.evaluate(([text, width, height]) => {
    const host = document.createElement('div');
    host.style.cssText = `position:absolute;left:0;top:0;width:${width}px;height:${height}px;`;
    const parsed = new DOMParser().parseFromString(text, 'image/svg+xml').documentElement;
    host.appendChild(document.importNode(parsed, true));
    document.body.appendChild(host);
    try {
      const root = host.querySelector('svg')!;
      root.setAttribute('width', `${width}px`);
      root.setAttribute('height', `${height}px`);
      const origin = root.getBoundingClientRect();
      const texts = Array.from(root.querySelectorAll('text'), (t) => {
        const r = t.getBoundingClientRect();
        return { text: t.textContent ?? '', left: r.left - origin.left, top: r.top - origin.top, right: r.right - origin.left, bottom: r.bottom - origin.top };
      });
      return { width: origin.width, height: origin.height, texts: texts.filter((t) => t.text.trim() !== '' && t.right > t.left) };
    } finally {
      host.remove();
    }
  }, [svg, widthPx, heightPx] as const);
}

/** The widest option's text against the room inside a <select> (its padding and the arrow taken off). */
export function selectRoom(select: Locator): Promise<{ longest: number; room: number; longestText: string }> {
  return select.evaluate((el) => {
    const sel = el as HTMLSelectElement, cs = getComputedStyle(sel);
    const ctx = document.createElement('canvas').getContext('2d')!;
    ctx.font = `${cs.fontStyle} ${cs.fontWeight} ${cs.fontSize} ${cs.fontFamily}`;
    const widths = [...sel.options].map((o) => ({ text: o.text, width: ctx.measureText(o.text).width }));
    const widest = widths.reduce((a, b) => (b.width > a.width ? b : a));
    // Chromium draws the drop-down arrow inside the padding box, about 20 px wide (measured, not specified).
    return { longest: widest.width, longestText: widest.text, room: sel.clientWidth - parseFloat(cs.paddingLeft) - parseFloat(cs.paddingRight) - 20 };
  });
}
