/**
 * Runs left out by label (data.csv.excludedRuns) on the tank-levels sample (40 runs labelled "1" to
 * "40", in order): the evaluation with runs "1" to "15" left out is the evaluation of the same CSV cut
 * to runs 16–40, to the last bit — the transitions, start states, J and its standard error of every
 * candidate and the present controller's return, and the whole assessment (intervals, the run-order
 * check, start coverage, the baseline) with the same seed — since every stage after the import sees only the
 * rows kept (centring, the feature scaling and the episode resamples included). Only the row count
 * and what the import reports differ, and each transition's file line (sourceLine: 7,500 lines on).
 * On the heating-loop sample, runs cut from the middle of a log whose states are derived along each
 * run (an error integral, the previous valve position) give the transitions and J of the log without
 * them: a run after those left out starts afresh, as it does in the cut file.
 */
import { readFile } from 'node:fs/promises';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { evaluateProject } from '../../src/pipeline/evaluateProject';
import { importProjectData } from '../../src/pipeline/openProject';
import { projectSchema, type ProjectDocument } from '../../src/project/schema';
import { runKey } from '../../src/shared/runKey';
import { evaluationToJson } from '../../src/pipeline/evaluationJson';
import { assessProject } from '../../src/pipeline/assessProject';
import { assessmentToJson } from '../../src/pipeline/assessmentJson';

const fixedClock = () => new Date('2026-01-01T00:00:00Z');

async function sample(name = 'tank-levels'): Promise<{ project: ProjectDocument; text: string }> {
  const folder = join(__dirname, '..', '..', 'sample-projects', name);
  const raw = JSON.parse(await readFile(join(folder, `${name}.spcritic`), 'utf8'));
  delete raw.data.sha256;
  delete raw.data.rowCount;
  return { project: projectSchema.parse(raw), text: await readFile(join(folder, `${name}.csv`), 'utf8') };
}
const tank = () => sample();

/** The CSV holding only the rows whose run (first column, a number) passes `keep`. */
function runsOnly(text: string, keep: (run: number) => boolean): string {
  const lines = text.trimEnd().split('\n');
  return `${[lines[0], ...lines.slice(1).filter((line) => keep(Number(line.split(',')[0])))].join('\n')}\n`;
}

function withRuns(project: ProjectDocument, excludedRuns: ProjectDocument['data']['csv']['excludedRuns']): ProjectDocument {
  return { ...project, data: { ...project.data, csv: { ...project.data.csv, excludedRuns } } };
}

function opened(project: ProjectDocument, text: string) {
  const result = importProjectData(project, new TextEncoder().encode(text));
  if (!result.ok) throw new Error(result.problems.map((p) => p.message).join('\n'));
  return result.value;
}

describe('runs left out by label give the evaluation of the log without them', () => {
  it('runs "1" to "15" left out of 40 = the CSV holding runs 16 to 40, to the last bit', async () => {
    const { project, text } = await tank();
    const leftOut = withRuns(project, [{ from: '1', to: '15', reason: 'before the retune' }]);
    const a = opened(leftOut, text), b = opened(project, runsOnly(text, (run) => run >= 16));

    expect(a.imported.runsLeftOut).toEqual([{ from: '1', to: '15', reason: 'before the retune', runs: 15, rows: 7500 }]);
    expect(a.imported.summary.usedRowCount).toBe(b.imported.summary.rowCount);
    expect(a.dataset.episodeCount).toBe(25);
    for (const key of ['states', 'actions', 'rewards', 'nextStates', 'terminal', 'episode', 'startStates', 'startEpisode'] as const) {
      expect(a.dataset[key], key).toEqual(b.dataset[key]);
    }
    const [ea, eb] = await Promise.all([
      evaluateProject({ project: leftOut, dataset: a.dataset, now: fixedClock }),
      evaluateProject({ project, dataset: b.dataset, now: fixedClock }),
    ]);
    if (!ea.ok || !eb.ok) throw new Error('evaluation failed');
    const numbers = (e: typeof ea.value) => {
      const { project: _p, ...rest } = evaluationToJson(e);
      return rest;
    };
    expect(numbers(ea.value)).toEqual(numbers(eb.value));
    expect(ea.value.policies.every((p) => p.status === 'converged')).toBe(true);

    // The assessment: intervals, the run-order check, start coverage and the baseline, seeded alike.
    const settings = { resamples: 200, level: 0.9, seed: 4, sensitivity: false };
    const [aa, ab] = await Promise.all([
      assessProject({ project: leftOut, dataset: a.dataset, settings }), assessProject({ project, dataset: b.dataset, settings }),
    ]);
    if (!aa.ok || !ab.ok) throw new Error('assessment failed');
    // The run-order check also reads the whole log (memory38): it finds no change there, so the runs kept decide and every number is the cut CSV's.
    const { wholeLog, ...keptOrder } = aa.value.runOrder ?? {};
    expect(wholeLog).toEqual({ read: true, runs: 40, runsLeftOut: 15, reading: 'no-change', resolved: false, sentence: null });
    expect(assessmentToJson({ ...aa.value, runOrder: keptOrder as typeof ab.value.runOrder })).toEqual(assessmentToJson(ab.value));
    expect(a.dataset.wholeLog?.transitions.episodeCount).toBe(40);
    expect([...a.dataset.wholeLog!.keptRuns]).toEqual(Array.from({ length: 40 }, (_, e) => (e >= 15 ? 1 : 0)));
    expect(b.dataset.wholeLog).toBeUndefined();
  }, 240_000);

  it('runs in the middle with derived states (heating-loop: an error integral and the previous valve position, from each run’s start): "10" to "20" left out = the CSV without them', async () => {
    const { project, text } = await sample('heating-loop');
    const a = opened(withRuns(project, [{ from: '10', to: '20', reason: 'trip tests' }]), text), b = opened(project, runsOnly(text, (run) => run < 10 || run > 20));
    expect(a.imported.runsLeftOut[0]).toMatchObject({ runs: 11 });
    expect(a.dataset.episodeCount).toBe(b.dataset.episodeCount);
    for (const key of ['states', 'actions', 'rewards', 'nextStates', 'terminal', 'episode', 'startStates', 'startEpisode'] as const) {
      expect(a.dataset[key], key).toEqual(b.dataset[key]);
    }
    const [ea, eb] = await Promise.all([evaluateProject({ project, dataset: a.dataset, now: fixedClock }), evaluateProject({ project, dataset: b.dataset, now: fixedClock })]);
    if (!ea.ok || !eb.ok) throw new Error('evaluation failed');
    expect(ea.value.policies.map((p) => p.policyValue)).toEqual(eb.value.policies.map((p) => p.policyValue));
    expect(ea.value.behaviour).toEqual(eb.value.behaviour);
  }, 120_000);

  it('the run key (cached results) changes with the runs named, not with the reason (a note)', async () => {
    const { project } = await tank();
    const one = withRuns(project, [{ from: '1', reason: '' }]), otherReason = withRuns(project, [{ from: '1', reason: 'trip' }]);
    expect(runKey(one, 'f')).not.toBe(runKey(project, 'f'));
    expect(runKey(otherReason, 'f')).toBe(runKey(one, 'f'));
    expect(runKey(withRuns(project, [{ from: '1', to: '2', reason: 'trip' }]), 'f')).not.toBe(runKey(otherReason, 'f'));
  });
});
