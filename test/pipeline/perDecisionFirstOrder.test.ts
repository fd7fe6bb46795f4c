/**
 * The assessment's two routes for the per-decision checks through the resamples (settings.perDecision,
 * core/limits.ts PER_DECISION_RESAMPLING): the default recomputes each check on every resample; the
 * first-order route takes it as J + Σ_k (c_k − 1) g_k on the same multiplicities
 * (offPolicy/perDecisionDerivatives.ts). On the tank-levels sample both must give the same full-data
 * values; where every weight is 1 on runs of one length (the present controller here) the estimators are
 * linear in c over multinomial draws, so the two routes' standard errors must agree to rounding. (The
 * candidates' checks there, with heavy weights, are where the first order understates: test/battery/README.md.)
 * The default (settings without perDecision, assessed here as the resampled route) must be the resampled route.
 */
import { readFile } from 'node:fs/promises';
import { join } from 'node:path';
import { beforeAll, describe, expect, it } from 'vitest';
import { PER_DECISION_RESAMPLING } from '../../src/core/limits';
import type { Assessment } from '../../src/pipeline/assessment';
import { assessRun } from '../../src/pipeline/assessProject';
import { evaluateProject } from '../../src/pipeline/evaluateProject';
import { openProject } from '../../src/pipeline/openProject';
import type { ProjectRun } from '../../src/pipeline/projectRun';

const settings = { resamples: 200, level: 0.9, seed: 4, sensitivity: false };
const CHECKS = ['weightedImportanceSampling', 'weightedDoublyRobust'];

describe('the per-decision checks to first order beside their resamples (tank-levels sample)', () => {
  const routes: Record<string, Assessment> = {};
  beforeAll(async () => {
    const folder = join(__dirname, '..', '..', 'sample-projects', 'tank-levels');
    const text = await readFile(join(folder, 'tank-levels.spcritic'), 'utf8');
    const opened = await openProject(text, 'tank-levels.spcritic', async (p) => new Uint8Array(await readFile(join(folder, p))));
    if (!opened.ok) throw new Error(opened.problems.map((p) => p.message).join('\n'));
    let run: ProjectRun | null = null;
    const evaluated = await evaluateProject({ project: opened.value.project, dataset: opened.value.dataset, keepRun: (r) => { run = r; } });
    if (!evaluated.ok || !run) throw new Error('evaluation failed');
    try {
      for (const [name, extra] of [['resampled', {}], ['firstOrder', { perDecision: 'firstOrder' }]] as const) {
        const a = await assessRun(run, { settings: { ...settings, ...extra } });
        if (!a.ok) throw new Error(a.problems.map((p) => p.message).join('\n'));
        routes[name] = a.value;
      }
    } finally {
      (run as ProjectRun).dispose();
    }
  }, 240_000);

  const checksOf = (a: Assessment) => [...a.candidates.map((c) => c.crossChecks), ...(a.presentController ? [a.presentController.crossChecks] : [])]
    .flatMap((list) => list.filter((c) => CHECKS.includes(c.method) && c.estimate && c.difference));

  it('takes the resamples by default', () => {
    expect(PER_DECISION_RESAMPLING.default).toBe('resampled');
  });

  it('gives the same full-data values; for the present controller the same standard errors, since there the first order is exact', () => {
    const before = checksOf(routes.resampled), after = checksOf(routes.firstOrder);
    expect(before.length).toBeGreaterThanOrEqual(4);
    before.forEach((x, i) => {
      const y = after[i];
      expect(y.method).toBe(x.method);
      expect(y.estimate!.value).toBe(x.estimate!.value);
      expect(y.difference!.value).toBe(x.difference!.value);
    });
    // Every weight 1 and runs of one length: each step's weight sum is Σ c_k = e on every multinomial draw, so
    // WPDIS and WDR are linear in c over the draws and the first-order replicates are the resampled ones.
    const present = (a: Assessment) => a.presentController!.crossChecks.filter((c) => CHECKS.includes(c.method));
    present(routes.resampled).forEach((x, i) => {
      const y = present(routes.firstOrder)[i];
      expect(y.difference!.standardError! / x.difference!.standardError!).toBeCloseTo(1, 9);
      expect(y.estimate!.standardError! / x.estimate!.standardError!).toBeCloseTo(1, 9);
    });
  });
});
