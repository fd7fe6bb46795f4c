/**
 * Where the command line writes: stdout and stderr behind a small port (tests pass their own), with
 * every character that could act on a terminal instead of being shown — NUL and the other C0
 * controls but tab and line feed, DEL, the C1 controls (ESC and CSI start ANSI escape sequences,
 * ECMA-48 §5), and the Unicode controls that reorder or break lines (bidirectional embeddings and
 * isolates, Unicode TR9; line and paragraph separators) — written as a visible \uXXXX escape. Names
 * and cells come from users' files; a column called "\x1b]0;…\x07" must not retitle the terminal.
 * The escape is also JSON's, so JSON output stays valid and means the same. The no-break space that
 * typeset text puts between a number and its "%" (core/shareText.ts) is written as a plain space: a
 * terminal wraps at the column, not at spaces, and a user searches for "2.8 %" as typed. One character
 * for one, so columns already padded stay aligned.
 */
export interface Terminal {
  out(text: string): void;
  err(text: string): void;
}

const ACTIVE = /[\u0000-\u0008\u000b-\u001f\u007f-\u009f\u061c\u200e\u200f\u2028\u2029\u202a-\u202e\u2066-\u2069]/g;

export function terminalText(text: string): string {
  return text.replace(ACTIVE, (c) => `\\u${c.charCodeAt(0).toString(16).padStart(4, '0')}`).replace(/\u00a0/g, ' ');
}

export const processTerminal: Terminal = {
  out: (text) => void process.stdout.write(terminalText(text)),
  err: (text) => void process.stderr.write(terminalText(text)),
};

/** A terminal that keeps what was written, for tests and for running the CLI in-process. */
export function recordingTerminal(): Terminal & { stdout: string; stderr: string } {
  const recorded = {
    stdout: '', stderr: '',
    out: (text: string) => { recorded.stdout += terminalText(text); },
    err: (text: string) => { recorded.stderr += terminalText(text); },
  };
  return recorded;
}
