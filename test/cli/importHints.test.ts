/**
 * The command line on the heating-historian sample (invented data with a few corrupt cells): a
 * project that stops on bad rows says, with exit 1, how to leave those rows out; a time window that
 * cannot be used is named by its field; a project check refuses a window of two numbers that ends
 * before it starts.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { csvVariants, type CsvVariants } from './csvVariants';

describe('the command line says how to leave rows and windows out', () => {
  let variants: CsvVariants;
  beforeAll(async () => { variants = await csvVariants('heating-historian'); });
  afterAll(() => variants.remove());
  const evaluate = (name: string, csv: Record<string, unknown>) => variants.evaluate(name, csv);

  it('bad rows with "stop": exit 1, each row named, then how to import without them', async () => {
    const { code, stderr } = await evaluate('stop', { badRows: 'stop' });
    expect(code).toBe(1);
    expect(stderr).toContain('heating-historian.csv, line 214, column zone_temp_c');
    expect(stderr).toContain('5 rows cannot be used. To import without them');
    expect(stderr).toContain('"badRows": "exclude"');
  });

  it('a window that overlaps another: exit 1, naming the field', async () => {
    const { code, stderr } = await evaluate('overlap', { excludedTimes: [{ from: '13.01.2025 08:00', to: '13.01.2025 09:00', reason: 'a' }, { from: '13.01.2025 08:30', to: '13.01.2025 10:00', reason: 'b' }] });
    expect(code).toBe(1);
    expect(stderr).toContain('data.csv.excludedTimes[1]: window 2 overlaps window 1 (data.csv.excludedTimes[0])');
  });

  it('the project check: two numbers that end before they start, exit 1 naming the field', async () => {
    const { code, stderr } = await evaluate('backwards', { excludedTimes: [{ from: 50, to: 30 }] });
    expect(code).toBe(1);
    expect(stderr).toMatch(/data\.csv\.excludedTimes\[0\]\.to.*ends \(30\) before it starts \(50\)/);
  });
});
