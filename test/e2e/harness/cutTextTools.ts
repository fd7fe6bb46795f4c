/**
 * The tools every measure of harness/cutText.ts shares inside the page: the findings kept (one per
 * element and kind, the largest), computed styles read once per element, what a person can see, an
 * element's name for the report, a text's width in a given font (canvas measureText) and whether an
 * element draws a box. Runs in the page: self-contained (its source is sent, cutText.ts).
 */
import type { CutFinding } from './cutText';

export interface CutTools {
  say(kind: CutFinding['kind'], text: string, px: number): void;
  findings(): CutFinding[];
  slack: number;
  fold(s: string | null | undefined): string;
  style(e: Element): CSSStyleDeclaration;
  seen(e: Element): boolean;
  /** Screen-reader text: a box of 2 px or less that clips (the app's .sr-only). */
  unseenBox(e: Element): boolean;
  nameOf(e: Element): string;
  textWidth(text: string, s: CSSStyleDeclaration): number;
  drawsBox(e: Element): boolean;
}

export function cutTools(slack: number): CutTools {
  const found = new Map<string, CutFinding>();
  const say = (kind: CutFinding['kind'], text: string, px: number) => {
    const key = `${kind}\u0000${text}`, was = found.get(key);
    if (px > slack && (!was || was.px < px)) found.set(key, { kind, text: text.replace(/\s+/g, ' ').trim().slice(0, 80), px });
  };
  const fold = (s: string | null | undefined) => (s ?? '').replace(/\s+/g, ' ').trim();
  const styles = new Map<Element, CSSStyleDeclaration>();
  const style = (e: Element) => styles.get(e) ?? styles.set(e, getComputedStyle(e)).get(e)!;
  const seen = (e: Element) => e.checkVisibility({ opacityProperty: true, visibilityProperty: true });
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
  const findings = () => [...found.values()].sort((x, y) => y.px - x.px);
  return { say, findings, slack, fold, style, seen, unseenBox, nameOf, textWidth, drawsBox };
}
