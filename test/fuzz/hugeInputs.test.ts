/**
 * Inputs sized to exhaust memory (issue "hold under hostile input", family 4), each run as a real
 * child process with a V8 heap cap: a 200 MB CSV on one line and a 10 MB header line end with exit
 * 1 and a short message naming line 1 — no native abort (exit 134), no echo of the header (it was
 * 52 MB of stderr), and a peak resident memory bounded by the file's size plus a fixed margin.
 * Run time is printed, never asserted.
 */
import { execFile } from 'node:child_process';
import { copyFile, mkdtemp, open, rm, writeFile } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import { join, resolve } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';

const root = resolve(__dirname, '../..');

function cli(args: string[]): Promise<{ code: number | null; signal: string | null; stdout: string; stderr: string; seconds: number }> {
  const started = performance.now();
  return new Promise((done) => {
    execFile(process.execPath, ['--max-old-space-size=256', '--import', 'tsx', join(__dirname, 'cliWithPeakMemory.ts'), ...args], { cwd: root, maxBuffer: 1 << 26 }, (error, stdout, stderr) => {
      const code = error ? (typeof error.code === 'number' ? error.code : null) : 0;
      done({ code, signal: error?.signal ?? null, stdout, stderr, seconds: (performance.now() - started) / 1000 });
    });
  });
}

const peakMiB = (stderr: string): number => Number(/peak-rss-mib (\d+)/.exec(stderr)?.[1] ?? NaN);

describe('inputs sized to exhaust memory', () => {
  let folder: string;
  beforeAll(async () => {
    folder = await mkdtemp(join(tmpdir(), 'spc-huge-'));
    await copyFile(resolve(__dirname, 'fixtures/tiny.spcritic'), join(folder, 'tiny.spcritic'));
  });
  afterAll(() => rm(folder, { recursive: true, force: true }));

  it('a 200 MB CSV on a single line: exit 1 naming line 1, bounded memory, no abort', async () => {
    const handle = await open(join(folder, 'tiny.csv'), 'w');
    const chunk = Buffer.alloc(8 * 1024 * 1024, '1.25,');
    for (let i = 0; i < 25; i++) await handle.write(chunk);
    await handle.close();
    const run = await cli(['evaluate', join(folder, 'tiny.spcritic')]);
    console.info(`200 MB single line: exit ${run.code} in ${run.seconds.toFixed(1)} s, peak ${peakMiB(run.stderr)} MiB`);
    expect(run.signal).toBeNull();
    expect(run.code).toBe(1);
    expect(run.stderr).toMatch(/tiny\.csv, line 1: the first line is 209,715,200 bytes long/);
    expect(run.stderr.length).toBeLessThan(2000);
    expect(peakMiB(run.stderr)).toBeLessThan(200 + 400);
  });

  it('a 10 MB header line: exit 1 at once, no echo of the header', async () => {
    const header = Array.from({ length: 400_000 }, (_, i) => `column_${i}`).join(',').slice(0, 10_000_000);
    await writeFile(join(folder, 'tiny.csv'), `${header}\n1,2,3\n`);
    const run = await cli(['evaluate', join(folder, 'tiny.spcritic')]);
    console.info(`10 MB header: exit ${run.code} in ${run.seconds.toFixed(1)} s, peak ${peakMiB(run.stderr)} MiB`);
    expect(run.code).toBe(1);
    expect(run.stderr).toContain('line 1: the first line is');
    expect(run.stderr).not.toContain('column_1');
    expect(run.stderr.length).toBeLessThan(2000);
  });
});
