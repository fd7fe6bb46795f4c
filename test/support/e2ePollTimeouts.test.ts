/**
 * Every `expect.poll` in the end-to-end tests states its wait (POLL, or a timeout of its own). The
 * default is one second (vitest's documented default for expect.poll), which a loaded CI machine
 * overruns: a save that took longer failed a clean CI run ("Matcher did not succeed in time").
 * Scans the test sources; a call's arguments are read by matching its parentheses.
 */
import { readdirSync, readFileSync, statSync } from 'node:fs';
import { join, relative, resolve } from 'node:path';
import { describe, expect, it } from 'vitest';

const ROOTS = [resolve(__dirname, '../e2e'), resolve(__dirname, '../renderer/e2e')];

function sources(folder: string): string[] {
  return readdirSync(folder).flatMap((name) => {
    const path = join(folder, name);
    return statSync(path).isDirectory() ? sources(path) : /\.ts$/.test(name) ? [path] : [];
  });
}

/** The calls `expect.poll(…)` with a single argument: their line numbers. */
function pollsWithoutOptions(text: string): number[] {
  const found: number[] = [];
  for (let at = text.indexOf('expect.poll('); at >= 0; at = text.indexOf('expect.poll(', at + 1)) {
    let depth = 0, commas = 0, quote: string | null = null;
    for (let i = at + 'expect.poll'.length; i < text.length; i++) {
      const c = text[i];
      if (quote) {
        if (c === '\\') i++;
        else if (c === quote) quote = null;
        continue;
      }
      if (c === '"' || c === "'" || c === '`') quote = c;
      else if ('([{'.includes(c)) depth++;
      else if (')]}'.includes(c)) {
        depth--;
        if (depth === 0) break;
      } else if (c === ',' && depth === 1) commas++;
    }
    if (commas === 0) found.push(text.slice(0, at).split('\n').length);
  }
  return found;
}

describe('e2e waits', () => {
  it('finds a poll without options, and passes one with them (the scanner itself)', () => {
    expect(pollsWithoutOptions('await expect.poll(() => f(a, b)).toBe(1);\nawait expect.poll(() => g(), POLL).toBe(2);')).toEqual([1]);
    expect(pollsWithoutOptions("await expect.poll(() => t(')'), { timeout: 5 }).toBe(1);")).toEqual([]);
  });

  it('gives every expect.poll in the e2e tests a stated wait', () => {
    const bare = ROOTS.flatMap(sources).flatMap((path) => pollsWithoutOptions(readFileSync(path, 'utf8')).map((line) => `${relative(resolve(__dirname, '../..'), path)}:${line}`));
    expect(bare).toEqual([]);
  });
});
