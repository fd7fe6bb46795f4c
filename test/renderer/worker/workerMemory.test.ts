/**
 * The worker's import is paced (it yields between blocks of records), so a request heard during it
 * stops it: a newer import for other settings, new data, or a stop message. The stopped import
 * answers with the one cancelled problem and leaves nothing in the memory; the import that follows
 * is the same as one run alone; an import asked for twice with the same settings runs once.
 * (The import's numbers themselves are checked in test/data.)
 */
import { readFileSync } from 'node:fs';
import { resolve } from 'node:path';
import { describe, expect, it } from 'vitest';
import { CANCELLED_PROBLEM } from '../../../src/pipeline/cancelledProblem';
import { importProjectData } from '../../../src/pipeline/openProject';
import { parseProjectText } from '../../../src/project/projectFile';
import type { ProjectDocument } from '../../../src/project/schema';
import { createWorkerMemory } from '../../../src/renderer/src/worker/workerMemory';

const folder = resolve(__dirname, '../../../sample-projects/tank-levels');
const loaded = parseProjectText(readFileSync(resolve(folder, 'tank-levels.spcritic'), 'utf8'), 'tank-levels.spcritic');
if (!loaded.ok) throw new Error('sample project does not load');
const project = loaded.value.document;
const bytes = new Uint8Array(readFileSync(resolve(folder, 'tank-levels.csv')));
/** The same project with the bad-rows rule changed: another import. */
const other: ProjectDocument = { ...project, data: { ...project.data, csv: { ...project.data.csv, badRows: 'exclude' } } };

/** A memory whose import yields to the event loop at every step, counting the steps. */
function pacedMemory(): { memory: ReturnType<typeof createWorkerMemory>; steps: { count: number } } {
  const steps = { count: 0 };
  const memory = createWorkerMemory(() => { steps.count++; return new Promise((done) => setTimeout(done, 0)); });
  memory.setData(bytes, 'tank-levels.csv');
  return { memory, steps };
}

describe('the worker’s import', () => {
  it('stops at its next step when another import is asked for, and the newer one is as if run alone', async () => {
    const { memory } = pacedMemory();
    const first = memory.open(project);
    const second = memory.open(other);
    expect(await first).toEqual({ ok: false, problems: [CANCELLED_PROBLEM] });
    const alone = importProjectData(other, bytes), opened = await second;
    if (!opened.ok || !alone.ok) throw new Error('import failed');
    expect(opened.value.fingerprint).toBe(alone.value.fingerprint);
    expect(opened.value.dataset).toEqual(alone.value.dataset);
    expect(opened.value.imported.summary).toEqual(alone.value.imported.summary);
  });

  it('stops on a stop message, keeps nothing, and imports again when asked', async () => {
    const { memory, steps } = pacedMemory();
    const stopped = memory.open(project);
    setTimeout(() => memory.stopImport(), 0);
    expect(await stopped).toEqual({ ok: false, problems: [CANCELLED_PROBLEM] });
    const stepsBefore = steps.count;
    const again = await memory.open(project);
    expect(again.ok).toBe(true);
    expect(steps.count).toBeGreaterThan(stepsBefore); // nothing was kept from the stopped import
  });

  it('stops when new data arrives', async () => {
    const { memory } = pacedMemory();
    const stopped = memory.open(project);
    setTimeout(() => memory.setData(bytes, 'again.csv'), 0);
    expect(await stopped).toEqual({ ok: false, problems: [CANCELLED_PROBLEM] });
  });

  it('runs an import asked for twice with the same settings once, and reuses it afterwards', async () => {
    const { memory, steps } = pacedMemory();
    const [a, b] = await Promise.all([memory.open(project), memory.open(project)]);
    expect(a.ok && b.ok).toBe(true);
    const once = steps.count;
    const c = await memory.open(project);
    expect(c.ok).toBe(true);
    expect(steps.count).toBe(once);
    if (a.ok && b.ok) expect(a.value.dataset).toBe(b.value.dataset);
  });
});

describe('the worker’s import after an internal error', () => {
  it('tries the same import again when asked, rather than answering with the old failure', async () => {
    let calls = 0;
    // The first step fails as an allocation might; every later step goes on at once.
    const memory = createWorkerMemory(async () => {
      calls++;
      if (calls === 1) throw new RangeError('Array buffer allocation failed');
    });
    memory.setData(bytes, 'tank-levels.csv');
    await expect(memory.open(project)).rejects.toThrow('Array buffer allocation failed');
    const again = await memory.open(project);
    expect(again.ok).toBe(true);
  });
});
