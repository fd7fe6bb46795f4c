/**
 * Before any test runs: build the app (`electron-vite build` → out/main, out/preload, out/renderer)
 * so the e2e tests serve the renderer as shipped, and so `npm test` works on a fresh clone. The
 * build is skipped when out/renderer is newer than every source and config file it depends on;
 * set SETPOINT_FORCE_BUILD=1 to build regardless.
 *
 * A failed build does not stop the unit tests: its output is handed to the tests as
 * `inject('rendererBuildError')`, and launchApp() fails with it, so only the e2e tests fail.
 */
import { execFileSync } from 'node:child_process';
import { mkdirSync, readdirSync, rmSync, statSync } from 'node:fs';
import { dirname, join, resolve } from 'node:path';
import { fileURLToPath } from 'node:url';
import type { TestProject } from 'vitest/node';

declare module 'vitest' {
  export interface ProvidedContext {
    /** null when out/ is built and fresh; else the failed build's output. */
    rendererBuildError: string | null;
  }
}

const root = resolve(dirname(fileURLToPath(import.meta.url)), '../..');
const builtMarker = join(root, 'out/renderer/index.html');
const inputs = ['src', 'electron.vite.config.ts', 'package.json', 'package-lock.json', 'tsconfig.json'];

function newestModified(path: string): number {
  let stats;
  try {
    stats = statSync(path);
  } catch {
    return 0;
  }
  if (!stats.isDirectory()) return stats.mtimeMs;
  return readdirSync(path).reduce((newest, name) => Math.max(newest, newestModified(join(path, name))), stats.mtimeMs);
}

function buildIsFresh(): boolean {
  const built = newestModified(builtMarker);
  return built > 0 && inputs.every((input) => newestModified(join(root, input)) < built);
}

// Two test runs at once (two engineers, one tree) must not build into out/ at the same time.
const lockFolder = join(root, 'test-artifacts/.build-lock');
const STALE_LOCK_MS = 5 * 60 * 1000;

async function withBuildLock(build: () => void): Promise<void> {
  mkdirSync(dirname(lockFolder), { recursive: true });
  for (;;) {
    try {
      mkdirSync(lockFolder);
      break;
    } catch {
      if (Date.now() - newestModified(lockFolder) > STALE_LOCK_MS) rmSync(lockFolder, { recursive: true, force: true });
      else await new Promise((r) => setTimeout(r, 250));
    }
  }
  try {
    build();
  } finally {
    rmSync(lockFolder, { recursive: true, force: true });
  }
}

export default async function setup(project: TestProject): Promise<void> {
  project.provide('rendererBuildError', null);
  const force = process.env.SETPOINT_FORCE_BUILD === '1';
  if (!force && buildIsFresh()) return;
  await withBuildLock(() => {
    if (!force && buildIsFresh()) return; // another run built it while this one waited
    buildApp(project);
  });
}

function buildApp(project: TestProject): void {
  try {
    execFileSync('npx', ['electron-vite', 'build', '--logLevel', 'warn'], { cwd: root, stdio: 'pipe', timeout: 300_000, encoding: 'utf8' });
  } catch (e) {
    const { stdout, stderr } = e as { stdout?: string; stderr?: string };
    const output = `${stdout ?? ''}\n${stderr ?? ''}`.trim().split('\n').slice(-40).join('\n');
    project.provide('rendererBuildError', `npx electron-vite build failed:\n${output || String(e)}`);
  }
}
