/**
 * The head of a data file read as the whole file would be (src/data/sourceHead.ts): its text is a
 * prefix of sourceText's for plain UTF-8, and every other file goes sourceText's way unchanged.
 * The byte sequences are the UTF-8 encoding scheme's (RFC 3629 §3); the mark is Unicode §23.8's.
 */
import { describe, expect, it } from 'vitest';
import { sourceHead } from '../../src/data/sourceHead';
import { sourceText } from '../../src/data/sourceText';

const utf8 = (text: string) => new TextEncoder().encode(text);

function concat(...parts: Uint8Array[]): Uint8Array {
  const out = new Uint8Array(parts.reduce((n, p) => n + p.length, 0));
  let at = 0;
  for (const p of parts) { out.set(p, at); at += p.length; }
  return out;
}

describe('the head of a data file', () => {
  it('keeps back a multi-byte character cut by the head end instead of writing U+FFFD for it', () => {
    const bytes = utf8('cost_€,level\n1,2\n3,4\n5,6\n'); // € is E2 82 AC at bytes 5..7
    for (const headBytes of [6, 7]) {
      const head = sourceHead(bytes, headBytes);
      expect(head).toMatchObject({ ok: true, whole: false, text: 'cost_', encoding: 'UTF-8', how: 'detected' });
    }
    const whole = sourceText(bytes);
    const head = sourceHead(bytes, 8);
    expect(head.ok && whole.ok && whole.text.startsWith(head.text) && head.text).toBe('cost_€');
  });

  it('drops the byte-order mark and says it was there', () => {
    const bytes = concat(new Uint8Array([0xef, 0xbb, 0xbf]), utf8('a,b\n1,2\n3,4\n'));
    expect(sourceHead(bytes, 6)).toMatchObject({ ok: true, whole: false, text: 'a,b', how: 'byte-order mark' });
  });

  it('reads a file no longer than the head whole, as sourceText does', () => {
    const bytes = concat(new Uint8Array([0xef, 0xbb, 0xbf]), utf8('a,b\n1,2'));
    expect(sourceHead(bytes, bytes.length)).toEqual({ ...sourceText(bytes), whole: true });
  });

  it('reads the whole file where a byte after the head makes it Windows-1252 (0xE9 alone is not UTF-8)', () => {
    const bytes = concat(utf8('a,b\n1,2\n'), new Uint8Array([0xe9, 0x0a]));
    const head = sourceHead(bytes, 4);
    expect(head).toEqual({ ...sourceText(bytes), whole: true });
    expect(head).toMatchObject({ encoding: 'Windows-1252', text: 'a,b\n1,2\né\n' });
  });

  it('refuses a zero byte after the head with the same words and offset as sourceText', () => {
    const bytes = concat(utf8('a,b\n1,2\n'), new Uint8Array([0x31, 0x00, 0x0a]));
    const head = sourceHead(bytes, 4);
    expect(head).toEqual({ ...sourceText(bytes), whole: true });
    expect(head.ok ? '' : head.reason).toContain('zero byte at byte 10');
  });

  it('reads UTF-16 whole (its mark FF FE), as sourceText does', () => {
    const text = '\ufeffa;b\r\n1;2\r\n';
    const bytes = new Uint8Array(text.length * 2);
    for (let i = 0; i < text.length; i++) { bytes[2 * i] = text.charCodeAt(i) & 0xff; bytes[2 * i + 1] = text.charCodeAt(i) >> 8; }
    const head = sourceHead(bytes, 4);
    expect(head).toEqual({ ...sourceText(bytes), whole: true });
    expect(head).toMatchObject({ encoding: 'UTF-16LE', text: 'a;b\r\n1;2\r\n' });
  });
});
