/**
 * The held-actions check on the probe40 logs (test/battery/holdout/manualStretchPlants.ts: the cooling tower with
 * 10 % of its rows in manual stretches, no mode column) gives a serious whole-log warning with what to do; its
 * control (no manual rows) and the three sample projects give nothing. The threshold's evidence: test/battery/README.md,
 * "Held actions" (bench/heldActionsProbe.ts, bench/heldActionsBattery.ts).
 */
import { readFile } from 'node:fs/promises';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { heldActionsAssessment } from '../../src/pipeline/heldActionsCheck';
import { openProject } from '../../src/pipeline/openProject';
import { startRun } from '../../src/pipeline/projectRun';
import { coolingTowerManualPlant } from '../battery/holdout/manualStretchPlants';

describe('held-actions check', () => {
  it('the cooling tower with 10 % of its rows in manual: serious, whole-log (no candidate), with the causes and what to do', () => {
    const { summary, warnings } = heldActionsAssessment(coolingTowerManualPlant(0.1).simulate({ transitions: 40_000, seed: 1 }));
    expect(warnings).toHaveLength(1);
    expect(warnings[0]).toMatchObject({ severity: 'serious', topic: 'heldActions' });
    expect(warnings[0].candidate).toBeUndefined();
    expect(warnings[0].message).toContain('repeat the action of the row before exactly, away from the actuator limits');
    expect(warnings[0].message).toContain('the loop in manual');
    expect(warnings[0].message).toContain('Export the loop’s mode with the log');
    expect('reason' in summary ? null : summary.severity).toBe('serious');
    expect('reason' in summary ? 0 : summary.longest).toBeLessThanOrEqual(40);
  });

  it('its control (no manual rows): nothing', () => {
    const { summary, warnings } = heldActionsAssessment(coolingTowerManualPlant(0).simulate({ transitions: 40_000, seed: 1 }));
    expect(warnings).toEqual([]);
    expect('reason' in summary ? 'x' : summary.severity).toBeNull();
  });

  it('the three sample projects, with the limits their baseline reads: nothing', async () => {
    for (const sample of ['heating-loop', 'heating-historian', 'tank-levels']) {
      const folder = join(__dirname, '..', '..', 'sample-projects', sample);
      const opened = await openProject(await readFile(join(folder, `${sample}.spcritic`), 'utf8'), `${sample}.spcritic`, async (p) => new Uint8Array(await readFile(join(folder, p))));
      if (!opened.ok) throw new Error(opened.problems.map((p) => p.message).join('\n'));
      const started = await startRun(opened.value.project, opened.value.dataset);
      if (!started.ok) throw new Error(started.problems.map((p) => p.message).join('\n'));
      try {
        const { warnings } = heldActionsAssessment(started.value.plan.data, started.value.plan.presentController.fitted?.limits);
        expect(warnings, sample).toEqual([]);
      } finally {
        started.value.dispose();
      }
    }
  }, 120_000);
});
