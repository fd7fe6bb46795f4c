/**
 * Unknown fields in a project are errors that name the field and the closest known one (a misspelt
 * setting silently replaced by its default would change results without a word); the user's own
 * remarks live in the documented free-form `notes`, which survives a parse and save unchanged.
 */
import { readFileSync } from 'node:fs';
import { resolve } from 'node:path';
import { describe, expect, it } from 'vitest';
import { parseProjectText, serializeProject } from '../../src/project/projectFile';

// eslint-disable-next-line @typescript-eslint/no-explicit-any -- a raw project document, edited field by field
type Raw = Record<string, any>;
const SAMPLE = JSON.parse(readFileSync(resolve(__dirname, '../../sample-projects/tank-levels/tank-levels.spcritic'), 'utf8'));

function problemsOf(edit: (doc: Raw) => void): { where: string; message: string }[] {
  const doc = structuredClone(SAMPLE);
  edit(doc);
  const loaded = parseProjectText(JSON.stringify(doc), 'p.spcritic');
  if (loaded.ok) throw new Error('accepted');
  return loaded.problems;
}

describe('unknown project fields', () => {
  it.each([
    ['quadratureNode', (d: Raw) => { d.quadratureNode = 64; }, 'p.spcritic, quadratureNode', 'did you mean "quadratureNodes"?'],
    ['rigde', (d: Raw) => { d.approximator.rigde = 1; }, 'p.spcritic, approximator.rigde', 'did you mean "ridge"?'],
    ['badrows', (d: Raw) => { d.data.csv.badrows = 'exclude'; }, 'p.spcritic, data.csv.badrows', 'did you mean "badRows"?'],
    ['bound', (d: Raw) => { d.candidates[0].bound = { lo: [0], hi: [1], mode: 'clip' }; }, 'p.spcritic, candidates[0].bound', 'did you mean "bounds"?'],
    ['comment', (d: Raw) => { d.comment = 'checked'; }, 'p.spcritic, comment', 'your own remarks belong in the top-level "notes"'],
  ])('%s is refused, naming the field and the closest known name', (_name, edit, where, message) => {
    const [first] = problemsOf(edit);
    expect(first.where).toBe(where);
    expect(first.message).toContain(message);
  });

  it('a huge unknown key is quoted cut short', () => {
    const [first] = problemsOf((d) => { d['x'.repeat(10_000)] = 1; });
    expect(first.message.length).toBeLessThan(600);
  });
});

describe('notes', () => {
  it('any JSON under notes survives parse and save unchanged', () => {
    const notes = { comment: 'reviewed with the shift lead', reviewedBy: 'A. Operator', checked: ['tank 1', 'tank 2'] };
    const loaded = parseProjectText(JSON.stringify({ ...SAMPLE, notes }), 'p.spcritic');
    expect(loaded.ok).toBe(true);
    if (!loaded.ok) return;
    expect(JSON.parse(serializeProject(loaded.value.document)).notes).toEqual(notes);
  });
});

describe('project files that are not projects', () => {
  it('a password file is refused without a word of it', () => {
    const loaded = parseProjectText('root:x:0:0:root:/root:/bin/bash\n', 'passwd');
    expect(loaded.ok).toBe(false);
    if (!loaded.ok) expect(JSON.stringify(loaded.problems)).not.toMatch(/root|bash/);
  });

  it('a syntax error says where, not what the text there is', () => {
    const loaded = parseProjectText('{\n"secret": "hunter2"\n"b": 2}', 'p.spcritic');
    expect(loaded.ok).toBe(false);
    if (!loaded.ok) {
      expect(loaded.problems[0].message).toBe('is not a readable project file (not valid JSON: line 3, column 1)');
    }
  });

  it('JSON nested 100,000 deep is refused before parsing', () => {
    const loaded = parseProjectText(`${'['.repeat(100_000)}${']'.repeat(100_000)}`, 'deep.spcritic');
    expect(loaded.ok).toBe(false);
    if (!loaded.ok) expect(loaded.problems[0].message).toContain('nests more than 10,000 levels deep');
  });
});
