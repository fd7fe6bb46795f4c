/**
 * Ctrl+C during the import of a large data file: the import (fingerprint, then the records in
 * blocks, then its stages) yields to the event loop between blocks, so a stop request that arrives
 * as an event (as SIGINT does; here a timer set at the first yield) is heard before the import
 * ends, and the command ends with the documented "cancelled" status (exit 130,
 * src/cli/exitStatus.ts) and its message. No timing is asserted: the checks are how many yields
 * passed before the stop and that no candidate's fit began.
 *
 * The data file is the tank-levels sample's log written ten times over (run labels made distinct
 * per copy): about 200,000 records, several blocks of RECORDS_PER_STEP.
 */
import { mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { EXIT } from '../../src/cli/exitStatus';
import { evaluateProjectFile } from '../../src/cli/evaluateProjectFile';
import { RECORDS_PER_STEP } from '../../src/data/columnReader';
import { countingProgress } from '../support/countingProgress';

const sample = join(__dirname, '..', '..', 'sample-projects', 'tank-levels');
const COPIES = 10;
let folder = '', project = '';

beforeAll(() => {
  folder = mkdtempSync(join(tmpdir(), 'cancel-import-'));
  const [header, ...rows] = readFileSync(join(sample, 'tank-levels.csv'), 'utf8').trimEnd().split('\n');
  const copies = Array.from({ length: COPIES }, (_, k) => rows.map((row) => `${k + 1}-${row}`).join('\n'));
  writeFileSync(join(folder, 'long-log.csv'), `${header}\n${copies.join('\n')}\n`);
  const document = JSON.parse(readFileSync(join(sample, 'tank-levels.spcritic'), 'utf8'));
  document.data = { ...document.data, path: 'long-log.csv', sha256: undefined, rowCount: undefined };
  project = join(folder, 'long-log.spcritic');
  writeFileSync(project, JSON.stringify(document));
});

afterAll(() => rmSync(folder, { recursive: true, force: true }));

/** A terminal that "presses Ctrl+C" by an event-loop timer at the first yield; counts yields and fits begun. */
function pressingCtrlC(yieldToEvents: boolean): ReturnType<typeof countingProgress> {
  let stop = false;
  return countingProgress(async (paces) => {
    if (paces === 0) setTimeout(() => { stop = true; }, 0);
    if (yieldToEvents) await new Promise((resolve) => setTimeout(resolve, 0));
  }, () => stop);
}

describe('cancelling the command line during the import', () => {
  it('the file is large enough for several blocks of records', () => {
    expect(COPIES * 20_000).toBeGreaterThan(2 * RECORDS_PER_STEP);
  });

  it('stops at the next yield of the import, with exit 130 and the cancelled message, before any fit', async () => {
    const { progress, seen } = pressingCtrlC(true);
    const result = await evaluateProjectFile(project, { resamples: 20 }, undefined, progress);
    expect(result.ok).toBe(false);
    if (result.ok) return;
    expect(result.failure).toEqual({ exitCode: EXIT.cancelled, message: 'Cancelled (Ctrl+C): no results were written.' });
    expect(seen.paces).toBeLessThanOrEqual(2);
    expect(seen.fits).toBe(0);
  }, 120_000);

  it('without yielding, the same request is heard only after the import (the contrast that makes the check above meaningful)', async () => {
    const { progress, seen } = pressingCtrlC(false);
    const result = await evaluateProjectFile(project, { resamples: 20 }, undefined, progress);
    expect(result.ok).toBe(false);
    if (!result.ok) expect(result.failure.exitCode).toBe(EXIT.cancelled);
    expect(seen.paces).toBeGreaterThan(5); // every block of the import went by
    expect(seen.fits).toBeGreaterThan(0);
  }, 120_000);
});
