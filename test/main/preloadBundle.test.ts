import { existsSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';

// A sandboxed preload can require only 'electron' and a few Node built-ins (Electron docs,
// "Process Sandboxing": "the preload script … can only require a subset of modules"), so the built
// preload must be one self-contained CommonJS file. Built by test/e2e/globalSetup.ts.
const preload = join(__dirname, '../../out/preload/index.cjs');

describe('built preload', () => {
  it.skipIf(!existsSync(preload))('requires nothing but electron', () => {
    const text = readFileSync(preload, 'utf8');
    const required = [...text.matchAll(/require\(["']([^"']+)["']\)/g)].map((m) => m[1]);
    expect(new Set(required)).toEqual(new Set(['electron']));
    expect(text).not.toMatch(/^import /m);
  });
});
