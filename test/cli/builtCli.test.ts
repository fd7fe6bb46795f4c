/**
 * The built command line (npm run build:cli, vite.cli.config.ts) against the sources run through
 * tsx: the test builds its own copy (inside the repository, so npm packages resolve from
 * node_modules as they do for out/cli), then runs it as a program. It must answer --help and
 * --version, give the README's exit statuses (1 for a missing project file, 2 for wrong usage), and
 * print the same `evaluate --json` as the sources on a sample project, every number equal (only the
 * evaluation's clock time, `evaluatedAt`, is taken out). The same run shows that the helper thread
 * started from its own built file (the result's `assessment.settings.threads` says the model
 * rollouts ran on a second thread; a thread that could not start says why instead) and that a
 * linear run loads no TensorFlow.js module (Node's CommonJS cache, where the ES import of its
 * CommonJS build lands — the same check as startupImports.test.ts, with a control that it can see
 * one). No time is measured here (npm run bench -- cli-start does that).
 */
import { spawn } from 'node:child_process';
import { readdir, readFile, rm, writeFile } from 'node:fs/promises';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { ROLLOUT_THREAD_NOTE } from '../../src/pipeline/perDecisionRoute';

const root = join(__dirname, '..', '..');
const built = join(root, 'test-artifacts', `built-cli-${process.pid}`);
const main = join(built, 'main.js');
const sample = join(root, 'sample-projects', 'heating-historian', 'heating-historian.spcritic');

type Ran = { code: number | null; stdout: string; stderr: string };

/** Runs a program to its end, collecting its output (never throws on a non-zero status). */
function run(command: string, args: string[]): Promise<Ran> {
  return new Promise((done, fail) => {
    const child = spawn(command, args, { cwd: root, stdio: ['ignore', 'pipe', 'pipe'] });
    let stdout = '', stderr = '';
    child.stdout.setEncoding('utf8').on('data', (text: string) => (stdout += text));
    child.stderr.setEncoding('utf8').on('data', (text: string) => (stderr += text));
    child.on('error', fail);
    child.on('close', (code) => done({ code, stdout, stderr }));
  });
}

/** Loaded first in a process (--import): at exit, writes how many @tensorflow modules Node's CommonJS cache holds. */
const PROBE = [
  "import { createRequire } from 'node:module';",
  "const cache = createRequire(import.meta.url).cache;",
  "process.on('exit', () => process.stderr.write(`\\ntensorflow modules: ${Object.keys(cache).filter((k) => k.includes('@tensorflow')).length}\\n`));",
].join('\n');
const tensorflowModules = (ran: Ran) => Number(/tensorflow modules: (\d+)/.exec(ran.stderr)?.[1]);

/** The evaluate --json output without its clock time, the one field that differs between two runs. */
function withoutClockTime(stdout: string): Record<string, unknown> {
  const json = JSON.parse(stdout) as Record<string, unknown>;
  expect(typeof json.evaluatedAt).toBe('string');
  delete json.evaluatedAt;
  return json;
}

describe('the built command line', () => {
  beforeAll(async () => {
    const vite = join(root, 'node_modules', 'vite', 'bin', 'vite.js');
    const build = await run(process.execPath, [vite, 'build', '--config', 'vite.cli.config.ts', '--outDir', built]);
    expect(build.code, build.stderr).toBe(0);
    await writeFile(join(built, 'probe.mjs'), PROBE);
  }, 60_000);
  afterAll(() => rm(built, { recursive: true, force: true }));

  it('runs as a program: --version says the package version, --help the usage', async () => {
    const { version } = JSON.parse(await readFile(join(root, 'package.json'), 'utf8')) as { version: string };
    expect(await readFile(main, 'utf8')).toMatch(/^#!\/usr\/bin\/env node\n/);
    const shown = await run(main, ['--version']); // through its shebang, as npm's bin link runs it
    expect(shown).toEqual({ code: 0, stdout: `setpoint-critic ${version}\n`, stderr: '' });
    const help = await run(process.execPath, [main, '--help']);
    expect(help.code).toBe(0);
    expect(help.stdout).toMatch(/^Usage:\n {2}setpoint-critic evaluate/);
  }, 30_000);

  it('exits as the README says: 1 for a missing project file, 2 for wrong usage', async () => {
    const missing = await run(process.execPath, [main, 'evaluate', 'no-such-project.spcritic']);
    expect(missing.code).toBe(1);
    expect(missing.stderr).toContain('no-such-project.spcritic');
    expect((await run(process.execPath, [main, 'estimate', sample])).code).toBe(2);
    expect((await run(process.execPath, [main])).code).toBe(2);
  }, 30_000);

  it('prints the same evaluate --json as the sources, with the helper thread, and without TensorFlow.js', async () => {
    const args = ['evaluate', sample, '--json', '--resamples', '200'];
    const [fromBuild, fromSource] = await Promise.all([
      run(process.execPath, ['--import', join(built, 'probe.mjs'), main, ...args]),
      run(process.execPath, ['--import', 'tsx', join(root, 'src', 'cli', 'main.ts'), ...args]),
    ]);
    expect(fromBuild.code, fromBuild.stderr).toBe(0);
    expect(fromSource.code, fromSource.stderr).toBe(0);
    const json = withoutClockTime(fromBuild.stdout);
    expect(json).toEqual(withoutClockTime(fromSource.stdout));
    expect((json.assessment as { settings: { threads: string } }).settings.threads).toContain(ROLLOUT_THREAD_NOTE);
    expect(tensorflowModules(fromBuild)).toBe(0);
  }, 60_000);

  it('keeps TensorFlow.js out of main.js: only a chunk loaded by a network fit imports it, and the probe sees that import', async () => {
    const files = (await readdir(built)).filter((f) => f.endsWith('.js'));
    const importsTensorflow = async (f: string) => /^import .*"@tensorflow\/tfjs"/m.test(await readFile(join(built, f), 'utf8'));
    const chunks = (await Promise.all(files.map(async (f) => ((await importsTensorflow(f)) ? f : null)))).filter((f) => f !== null);
    expect(chunks.length).toBeGreaterThan(0);
    expect(chunks).not.toContain('main.js');
    expect(chunks).not.toContain('resampleThread.js');
    const control = await run(process.execPath, ['--import', join(built, 'probe.mjs'), '--input-type=module', '-e', "await import('@tensorflow/tfjs');"]);
    expect(tensorflowModules(control)).toBeGreaterThan(0);
  }, 60_000);
});
