/**
 * The sweep check's budget counts what runs (pipeline/assessSweepCheck.ts, core/bootstrap/solveWork.ts;
 * the rules and their tables: test/battery/README.md, "The sweep check's budget"). Before solve37 it counted
 * one d³ per resample and discount and the full data's iteration steps, so on the heating-loop sample with
 * degree-3 features (an invented edit of its project) it let run checks that took 6–29 s where it meant
 * about a second. Now a running tally stops the resamples at the budget, and a pilot — the first block's
 * work carried to all 200 resamples — leaves a check that would pass it unchecked after that block. */
import { describe, expect, it } from 'vitest';
import { episodeMultiplicities } from '../../src/core/bootstrap/episodeMultiplicities';
import { linearFqeReplicateDiscounts, reachedSolve, type LinearReplicate, type LinearReplicateSetup } from '../../src/core/bootstrap/linearFqeReplicate';
import { overBudget, type SolveTally } from '../../src/core/bootstrap/solveWork';
import { meanStartFeatures } from '../../src/core/features/policyFeatures';
import { SWEEP_CHECK_BUDGET } from '../../src/core/limits';
import { RESAMPLE_BLOCK } from '../../src/core/offPolicy/perDecisionResamples';
import { candidateWork, linearSolveSettings, type AssessmentContext } from '../../src/pipeline/assessCandidate';
import type { ProjectRun } from '../../src/pipeline/projectRun';
import { sweptDiscount } from '../../src/pipeline/assessSensitivity';
import { checkDiscountSweep } from '../../src/pipeline/assessSweepCheck';
import { projectRun, SWEEP_FACTORS } from '../core/bootstrap/sweepSolveCases';

const limited = 'PI with a 2 %/min rate limit';

/** The check's inputs on a sample project, as the assessment forms them (assessSensitivity.ts discountCurve): each candidate's work and its points at the swept discounts. */
function sweepInputs(run: ProjectRun) {
  const context: AssessmentContext = { plan: run.plan, presentController: null, presentControllerModel: null, presentControllerReason: '' };
  const settings = SWEEP_FACTORS.map((f) => sweptDiscount(run.plan.discount, f)), works = run.models.map((m) => candidateWork(context, m));
  const points = works.map((w) => {
    const linear = w.model.linear!, solve = linearSolveSettings(run.plan, w.model);
    return settings.map((g) => reachedSolve({ ...solve, discount: g }, linear.statistics, meanStartFeatures(linear.startFeatures, linear.features.dim)));
  });
  return { context, settings, works, points };
}

/** What the first block of a candidate's resamples runs with no limit: the most the pilot may run before it says a check cannot finish. */
function firstBlockWork(run: ProjectRun, model: ProjectRun['models'][number], settings: readonly number[], points: readonly LinearReplicate[]): number {
  const linear = model.linear!;
  if (linear.resampling.kind !== 'exact') throw new Error('expected exact resampling');
  const setup: LinearReplicateSetup = { ...linearSolveSettings(run.plan, model), sums: linear.resampling.sums, startFeatures: linear.startFeatures, startsFollowEpisodes: run.plan.starts.followEpisodes, startEpisode: run.plan.starts.episode };
  const block = Array.from({ length: RESAMPLE_BLOCK }, (_, r) => episodeMultiplicities(run.plan.episodes.episodes, 1, r)), tally: SolveTally = { units: 0 };
  linearFqeReplicateDiscounts(setup, block, block.map(() => new Float64Array(setup.sums.stride)), settings, points.map((p) => (p.status === 'converged' ? p.weights : null)), tally);
  return tally.units;
}

const skippedNote = 'The discount sweep of the candidates is not checked against what the costs allow: re-solving this fit on 200 resamples at every swept discount would take longer than the check is given.';

describe('the sweep check’s budget', () => {
  it('leaves the degree-3 heating loop’s checks unchecked after one block of resamples at most, and says so', async () => {
    const run = await projectRun('heating-loop', 3);
    try {
      const { context, settings, works, points } = sweepInputs(run);
      const check = checkDiscountSweep(context, works, settings, 2, points, { level: 0.9, seed: 1, resamples: 200 });
      expect(check.note).toBe(skippedNote);
      expect(check.marks).toEqual(works.map(() => settings.map(() => false)));
      works.forEach((w, c) => {
        // The pilot ran no more than its first block, and (the running tally) no more than one solve's dense work past the budget.
        expect(check.work[c]).toBeGreaterThan(0);
        expect(check.work[c]).toBeLessThanOrEqual(firstBlockWork(run, w.model, settings, points[c]));
        expect(check.work[c]).toBeLessThan(SWEEP_CHECK_BUDGET + 35 * w.model.linear!.features.dim ** 3);
      });
    } finally {
      run.dispose();
    }
  }, 600_000);

  it('gives the same answers under a roomy budget, and skips after the first block a check that would pass the budget', async () => {
    const run = await projectRun('heating-loop');
    try {
      const { context, settings, works, points } = sweepInputs(run);
      const check = (budget?: number) => checkDiscountSweep(context, works, settings, 2, points, { level: 0.9, seed: 1, resamples: 200, ...(budget === undefined ? {} : { budget }) });
      const atDefault = check(), roomy = check(1e13);
      expect(roomy).toEqual(atDefault);
      expect(atDefault.note).toBeNull();
      expect(atDefault.marks.some((m) => m.some(Boolean))).toBe(true); // the rate-limited PI is crossed at two discounts: a check with something to lose
      // Half of what the largest check runs: the pilot carries its first block to all 200 resamples and stops there.
      const half = Math.max(...atDefault.work) / 2, tight = check(half);
      expect(tight.note).toBe(skippedNote);
      works.forEach((w, c) => expect(tight.work[c]).toBeLessThanOrEqual(firstBlockWork(run, w.model, settings, points[c])));
    } finally {
      run.dispose();
    }
  }, 600_000);

  it('stops the resamples where what they ran reaches the limit, and leaves the answers below it as they were', async () => {
    const run = await projectRun('heating-loop', 3);
    try {
      const model = run.models.find((m) => m.name === limited)!, linear = model.linear!;
      if (linear.resampling.kind !== 'exact') throw new Error('expected exact resampling');
      const solve = linearSolveSettings(run.plan, model), xiBar = meanStartFeatures(linear.startFeatures, linear.features.dim);
      const setup: LinearReplicateSetup = { ...solve, sums: linear.resampling.sums, startFeatures: linear.startFeatures, startsFollowEpisodes: run.plan.starts.followEpisodes, startEpisode: run.plan.starts.episode };
      const settings = SWEEP_FACTORS.map((f) => sweptDiscount(solve.discount, f)), starts = settings.map((g) => reachedSolve({ ...solve, discount: g }, linear.statistics, xiBar).weights);
      const block = Array.from({ length: RESAMPLE_BLOCK }, (_, r) => episodeMultiplicities(run.plan.episodes.episodes, 1, r));
      const scratch = block.map(() => new Float64Array(setup.sums.stride));
      const free = linearFqeReplicateDiscounts(setup, block, scratch, settings, starts);
      const roomy: SolveTally = { units: 0, limit: 1e13 };
      expect(linearFqeReplicateDiscounts(setup, block, scratch, settings, starts, roomy)).toEqual(free);
      expect(overBudget(roomy)).toBe(false);
      // A limit a tenth of what the block runs: stopped, and by no more than one solve's dense work past it (the iteration is stopped at it).
      const tight: SolveTally = { units: 0, limit: roomy.units / 10 };
      linearFqeReplicateDiscounts(setup, block, scratch, settings, starts, tight);
      const d = linear.features.dim;
      expect(overBudget(tight)).toBe(true);
      expect(tight.units).toBeLessThan(tight.limit! + 35 * d ** 3);
      console.log(`heating loop, degree 3, ${limited}: ${block.length} resamples ran ${roomy.units.toExponential(3)} multiply-adds; stopped at ${tight.units.toExponential(3)} under a limit of ${tight.limit!.toExponential(3)} (budget ${SWEEP_CHECK_BUDGET.toExponential(0)})`);
    } finally {
      run.dispose();
    }
  }, 600_000);
});
