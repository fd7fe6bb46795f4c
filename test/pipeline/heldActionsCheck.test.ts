/**
 * The held-actions check on the probe40 logs (test/battery/holdout/manualStretchPlants.ts: the cooling tower with
 * 10 % of its rows in manual stretches, no mode column): read before the present controller's law is fitted, it
 * has that law fitted on the rows not held (held42's repair) and says so in a whole-log finding with what to do;
 * read without the repair it is serious (held40). Its control (no manual rows) and the three sample projects give
 * nothing and leave the law fitted on every row. The thresholds' evidence: test/battery/README.md, "Held actions".
 */
import { readFile } from 'node:fs/promises';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { loggedActionLimits } from '../../src/core/loggedActionLimits';
import type { TransitionSet } from '../../src/core/transitions';
import { heldActionsAssessment, readHeldActions } from '../../src/pipeline/heldActionsCheck';
import { openProject } from '../../src/pipeline/openProject';
import { startRun } from '../../src/pipeline/projectRun';
import { coolingTowerManualPlant } from '../battery/holdout/manualStretchPlants';

const readOf = (data: TransitionSet) => readHeldActions(data, loggedActionLimits(data.actions, data.count, data.actionDim));

describe('held-actions check', () => {
  const manual = coolingTowerManualPlant(0.1).simulate({ transitions: 40_000, seed: 1 });

  it('the cooling tower with 10 % of its rows in manual, the law fitted on every row: serious, whole-log (no candidate), with the causes and what to do', () => {
    const { summary, warnings } = heldActionsAssessment(readOf(manual), { lawFittedOn: 'everyRow', rowsUsed: manual.count });
    expect(warnings).toHaveLength(1);
    expect(warnings[0]).toMatchObject({ severity: 'serious', topic: 'heldActions' });
    expect(warnings[0].candidate).toBeUndefined();
    expect(warnings[0].message).toContain('repeat the action of the row before exactly, away from the actuator limits');
    expect(warnings[0].message).toContain('the loop in manual');
    expect(warnings[0].message).toContain('Export the loop’s mode with the log');
    expect('reason' in summary ? null : summary.severity).toBe('serious');
    expect('reason' in summary ? 0 : summary.longest).toBeLessThanOrEqual(40);
  });

  it('the same log with the law fitted on the rows not held: the finding says so, stays serious, and counts the runs with held rows', () => {
    const read = readOf(manual);
    if ('reason' in read) throw new Error(read.reason);
    const rowsUsed = manual.count - read.stretches.rows;
    const { summary, warnings } = heldActionsAssessment(read, { lawFittedOn: 'movingRows', rowsUsed });
    expect(summary).toMatchObject({ lawFittedOn: 'movingRows', rowsUsed, severity: 'serious' });
    expect(warnings[0].severity).toBe('serious');
    expect(warnings[0].message).toContain(`the present controller’s law is fitted on the ${rowsUsed.toLocaleString('en-US')} rows not held`);
    expect(warnings[0].message).toContain(`importance-sampling checks are not applicable (actions held in ${read.runs.withHeld} of ${read.runs.total} runs)`);
    expect(read.runs.total).toBe(100); // 40,000 rows in runs of 400
    expect(read.runs.withHeld).toBeGreaterThan(50);
    expect(warnings[0].message).toContain('so the present controller’s J may still be wrong and every difference is taken against it: no candidate is named for a trial.');
    expect(warnings[0].message).not.toContain("'");
  });

  it('its control (no manual rows): nothing', () => {
    const control = coolingTowerManualPlant(0).simulate({ transitions: 40_000, seed: 1 });
    const { summary, warnings } = heldActionsAssessment(readOf(control), { lawFittedOn: 'everyRow', rowsUsed: control.count });
    expect(warnings).toEqual([]);
    expect('reason' in summary ? 'x' : summary.severity).toBeNull();
  });

  it('the three sample projects, with the limits their baseline reads: nothing, and the law fitted on every row', async () => {
    for (const sample of ['heating-loop', 'heating-historian', 'tank-levels']) {
      const folder = join(__dirname, '..', '..', 'sample-projects', sample);
      const opened = await openProject(await readFile(join(folder, `${sample}.spcritic`), 'utf8'), `${sample}.spcritic`, async (p) => new Uint8Array(await readFile(join(folder, p))));
      if (!opened.ok) throw new Error(opened.problems.map((p) => p.message).join('\n'));
      const started = await startRun(opened.value.project, opened.value.dataset);
      if (!started.ok) throw new Error(started.problems.map((p) => p.message).join('\n'));
      try {
        const { presentController } = started.value.plan;
        const { warnings } = heldActionsAssessment(presentController.held, presentController.lawFit);
        expect(warnings, sample).toEqual([]);
        expect(presentController.lawFit, sample).toEqual({ lawFittedOn: 'everyRow', rowsUsed: started.value.plan.data.count });
      } finally {
        started.value.dispose();
      }
    }
  }, 120_000);
});
