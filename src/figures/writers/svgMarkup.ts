/**
 * Small pieces of SVG text: XML escaping (XML 1.0 §2.4 — & and < always, quotes inside attribute
 * values), compact numbers, CSS colours split into colour + opacity (so viewers that ignore
 * rgba() in SVG still get the transparency), and Chart.js font strings split into attributes.
 */
export function escapeXml(text: string): string {
  // Characters XML 1.0 forbids outright (C0 controls except tab, LF, CR) are dropped.
  return text.replace(/[\u0000-\u0008\u000b\u000c\u000e-\u001f]/g, '')
    .replace(/&/g, '&amp;').replace(/</g, '&lt;').replace(/>/g, '&gt;').replace(/"/g, '&quot;').replace(/'/g, '&apos;');
}

/** At most 3 decimals (a thousandth of a pixel), no trailing zeros, no "-0". */
export function svgNumber(v: number): string {
  const r = Math.round(v * 1000) / 1000;
  return String(r === 0 ? 0 : r);
}

export function attributes(values: Record<string, string | number | null | undefined>): string {
  return Object.entries(values)
    .filter((entry): entry is [string, string | number] => entry[1] !== null && entry[1] !== undefined)
    .map(([k, v]) => ` ${k}="${typeof v === 'number' ? svgNumber(v) : escapeXml(v)}"`)
    .join('');
}

export interface Paint {
  readonly colour: string;
  readonly opacity: number;
}

/** rgb()/rgba(), #rgb, #rrggbb, #rrggbbaa and 'transparent'; other CSS colour names pass through. */
export function parsePaint(css: string): Paint {
  const text = css.trim().toLowerCase();
  if (text === 'transparent') return { colour: 'none', opacity: 0 };
  const fn = /^rgba?\(\s*([\d.]+)\s*,\s*([\d.]+)\s*,\s*([\d.]+)\s*(?:,\s*([\d.]+%?)\s*)?\)$/.exec(text);
  if (fn) {
    const alpha = fn[4] === undefined ? 1 : fn[4].endsWith('%') ? parseFloat(fn[4]) / 100 : parseFloat(fn[4]);
    return { colour: `rgb(${Math.round(+fn[1])},${Math.round(+fn[2])},${Math.round(+fn[3])})`, opacity: alpha };
  }
  const hex = /^#([0-9a-f]{3}|[0-9a-f]{6}|[0-9a-f]{8})$/.exec(text);
  if (hex) {
    const h = hex[1].length === 3 ? hex[1].split('').map((c) => c + c).join('') : hex[1];
    return { colour: `#${h.slice(0, 6)}`, opacity: h.length === 8 ? parseInt(h.slice(6), 16) / 255 : 1 };
  }
  return { colour: text, opacity: 1 };
}

export interface FontParts {
  readonly style: string;
  readonly weight: string;
  readonly sizePx: number;
  readonly family: string;
}

/** Chart.js writes fonts as "[style] [weight] <size>px [/lineHeight] <family>". */
export function parseFont(css: string): FontParts {
  const m = /^\s*(italic|oblique|normal)?\s*(bold|bolder|lighter|normal|[1-9]00)?\s*([\d.]+)px(?:\s*\/\s*\S+)?\s+(.+)$/.exec(css);
  if (!m) return { style: 'normal', weight: 'normal', sizePx: 10, family: 'sans-serif' };
  return { style: m[1] ?? 'normal', weight: m[2] ?? 'normal', sizePx: parseFloat(m[3]), family: m[4].trim() };
}
