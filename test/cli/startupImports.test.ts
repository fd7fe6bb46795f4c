/**
 * The command line loads TensorFlow.js only for a network fit (src/pipeline/fitNetworkCandidate.ts
 * imports the network modules when it is called): its import is most of a linear run's start-up
 * time. Checked in a fresh process, as the CLI starts: after importing the CLI's modules, Node's
 * CommonJS module cache (where TensorFlow.js's CommonJS build lands) holds no @tensorflow module;
 * and, so that the check can fail, the same cache does hold them once the network side is imported.
 * No time is measured here (npm run bench does that).
 */
import { execFileSync } from 'node:child_process';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';

const root = join(__dirname, '..', '..');

/** @tensorflow modules in the CommonJS cache of a fresh Node process after importing `modules` from the repository root. */
function tensorflowModulesAfter(modules: string[]): number {
  const code = [
    "import { createRequire } from 'node:module';",
    "import { pathToFileURL } from 'node:url';",
    `for (const m of ${JSON.stringify(modules)}) await import(pathToFileURL(m).href);`,
    "console.log(Object.keys(createRequire(import.meta.url).cache).filter((k) => k.includes('@tensorflow')).length);",
  ].join('\n');
  const out = execFileSync(process.execPath, ['--import', 'tsx', '--input-type=module', '-e', code], { cwd: root, encoding: 'utf8' });
  return Number(out.trim().split('\n').pop());
}

describe('the command line’s start', () => {
  it('does not load TensorFlow.js with its modules', () => {
    expect(tensorflowModulesAfter([join(root, 'src', 'cli', 'run.ts')])).toBe(0);
  }, 60_000);

  it('loads it with the network fit’s modules (so the check above can see it)', () => {
    expect(tensorflowModulesAfter([join(root, 'src', 'cli', 'run.ts'), join(root, 'src', 'core', 'fqe', 'networkFqe.ts')])).toBeGreaterThan(0);
  }, 60_000);
});
