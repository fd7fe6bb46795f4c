/**
 * Every documented exit status of the command line (README, "Exit status"), checked in-process
 * through runCli, with hostile files: devices, pipes, other people's files as data, --out over an
 * input, and names full of terminal escapes. None of these may hang, crash or echo a file.
 */
import { execFileSync, spawn } from 'node:child_process';
import { copyFile, mkdir, mkdtemp, readFile, rm, symlink, writeFile } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import { join, resolve } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { runCli } from '../../src/cli/run';
import { recordingTerminal, terminalText } from '../../src/cli/terminal';

const SAMPLE = resolve(__dirname, '../../sample-projects/tank-levels');
const DIVERGING = resolve(__dirname, '../fixtures/cli');

async function cli(...args: string[]) {
  const terminal = recordingTerminal();
  const code = await runCli(args, terminal);
  return { code, stdout: terminal.stdout, stderr: terminal.stderr };
}

describe('exit statuses', () => {
  let root: string, project: string, projectText: string;
  beforeAll(async () => {
    root = await mkdtemp(join(tmpdir(), 'spc-exit-'));
    await copyFile(join(SAMPLE, 'tank-levels.spcritic'), join(root, 'tank.spcritic'));
    await copyFile(join(SAMPLE, 'tank-levels.csv'), join(root, 'tank-levels.csv'));
    project = join(root, 'tank.spcritic');
    projectText = await readFile(project, 'utf8');
  });
  afterAll(() => rm(root, { recursive: true, force: true }));

  const withData = async (name: string, dataPath: string): Promise<string> => {
    const path = join(root, `${name}.spcritic`);
    await writeFile(path, JSON.stringify({ ...JSON.parse(projectText), data: { path: dataPath } }));
    return path;
  };

  it('0: a good project evaluates', async () => {
    const { code, stderr } = await cli('evaluate', project, '--resamples', '20');
    expect(stderr).toBe('');
    expect(code).toBe(0);
  });

  it('1: a missing project, an unknown field, /dev/zero or /dev/urandom as data, a pipe as project', async () => {
    expect((await cli('evaluate', join(root, 'none.spcritic'))).code).toBe(1);
    await writeFile(join(root, 'typo.spcritic'), JSON.stringify({ ...JSON.parse(projectText), quadratureNode: 64 }));
    const typo = await cli('evaluate', join(root, 'typo.spcritic'));
    expect(typo.code).toBe(1);
    expect(typo.stderr).toContain('did you mean "quadratureNodes"?');
    for (const device of ['/dev/zero', '/dev/urandom']) {
      const run = await cli('evaluate', await withData('device', device));
      expect(run.code).toBe(1);
      expect(run.stderr).toContain('it is a device, not a regular file');
    }
    const fifo = join(root, 'pipe.spcritic');
    execFileSync('mkfifo', [fifo]);
    const piped = await cli('evaluate', fifo);
    expect(piped.code).toBe(1);
    expect(piped.stderr).toContain('it is a pipe (FIFO), not a regular file');
  });

  it("1: another file as data is refused without echoing a line of it", async () => {
    await writeFile(join(root, 'secret.txt'), 'root:x:0:0:root:/root:/bin/bash\nexport API_TOKEN=abc123\n');
    const run = await cli('evaluate', await withData('secret', 'secret.txt'));
    expect(run.code).toBe(1);
    expect(run.stderr).not.toMatch(/root|API_TOKEN|abc123/);
  });

  it('2: wrong usage, and --out naming an input (also through a link)', async () => {
    expect((await cli('frobnicate')).code).toBe(2);
    expect((await cli('evaluate')).code).toBe(2);
    expect((await cli('evaluate', project, '--resamples', '3')).code).toBe(2);
    for (const out of [project, join(root, 'tank-levels.csv')]) {
      const run = await cli('report', project, '--out', out);
      expect(run.code).toBe(2);
      expect(run.stderr).toMatch(/Not writing the report to .*: it is the (project file|project’s data file)/);
    }
    await symlink(project, join(root, 'link.html'));
    expect((await cli('report', project, '--out', join(root, 'link.html'))).code).toBe(2);
    expect(await readFile(project, 'utf8')).toBe(projectText);
    expect((await cli('report', project, '--out', join(root, 'other.spcritic'))).code).toBe(2);
  });

  it('3: a linear fit that diverges (spectral radius 1.59 of the update, computed independently with numpy)', async () => {
    const folder = join(root, 'diverging');
    await mkdir(folder);
    await copyFile(join(DIVERGING, 'diverging.spcritic'), join(folder, 'diverging.spcritic'));
    await copyFile(join(DIVERGING, 'diverging.csv'), join(folder, 'diverging.csv'));
    const run = await cli('evaluate', join(folder, 'diverging.spcritic'), '--resamples', '20');
    expect(run.stdout).toMatch(/spectral-radius estimate of the update 1\.59/);
    expect(run.code).toBe(3);
  });

  it('141: the output closed before it was all written (a reader that stops, as `head` does) ends the run quietly', async () => {
    // A real process: the reader of its stdout is gone before it writes, so its first write meets EPIPE.
    const child = spawn(process.execPath, ['--import', 'tsx', 'src/cli/main.ts', 'evaluate', project, '--json', '--resamples', '20'], {
      cwd: resolve(__dirname, '../..'), stdio: ['ignore', 'pipe', 'pipe'],
    });
    child.stdout.destroy();
    let stderr = '';
    child.stderr.on('data', (chunk: Buffer) => { stderr += chunk.toString(); });
    const code = await new Promise<number | null>((done) => child.on('close', done));
    expect(stderr).not.toMatch(/Error|EPIPE|\n\s+at /);
    expect(code).toBe(141);
  }, 120_000);

  it('70 is for a bug only: an exception inside the program', async () => {
    const terminal = recordingTerminal();
    const broken = { ...terminal, out: () => { throw new TypeError('a bug'); } };
    expect(await runCli(['--help'], broken)).toBe(70);
    expect(terminal.stderr).toContain('Internal error: a bug');
  });
});

describe('terminal output', () => {
  it('NUL, control characters, ANSI escapes and bidirectional overrides are shown, never acted on', () => {
    const shown = terminalText('level\u0000\u001b[31mred\u001b]0;title\u0007\u009b2J\u202eevil\r\n\tok');
    expect(shown).toBe('level\\u0000\\u001b[31mred\\u001b]0;title\\u0007\\u009b2J\\u202eevil\\u000d\n\tok');
    expect(JSON.parse(terminalText(JSON.stringify({ name: 'a\u009bb\u202ec' })))).toEqual({ name: 'a\u009bb\u202ec' });
  });
});
