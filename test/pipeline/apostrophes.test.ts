/**
 * One apostrophe in the words the engineer reads: the typographic ’ (U+2019), which most of the
 * app's, the report's and the command line's sentences already used (the screen review found the
 * straight ' mixed in among them). The terminal gets the same sentences: it already prints "—", "−"
 * and "γ", so UTF-8 is assumed there too. Two scans: every string an assessment of each sample
 * project produces (warnings, notes, the method, verdict sentences), and every string written in
 * src/ outside comments, which also covers messages the samples do not raise. Our house style, not
 * an outside fact.
 */
import { readFile, readdir } from 'node:fs/promises';
import { join, relative } from 'node:path';
import { describe, expect, it } from 'vitest';
import { assessProject } from '../../src/pipeline/assessProject';
import { openProject } from '../../src/pipeline/openProject';

const ROOT = join(__dirname, '..', '..');
/** A straight apostrophe between letters ("candidate's", "don't"), or after a plural's s before a word ("runs' ends"; not a quoted key before "in" or "as"). */
const STRAIGHT = /[A-Za-z](?:'|\\')[A-Za-z]|[a-z]s' (?!in |as )[a-z]/;

function strings(value: unknown, out: string[] = []): string[] {
  if (typeof value === 'string') out.push(value);
  else if (Array.isArray(value)) value.forEach((v) => strings(v, out));
  else if (value && typeof value === 'object') Object.values(value).forEach((v) => strings(v, out));
  return out;
}

async function sourceFiles(folder: string): Promise<string[]> {
  const entries = await readdir(folder, { withFileTypes: true });
  const nested = await Promise.all(entries.map((e) => (e.isDirectory() ? sourceFiles(join(folder, e.name)) : Promise.resolve(/\.tsx?$/.test(e.name) ? [join(folder, e.name)] : []))));
  return nested.flat();
}

describe('one apostrophe in user text', () => {
  it.each(['heating-loop', 'tank-levels', 'heating-historian'])('every sentence of an assessment of the %s sample', async (sample) => {
    const folder = join(ROOT, 'sample-projects', sample);
    const opened = await openProject(await readFile(join(folder, `${sample}.spcritic`), 'utf8'), `${sample}.spcritic`, async (p) => new Uint8Array(await readFile(join(folder, p))));
    if (!opened.ok) throw new Error(opened.problems.map((p) => p.message).join('\n'));
    const { project, dataset, warnings } = opened.value;
    const result = await assessProject({ project, dataset, settings: { resamples: 40, level: 0.9, seed: 4, sensitivity: false } });
    if (!result.ok) throw new Error(result.problems.map((p) => p.message).join('\n'));
    const texts = [...strings(result.value), ...strings(warnings)];
    expect(texts.length).toBeGreaterThan(20);
    expect(texts.filter((t) => STRAIGHT.test(t))).toEqual([]);
  }, 300_000);

  it('every string written in src/, outside comments', async () => {
    const found: string[] = [];
    for (const file of await sourceFiles(join(ROOT, 'src'))) {
      (await readFile(file, 'utf8')).split('\n').forEach((line, i) => {
        const code = line.trimStart();
        if (/^(\/\/|\*|\/\*)/.test(code)) return;
        // The code before a trailing "// …" comment (a "//" inside a string is rare enough to read by hand here).
        const beforeComment = code.replace(/\s\/\/\s.*$/, '').replace(/\{\/\*.*\*\/\}/g, '');
        if (STRAIGHT.test(beforeComment)) found.push(`${relative(ROOT, file)}:${i + 1}: ${code.slice(0, 120)}`);
      });
    }
    expect(found).toEqual([]);
  });
});
