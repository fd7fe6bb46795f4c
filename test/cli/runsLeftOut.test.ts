/**
 * The command line reads runs left out by label (data.csv.excludedRuns) from the project: the tank-levels
 * sample (40 runs labelled "1" to "40") with runs "1" to "15" left out says so in the import report and
 * in `--json`; a range that cannot be used stops with exit status 1 (README, exit status), naming its
 * field and the closest label.
 */
import { copyFile, mkdtemp, readFile, rm, writeFile } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import { join, resolve } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { runCli } from '../../src/cli/run';
import { recordingTerminal } from '../../src/cli/terminal';

const SAMPLE = resolve(__dirname, '../../sample-projects/tank-levels');

describe('the command line leaves runs out by label', () => {
  let root: string, project: Record<string, { csv: Record<string, unknown> } & Record<string, unknown>>;
  beforeAll(async () => {
    root = await mkdtemp(join(tmpdir(), 'spc-runs-'));
    await copyFile(join(SAMPLE, 'tank-levels.csv'), join(root, 'tank-levels.csv'));
    project = JSON.parse(await readFile(join(SAMPLE, 'tank-levels.spcritic'), 'utf8'));
  });
  afterAll(() => rm(root, { recursive: true, force: true }));

  async function evaluate(name: string, excludedRuns: unknown, json = false) {
    const path = join(root, `${name}.spcritic`);
    await writeFile(path, JSON.stringify({ ...project, data: { ...project.data, csv: { ...project.data.csv, excludedRuns } } }));
    const terminal = recordingTerminal();
    const code = await runCli(['evaluate', path, ...(json ? ['--json'] : [])], terminal);
    return { code, stdout: terminal.stdout, stderr: terminal.stderr };
  }

  it('a range that can be used: exit 0, counted in the report and in --json', async () => {
    const text = await evaluate('kept', [{ from: '1', to: '15', reason: 'before the retune' }]);
    expect(text.code).toBe(0);
    expect(text.stdout).toContain('Runs left out by label (column run): 15 runs and 7,500 rows in all; 15 runs, "1" to "15", 7,500 rows: before the retune.');
    const json = await evaluate('kept-json', [{ from: '1', to: '15', reason: 'before the retune' }], true);
    expect(json.code).toBe(0);
    expect(JSON.parse(json.stdout).import.runsLeftOut).toEqual([{ from: '1', to: '15', reason: 'before the retune', runs: 15, rows: 7500 }]);
  }, 120_000);

  it('a label the log does not hold: exit 1, the field and the closest label', async () => {
    const { code, stderr } = await evaluate('missing', [{ from: '1', to: '400' }]);
    expect(code).toBe(1);
    expect(stderr).toContain('data.csv.excludedRuns[0].to');
    expect(stderr).toContain('no run of column run is labelled "400"; did you mean "40"?');
  });

  it('a label written as a number: exit 1, the field named', async () => {
    const { code, stderr } = await evaluate('number', [{ from: 1 }]);
    expect(code).toBe(1);
    expect(stderr).toContain('data.csv.excludedRuns[0].from');
    expect(stderr).toContain('expected a run label in quotes');
  });
});
