/**
 * The command line reads runs left out by label (data.csv.excludedRuns) from the project: the tank-levels
 * sample (40 runs labelled "1" to "40") with runs "1" to "15" left out says so in the import report and
 * in `--json`; a range that cannot be used stops with exit status 1 (README, exit status), naming its
 * field and the closest label.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { csvVariants, type CsvVariants } from './csvVariants';

describe('the command line leaves runs out by label', () => {
  let variants: CsvVariants;
  beforeAll(async () => { variants = await csvVariants('tank-levels'); });
  afterAll(() => variants.remove());
  const evaluate = (name: string, excludedRuns: unknown, json = false) => variants.evaluate(name, { excludedRuns }, json ? ['--json'] : []);

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
