/**
 * The worker's retune-map handler on the heating-loop sample (its 10×10 map of proportional gain ×
 * integral time): the numbers are identical to the pipeline's retuneMapsOfRun called directly on
 * the same kept run; progress counts the points to the last; a stop flag set before the start ends
 * the computation as cancelled and keeps the run; a project without maps or without a run is
 * refused with a message. (Equality with the pipeline is the check here; the map's own numerics
 * are checked against outside references in test/core/retune and test/pipeline.)
 */
import { readFileSync } from 'node:fs';
import { resolve } from 'node:path';
import { describe, expect, it } from 'vitest';
import { CANCELLED_PROBLEM } from '../../../src/pipeline/projectRun';
import { retuneMapsOfRun } from '../../../src/pipeline/retuneMaps';
import { parseProjectText } from '../../../src/project/projectFile';
import { runEvaluation } from '../../../src/renderer/src/worker/evaluationRun';
import { runRetuneMaps } from '../../../src/renderer/src/worker/retuneMapRun';
import { createWorkerMemory } from '../../../src/renderer/src/worker/workerMemory';
import type { RetuneMapProgress } from '../../../src/shared/workerMessages';

const folder = resolve(__dirname, '../../../sample-projects/heating-loop');
const loaded = parseProjectText(readFileSync(resolve(folder, 'heating-loop.spcritic'), 'utf8'), 'heating-loop.spcritic');
if (!loaded.ok) throw new Error('sample project does not load');
const project = loaded.value.document;
const bytes = new Uint8Array(readFileSync(resolve(folder, 'heating-loop.csv')));

describe('retune map worker handler', async () => {
  const memory = createWorkerMemory();
  memory.setData(bytes, 'heating-loop.csv');
  const evaluated = await runEvaluation(memory, project, () => undefined);
  if (!evaluated.ok) throw new Error(`run failed: ${evaluated.problems.map((p) => p.message).join('; ')}`);
  const reports: RetuneMapProgress[] = [];
  let clock = 0;
  const viaWorker = runRetuneMaps(memory, project, new Int32Array(new SharedArrayBuffer(4)), (p) => reports.push(p), () => (clock += 7));

  it('gives the pipeline’s numbers exactly, point for point', () => {
    const direct = retuneMapsOfRun(memory.lastRun().run);
    if (!viaWorker.ok || !direct.ok) throw new Error('map failed');
    const [w] = viaWorker.value, [d] = direct.value;
    expect(w.points).toHaveLength(100);
    for (const p of [0, 9, 45, 90, 99, w.best!.index]) {
      expect(w.points[p].value).toBe(d.points[p].value);
      expect(w.points[p].interval).toEqual(d.points[p].interval);
      expect(w.points[p].support).toBe(d.points[p].support);
      expect(w.points[p].occupancyShift).toBe(d.points[p].occupancyShift);
    }
    expect(w.best).toEqual(d.best);
    expect(w.presentController).toBe(d.presentController);
    expect(w.axes.map((a) => a.label)).toEqual(d.axes.map((a) => a.label));
  });

  it('cuts no interval below 0, the cost the sample declares it never goes below, and says where it cut', () => {
    // The heating loop's cost is a square plus a share of heat (sample-projects/heating-loop/README.md): no J below 0 is possible.
    if (!viaWorker.ok) throw new Error('map failed');
    const [w] = viaWorker.value, intervals = w.points.flatMap((p) => (p.interval ? [p.interval] : []));
    expect(intervals.length).toBe(100);
    for (const [lo] of intervals) expect(lo).toBeGreaterThanOrEqual(0);
    expect(w.notes.join(' ')).toMatch(/at \d+ points? cut where the cost’s definition puts values out of reach of every policy \(none below 0\)/);
  });

  it('labels the axes in words, without the parameter paths', () => {
    if (!viaWorker.ok) throw new Error('map failed');
    for (const axis of viaWorker.value[0].axes) expect(axis.label).not.toMatch(/form\.|loops\.\d/);
  });

  it('reports progress no closer than the interval, and always the last point', () => {
    expect(reports.at(-1)).toMatchObject({ map: 0, maps: 1, pointsDone: 100, pointsTotal: 100 });
    const times = reports.map((r) => r.elapsedMs);
    for (let i = 1; i < times.length - 1; i++) expect(times[i] - times[i - 1]).toBeGreaterThanOrEqual(100);
    expect(reports.length).toBeGreaterThan(1);
  });

  it('stops at the flag, as cancelled, and keeps the run', () => {
    const flag = new Int32Array(new SharedArrayBuffer(4));
    Atomics.store(flag, 0, 1);
    const stopped = runRetuneMaps(memory, project, flag, () => undefined);
    expect(stopped.ok).toBe(false);
    if (!stopped.ok) expect(stopped.problems).toEqual([CANCELLED_PROBLEM]);
    expect(memory.runFor(project)).not.toBeNull();
  });

  it('refuses a project without maps, and a project that is not the kept run', () => {
    const none = runRetuneMaps(memory, { ...project, retuneMaps: [] }, null, () => undefined);
    expect(!none.ok && none.problems[0].message).toMatch(/no retune map/);
    const other = runRetuneMaps(memory, { ...project, discount: 0.9 }, null, () => undefined);
    expect(!other.ok && other.problems[0].message).toMatch(/run the evaluation first/);
  });
});
