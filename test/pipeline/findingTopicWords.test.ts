/**
 * Every warning topic written in src/ has a column and a title in the findings matrix
 * (src/pipeline/findingTopicWords.ts), so a new topic cannot ship untitled: the test reads the
 * sources for `topic: '…'` and for the topic constants (`…_TOPIC = '…'`, `const TOPIC = '…'`).
 */
import { readFile, readdir } from 'node:fs/promises';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { FINDING_COLUMNS, OTHER_COLUMN, TITLE_CHARACTERS, findingColumnOf } from '../../src/pipeline/findingTopicWords';

const SRC = join(__dirname, '..', '..', 'src');

async function sourceFiles(folder: string): Promise<string[]> {
  const entries = await readdir(folder, { withFileTypes: true });
  const nested = await Promise.all(entries.map((e) => (e.isDirectory() ? sourceFiles(join(folder, e.name)) : Promise.resolve(/\.tsx?$/.test(e.name) ? [join(folder, e.name)] : []))));
  return nested.flat();
}

async function topicsInSource(): Promise<Set<string>> {
  const found = new Set<string>();
  for (const file of await sourceFiles(SRC)) {
    const text = await readFile(file, 'utf8');
    for (const m of text.matchAll(/\btopic: '([A-Za-z]+)'|\b[A-Z_]*TOPIC = '([A-Za-z]+)'/g)) found.add(m[1] ?? m[2]);
  }
  return found;
}

describe('finding topics and their columns', () => {
  it('finds the topics the pipeline writes (the scan itself works)', async () => {
    const topics = await topicsInSource();
    for (const known of ['occupancyShift', 'importanceWeights', 'actionSupport', 'runOrder', 'plantMemory', 'unvisited', 'impossibleValue', 'crossCheck']) expect(topics).toContain(known);
  });

  it('gives every topic in src/ a column with a title', async () => {
    const untitled = [...await topicsInSource()].filter((t) => findingColumnOf(t) === OTHER_COLUMN);
    expect(untitled).toEqual([]);
  });

  it('puts each topic in one column only, and every column has a short title and a meaning', () => {
    const all = FINDING_COLUMNS.flatMap((c) => c.topics);
    expect(new Set(all).size).toBe(all.length);
    expect(new Set(FINDING_COLUMNS.map((c) => c.title)).size).toBe(FINDING_COLUMNS.length);
    for (const c of FINDING_COLUMNS) {
      expect(c.title.length, c.key).toBeLessThanOrEqual(TITLE_CHARACTERS);
      expect(c.meaning.length, c.key).toBeGreaterThan(10);
    }
  });
});
