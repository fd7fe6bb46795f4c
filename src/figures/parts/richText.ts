/**
 * Labels with superscripts and subscripts, typeset on a canvas (or SvgContext): V^{π}(s),
 * Q^{π}(s, a), E_{a~π}. Markup: "^{…}" raises and "_{…}" lowers the braced text (one level, no
 * nesting), everything else is plain. Scripts are set at 70 % of the size, raised by 0.35 em or
 * lowered by 0.2 em — the usual proportions of a text face's superior and inferior figures (common
 * practice; TeX's defaults are close: script size 70 %, sup shift ≈ 0.36 em).
 */
export type ScriptKind = 'plain' | 'sup' | 'sub';

export interface TextRun {
  readonly text: string;
  readonly kind: ScriptKind;
}

/** "proportional gain K_c (%/°C)" → "proportional gain K_{c} (%/°C)": a one-letter symbol's subscript written plainly becomes markup. */
export function subscriptMarkup(label: string): string {
  return label.replace(/\b([A-Za-z])_([A-Za-z0-9]+)\b/g, '$1_{$2}');
}

export const RICH_TEXT_DEFAULTS = { scriptScale: 0.7, supShiftEm: 0.35, subShiftEm: 0.2 } as const;

/** "V^{π}(s)" → [V][π sup][(s)]. An unclosed brace is read as plain text. */
export function parseRichText(markup: string): TextRun[] {
  const runs: TextRun[] = [];
  let plain = '';
  for (let i = 0; i < markup.length; i++) {
    const ch = markup[i];
    const close = (ch === '^' || ch === '_') && markup[i + 1] === '{' ? markup.indexOf('}', i + 2) : -1;
    if (close < 0) {
      plain += ch;
      continue;
    }
    if (plain) runs.push({ text: plain, kind: 'plain' });
    plain = '';
    runs.push({ text: markup.slice(i + 2, close), kind: ch === '^' ? 'sup' : 'sub' });
    i = close;
  }
  if (plain) runs.push({ text: plain, kind: 'plain' });
  return runs;
}

/** The markup as plain text, for tooltips, summaries and file names: "V^{π}" → "Vπ". */
export function plainText(markup: string): string {
  return parseRichText(markup).map((r) => r.text).join('');
}

/** The markup as HTML (sup/sub elements), escaping the text. */
export function richTextHtml(markup: string, escape: (text: string) => string): string {
  return parseRichText(markup).map((r) => (r.kind === 'plain' ? escape(r.text) : `<${r.kind}>${escape(r.text)}</${r.kind}>`)).join('');
}

export interface FontSpec {
  sizePx: number;
  family: string;
  weight: 'normal' | 'bold';
}

function fontOf(f: FontSpec, kind: ScriptKind): string {
  const size = kind === 'plain' ? f.sizePx : f.sizePx * RICH_TEXT_DEFAULTS.scriptScale;
  return `${f.weight === 'bold' ? 'bold ' : ''}${size}px ${f.family}`;
}

/** Width of the typeset label in px. */
export function measureRichText(ctx: CanvasRenderingContext2D, markup: string, f: FontSpec): number {
  ctx.save();
  let width = 0;
  for (const run of parseRichText(markup)) {
    ctx.font = fontOf(f, run.kind);
    width += ctx.measureText(run.text).width;
  }
  ctx.restore();
  return width;
}

/**
 * Draw the label with its vertical middle at (x, y): align says which end x is, rotation is
 * in radians (−π/2 reads bottom to top). The context's fillStyle is used.
 */
export function drawRichText(ctx: CanvasRenderingContext2D, markup: string, x: number, y: number, f: FontSpec, align: 'left' | 'center' | 'right', rotation = 0): void {
  const width = measureRichText(ctx, markup, f);
  const d = RICH_TEXT_DEFAULTS;
  ctx.save();
  ctx.translate(x, y);
  if (rotation) ctx.rotate(rotation);
  ctx.textAlign = 'left';
  ctx.textBaseline = 'middle';
  let at = align === 'left' ? 0 : align === 'center' ? -width / 2 : -width;
  for (const run of parseRichText(markup)) {
    ctx.font = fontOf(f, run.kind);
    const shift = run.kind === 'sup' ? -d.supShiftEm * f.sizePx : run.kind === 'sub' ? d.subShiftEm * f.sizePx : 0;
    ctx.fillText(run.text, at, shift);
    at += ctx.measureText(run.text).width;
  }
  ctx.restore();
}
