/**
 * A share's number and its "%" never part at a line's end in the app or the report: the one share
 * writer holds them with a no-break space (U+00A0; SI Brochure §5.4.7 sets a space before % — common
 * practice), and the command line writes a plain space in its place, one character for one, so its
 * columns, which count characters, still line up.
 */
import { describe, expect, it } from 'vitest';
import { shareText, sharesText } from '../../src/core/shareText';
import { textTable } from '../../src/cli/textTable';
import { recordingTerminal } from '../../src/cli/terminal';

const NBSP = '\u00a0';

describe('the space between a share and its %', () => {
  it('is a no-break space in the one share writer, for every form it writes', () => {
    expect(shareText(0.028)).toBe(`2.8${NBSP}%`);
    expect(shareText(5e-8)).toBe(`below 0.01${NBSP}%`);
    expect(shareText(1)).toBe(`100${NBSP}%`);
    expect(sharesText([0.028, 0.0281])).toEqual([`2.80${NBSP}%`, `2.81${NBSP}%`]);
    for (const text of [shareText(0.0629), ...sharesText([0.269, 0.028])]) expect(text).not.toMatch(/\d %/);
  });

  it('reaches the terminal as a plain space, with the table’s columns still aligned', () => {
    const table = textTable([['policy', 'share', 'note'], ['present', shareText(0.028), 'x'], ['retuned PI', shareText(0.269), 'y'], ['slow', shareText(5e-8), 'z']]);
    const terminal = recordingTerminal();
    terminal.out(`${table}\n`);
    const lines = terminal.stdout.trimEnd().split('\n');
    expect(terminal.stdout).not.toContain(NBSP);
    expect(lines[1]).toContain('2.8 %');
    // Right-aligned share column: every row's share ends at one column, and the note starts at one column.
    const ends = lines.slice(1).map((l) => l.indexOf('%'));
    expect(new Set(ends).size).toBe(1);
    expect(new Set(lines.map((l) => l.length)).size).toBe(1);
  });
});
