/**
 * The command line end to end: real processes on the sample projects and on broken inputs.
 */
import { execFile } from 'node:child_process';
import { mkdtemp, writeFile, readFile, copyFile } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';

const root = join(__dirname, '..', '..');
const tsx = join(root, 'node_modules', '.bin', 'tsx');
const cli = join(root, 'src', 'cli', 'main.ts');

function run(args: string[]): Promise<{ code: number; stdout: string; stderr: string }> {
  return new Promise((resolve) => {
    execFile(tsx, [cli, ...args], { cwd: root, maxBuffer: 64 * 1024 * 1024 }, (error, stdout, stderr) => {
      resolve({ code: error ? Number(error.code ?? 1) : 0, stdout, stderr });
    });
  });
}

const samples = ['tank-levels/tank-levels.spcritic', 'heating-loop/heating-loop.spcritic'];

describe('evaluate command', () => {
  it.each(samples)('evaluates %s: exit 0, JSON with finite values for every candidate', async (sample) => {
    // 200 resamples instead of the project's 1,000: the check is the output's shape, and a shared CI machine runs this as a real process.
    const { code, stdout, stderr } = await run(['evaluate', join('sample-projects', sample), '--json', '--resamples', '200']);
    expect(stderr).toBe('');
    expect(code).toBe(0);
    const json = JSON.parse(stdout);
    expect(json.policies.length).toBeGreaterThan(0);
    for (const p of json.policies) {
      expect(typeof p.name).toBe('string');
      expect(Number.isFinite(p.policyValue)).toBe(true);
      expect(Number.isFinite(p.standardError)).toBe(true);
      expect(p.status).toBe('converged');
      expect(p.surface.values.every(Number.isFinite)).toBe(true);
    }
    expect(Number.isFinite(json.behaviour.value)).toBe(true);
    expect(json.cautions.join(' ')).toMatch(/advisory/);
    // The answer the text prints after the ranking, as data: a candidate's name or null, the best J's name and why not.
    expect(json.trial.named === null || json.policies.some((p: { name: string }) => p.name === json.trial.named)).toBe(true);
    expect(json.trial.best).toBe(json.assessment.comparison.ranking.order.find((n: string) => json.policies.some((p: { name: string }) => p.name === n)));
    expect(json.trial.rule).toMatch(/^A candidate is named for a trial only when/);
    // The heating sample has a 10 × 10 retune map over gain and integral time: every point in the JSON, the best one supported by the logs.
    if (sample.startsWith('heating')) {
      const [map] = json.retuneMaps;
      expect(map.points).toHaveLength(100);
      expect(map.axes.map((a: { values: number[] }) => a.values.length)).toEqual([10, 10]);
      expect(map.points[map.best.index].support).toBeNull();
      expect(map.points.some((p: { support: string | null }) => p.support === 'serious')).toBe(true);
      expect(map.points.filter((p: { value: number | null }) => p.value !== null).every((p: { value: number; interval: number[] }) => p.interval[0] <= p.value && p.value <= p.interval[1])).toBe(true);
    } else {
      expect(json.retuneMaps).toEqual([]);
    }
  }, 300_000);

  it('prints a readable table with the cautions by default', async () => {
    const { code, stdout } = await run(['evaluate', join('sample-projects', samples[0]), '--resamples', '200']);
    expect(code).toBe(0);
    expect(stdout).toMatch(/^present controller \[baseline\] /m); // the one name (DEVELOPERS.md glossary); the JSON keeps the pipeline's name
    // The sample's runs are long for its discount (their ends weigh below TRUNCATION_NOTICE): one logged-return row, not a
    // completed one beside it with the same number (core/loggedReturn.ts truncationMatters; test/cli/completedReturnRow.test.ts).
    expect(stdout).toMatch(/^logged return \(check\) /m);
    expect(stdout).not.toMatch(/completed past time limits/);
    expect(stdout).toMatch(/Cautions:/);
    expect(stdout).toMatch(/independent safety functions/);
  });

  it('reports a missing project file on stderr with exit 1', async () => {
    const { code, stdout, stderr } = await run(['evaluate', 'no/such/project.spcritic']);
    expect(code).toBe(1);
    expect(stdout).toBe('');
    expect(stderr).toMatch(/Cannot read the project file no\/such\/project\.spcritic: no such file/);
  });

  it('reports wrong usage with exit 2', async () => {
    expect((await run(['frobnicate'])).code).toBe(2);
    expect((await run(['evaluate'])).code).toBe(2);
  });

  it('names the field of a broken project and the column of a missing data column', async () => {
    const dir = await mkdtemp(join(tmpdir(), 'spc-cli-'));
    const sample = JSON.parse(await readFile(join(root, 'sample-projects', samples[0]), 'utf8'));
    await copyFile(join(root, 'sample-projects', 'tank-levels', sample.data.path), join(dir, sample.data.path));
    await writeFile(join(dir, 'bad-discount.spcritic'), JSON.stringify({ ...sample, discount: 1.5 }));
    const bad = await run(['evaluate', join(dir, 'bad-discount.spcritic')]);
    expect(bad.code).toBe(1);
    expect(bad.stderr).toMatch(/bad-discount\.spcritic, discount: expected a discount factor below 1/);

    const renamed = { ...sample, columns: { ...sample.columns, states: [{ column: 'level_uper_m', unit: 'm' }, ...sample.columns.states.slice(1)] } };
    await writeFile(join(dir, 'bad-column.spcritic'), JSON.stringify(renamed));
    const missing = await run(['evaluate', join(dir, 'bad-column.spcritic')]);
    expect(missing.code).toBe(1);
    expect(missing.stderr).toMatch(/level_uper_m/);
    expect(missing.stderr).toMatch(/level_upper_m/); // the closest header is suggested
  });

  it('refuses settings the schema accepts but the engine cannot run with exit 1 naming the field, never 70', async () => {
    const dir = await mkdtemp(join(tmpdir(), 'spc-cli-'));
    const sample = JSON.parse(await readFile(join(root, 'sample-projects', samples[0]), 'utf8'));
    await copyFile(join(root, 'sample-projects', 'tank-levels', sample.data.path), join(dir, sample.data.path));
    // With clipped limits the bounded-normal rule allows 32 nodes per action (src/core/limits.ts).
    const clipped = sample.candidates.map((c: Record<string, unknown>) => ({ ...c, bounds: { lo: [0], hi: [100], mode: 'clip' } }));
    await writeFile(join(dir, 'nodes.spcritic'), JSON.stringify({ ...sample, candidates: clipped, quadratureNodes: 40 }));
    const nodes = await run(['evaluate', join(dir, 'nodes.spcritic')]);
    expect(nodes.code).toBe(1);
    expect(nodes.stderr).toMatch(/quadratureNodes .*at most 32/);
    await writeFile(join(dir, 'horizon.spcritic'), JSON.stringify({ ...sample, discount: 0.999999 }));
    const horizon = await run(['evaluate', join(dir, 'horizon.spcritic')]);
    expect(horizon.code).toBe(1);
    expect(horizon.stderr).toMatch(/^discount: .*more than the .* transitions the logs hold/m);
  });
});

describe('evaluate command on a historian-style export', () => {
  // Expected counts worked out from the export script: 12 runs × 500 rows; each of the 5 corrupt
  // rows removes the step into it and the step out of it: 12 × 499 − 2 × 5 = 5,978 transitions.
  it('imports semicolons, decimal commas, time-gap episodes and an expression, listing every excluded row', async () => {
    const { code, stdout } = await run(['evaluate', join('sample-projects', 'heating-historian', 'heating-historian.spcritic'), '--json', '--resamples', '200']);
    expect(code).toBe(0);
    const json = JSON.parse(stdout);
    expect(json.import).toMatchObject({ rows: 6000, excludedRows: 5, transitions: 5978, episodes: 12, delimiter: ';', decimalMark: ',', samplingPeriodSeconds: 60 });
    expect(json.import.excluded.map((r: { line: number; column: string }) => [r.line, r.column])).toEqual([
      [214, 'zone_temp_c'], [1377, 'heating_valve_pct'], [2950, 'outdoor_temp_c'], [4108, 'zone_temp_c'], [5530, 'heating_valve_pct'],
    ]);
    expect(Number.isFinite(json.policies[0].policyValue)).toBe(true);
  });
});

describe('evaluate command with the network approximator', () => {
  it('stops a polynomial part of a degree not offered as a problem with the project: exit 1, the field and the values allowed', async () => {
    const dir = await mkdtemp(join(tmpdir(), 'spc-cli-net-'));
    const sample = JSON.parse(await readFile(join(root, 'sample-projects', samples[0]), 'utf8'));
    await copyFile(join(root, 'sample-projects', 'tank-levels', sample.data.path), join(dir, sample.data.path));
    await writeFile(join(dir, 'cubic.spcritic'), JSON.stringify({ ...sample, approximator: { kind: 'network', polynomialDegree: 3 } }));
    const { code, stdout, stderr } = await run(['evaluate', join(dir, 'cubic.spcritic')]);
    expect(code).toBe(1);
    expect(stdout).toBe('');
    expect(stderr).toContain('cubic.spcritic, approximator.polynomialDegree: expected the polynomial part’s degree: "chosen", 2 or 4');
  });

  it('fits a small TensorFlow.js network and says which backend computed it', async () => {
    const dir = await mkdtemp(join(tmpdir(), 'spc-cli-net-'));
    const sample = JSON.parse(await readFile(join(root, 'sample-projects', samples[0]), 'utf8'));
    await copyFile(join(root, 'sample-projects', 'tank-levels', sample.data.path), join(dir, sample.data.path));
    // Deliberately tiny (a few seconds): this checks the wiring, not the accuracy (test/core/fqe/network*.test.ts).
    const network = { kind: 'network', hiddenLayers: [16, 16], outerIterations: 3, stepsPerIteration: 20, batchSize: 256, backend: 'wasm' };
    await writeFile(join(dir, 'network.spcritic'), JSON.stringify({ ...sample, approximator: network }));
    const { code, stdout, stderr } = await run(['evaluate', join(dir, 'network.spcritic'), '--json']);
    expect(stderr).toBe('');
    // Three outer iterations cannot meet the convergence rule: the fit says so and the exit status is 3.
    expect(code).toBe(3);
    const json = JSON.parse(stdout);
    expect(json.settings.approximator).toBe('network, two hidden layers of 16 units each, ReLU activation, polynomial part’s degree chosen from the log');
    // The degree the fits used and the fit's own sentence why (src/core/fqe/networkDegreeChoice.ts); the tank's cost is quadratic.
    expect(json.settings.polynomialPart).toMatchObject({ setting: 'chosen', degree: 2 });
    expect(json.settings.polynomialPart.reason).toMatch(/^Polynomial part of degree 2/);
    for (const p of json.policies) {
      expect(p.backend).toBe('TensorFlow.js (WebAssembly)');
      expect(Number.isFinite(p.policyValue)).toBe(true);
      expect(p.history).toHaveLength(3);
      expect(p.status).not.toBe('converged');
    }
  });
});
