/**
 * How a run label is written (src/core/runLabelText.ts): the cell's text in straight double quotes, and a
 * quote, backslash or control character inside escaped as a JSON string escapes it (RFC 8259 §7), so the
 * text shown is the text a project file holds.
 */
import { describe, expect, it } from 'vitest';
import { runLabelText, runNameText, runSpanText } from '../../src/core/runLabelText';

describe('run labels as written', () => {
  it('keeps a plain or numeric label as its cell reads, in straight double quotes', () => {
    expect(runLabelText('007')).toBe('"007"');
    expect(runLabelText('1.0')).toBe('"1.0"');
    expect(runLabelText('Charge 7 – Ü')).toBe('"Charge 7 – Ü"');
  });

  it('escapes a quote or a backslash inside, as RFC 8259 §7 does (review39: "a"b" was ambiguous)', () => {
    expect(runLabelText('a"b')).toBe('"a\\"b"');
    expect(runLabelText('C:\\runs')).toBe('"C:\\\\runs"');
    expect(JSON.parse(runLabelText('a"b'))).toBe('a"b');
  });

  it('names a run by label, or by line without a run column', () => {
    expect(runNameText({ label: '17', line: 5002 })).toBe('run "17"');
    expect(runNameText({ label: null, line: 5002 })).toBe('the run from line 5,002');
    expect(runSpanText({ label: '1', line: 2 }, { label: '17', line: 9 })).toBe('runs "1" to "17"');
    expect(runSpanText({ label: '1', line: 2 }, { label: null, line: 9 })).toBeNull();
  });
});
