/** Text into HTML safely, and numbers as a reviewer reads them (the report's one number style). */
import { isoTimeText } from '../../core/clockText';
import { plainNumber } from '../../figures/parts/uncertainNumber';

const ESCAPES: Record<string, string> = { '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' };

/** Escape text for HTML content and attribute values (OWASP XSS prevention, rule 1; common practice). */
export function escapeHtml(text: string): string {
  return text.replace(/[&<>"']/g, (c) => ESCAPES[c]);
}

/** Tagged template that escapes every interpolated value unless it is already Html. */
export interface Html {
  readonly html: string;
}

export function raw(html: string): Html {
  return { html };
}

export function html(strings: TemplateStringsArray, ...values: (string | number | Html | Html[] | null | undefined)[]): Html {
  let out = strings[0];
  values.forEach((v, i) => {
    out += piece(v) + strings[i + 1];
  });
  return { html: out };
}

function piece(v: string | number | Html | Html[] | null | undefined): string {
  if (v === null || v === undefined) return '';
  if (Array.isArray(v)) return v.map((h) => h.html).join('');
  if (typeof v === 'object') return v.html;
  return escapeHtml(String(v));
}

/** Six significant digits, trailing zeros dropped; the one plain number style (figures/parts/uncertainNumber.ts): fixed notation up to 1e15, exponent form beyond and below 1e-4; "—" for none. */
export function formatNumber(v: number | null | undefined, digits = 6): string {
  return v === null || v === undefined || !Number.isFinite(v) ? '—' : plainNumber(v, digits);
}

/** "2 December 2026, 14:41 UTC" from an ISO 8601 time; the text itself when it is not one. */
export function formatWrittenAt(iso: string): string {
  return isoTimeText(iso, 'full');
}
