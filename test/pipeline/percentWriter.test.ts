/**
 * Every percentage the engineer reads comes from the one share writer (core/shareText.ts): no source
 * file writes one by hand, "(100 * x).toFixed(1) %" and the like, which drift from it in precision and
 * in the no-break space before "%". One writing of 100·x is not a share and stays: a percentile's
 * ordinal ("its 90th percentile"). The one writer itself is skipped.
 */
import { readdirSync, readFileSync, statSync } from 'node:fs';
import { join, relative, resolve } from 'node:path';
import { describe, expect, it } from 'vitest';

const SRC = resolve(__dirname, '../../src');
const NOT_SHARES = new Set(['pipeline/assessSlices.ts', 'core/shareText.ts']);
const BY_HAND = [/100 \* /, /\* 100\)?\.to(Fixed|Precision)/, /\.to(Fixed|Precision)\(\d\)\}\s?%/, /\}%\)/];

function sources(dir: string): string[] {
  return readdirSync(dir).flatMap((name) => {
    const path = join(dir, name);
    return statSync(path).isDirectory() ? sources(path) : /\.tsx?$/.test(name) ? [path] : [];
  });
}

describe('percentages by the one share writer', () => {
  it('no source file writes a percentage by hand', () => {
    const found: string[] = [];
    for (const file of sources(SRC)) {
      const name = relative(SRC, file).replace(/\\/g, '/');
      if (NOT_SHARES.has(name)) continue;
      readFileSync(file, 'utf8').split('\n').forEach((line, i) => {
        if (/^\s*(\/\/|\*)/.test(line) || /aria-value|style=\{\{/.test(line)) return; // comments; a progress bar's width and value are not text
        if (BY_HAND.some((p) => p.test(line))) found.push(`${name}:${i + 1}: ${line.trim().slice(0, 100)}`);
      });
    }
    expect(found).toEqual([]);
  });
});
