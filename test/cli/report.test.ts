/**
 * The `report` command end to end on the tank-levels sample (runReportCommand, the function the
 * CLI's `report` verb calls): it writes one self-contained HTML file, prints the intervals and
 * the path, and reports unusable input with the exit codes of the CLI (1 input, 2 usage).
 */
import { mkdtemp, readFile } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { runReportCommand } from '../../src/cli/reportCommand';
import { CAUTIONS } from '../../src/pipeline/cautions';

const sample = join(__dirname, '..', '..', 'sample-projects', 'tank-levels', 'tank-levels.spcritic');

function captureOutput() {
  const out: string[] = [], err: string[] = [];
  vi.spyOn(process.stdout, 'write').mockImplementation((chunk) => (out.push(String(chunk)), true));
  vi.spyOn(process.stderr, 'write').mockImplementation((chunk) => (err.push(String(chunk)), true));
  return { stdout: () => out.join(''), stderr: () => err.join('') };
}

afterEach(() => vi.restoreAllMocks());

describe('report command', () => {
  it('writes the HTML report and prints the intervals and where the file went', async () => {
    const dir = await mkdtemp(join(tmpdir(), 'spc-report-'));
    const out = join(dir, 'tank.html'), io = captureOutput();
    const code = await runReportCommand(sample, { out, resamples: 100, now: () => new Date('2026-01-01T00:00:00Z') });
    vi.restoreAllMocks();
    expect(io.stderr()).toBe('');
    expect(code).toBe(0);
    expect(io.stdout()).toMatch(/Bootstrap over 40 runs: 100 resamples, level 90 %/);
    expect(io.stdout()).toContain(`Report written to ${out}`);
    // The terminal's answer points to the cautions "at the end" (src/cli/assessmentFormat.ts): they are printed there, as `evaluate` prints them.
    expect(io.stdout()).toContain(`Cautions:\n${CAUTIONS.map((c) => `  - ${c}`).join('\n')}`);
    const html = await readFile(out, 'utf8');
    expect(html.startsWith('<!DOCTYPE html>')).toBe(true);
    for (const id of ['job', 'data', 'settings', 'comparison', 'surfaces', 'slices', 'diagnostics', 'cross-checks', 'sensitivity', 'cautions']) expect(html).toContain(`<section id="${id}">`);
    expect(html).toContain('<time datetime="2026-01-01T00:00:00.000Z">1 January 2026, 00:00 UTC</time>'); // a date a reader reads, the ISO time for machines
  });

  it('names a missing project file (exit 1) and a bad number of resamples (exit 2)', async () => {
    const io = captureOutput();
    expect(await runReportCommand('no/such/project.spcritic')).toBe(1);
    expect(await runReportCommand(sample, { resamples: 3 })).toBe(2);
    vi.restoreAllMocks();
    expect(io.stderr()).toMatch(/Cannot read the project file no\/such\/project\.spcritic: no such file/);
    expect(io.stderr()).toMatch(/bootstrap\.resamples: expected a whole number from 20/);
  });
});
