/**
 * The sweep check's budget counts what runs (pipeline/assessSweepCheck.ts, core/bootstrap/solveWork.ts;
 * the rule and its table: test/battery/README.md, "The sweep check's budget"). Before, it counted one
 * d³ per resample and discount and the full data's iteration steps, so on the heating-loop sample with
 * degree-3 features (an invented edit of its project) it let run checks that took 6–29 s where it
 * meant about a second: the contraction bound's squarings and the resamples that do not contract,
 * iterating up to maxIterations, were not counted.
 */
import { describe, expect, it } from 'vitest';
import { episodeMultiplicities } from '../../src/core/bootstrap/episodeMultiplicities';
import { linearFqeReplicateDiscounts, reachedSolve, type LinearReplicateSetup } from '../../src/core/bootstrap/linearFqeReplicate';
import { overBudget, type SolveTally } from '../../src/core/bootstrap/solveWork';
import { meanStartFeatures } from '../../src/core/features/policyFeatures';
import { SWEEP_CHECK_BUDGET } from '../../src/core/limits';
import { RESAMPLE_BLOCK } from '../../src/core/offPolicy/perDecisionResamples';
import { candidateWork, linearSolveSettings, type AssessmentContext } from '../../src/pipeline/assessCandidate';
import { sweptDiscount } from '../../src/pipeline/assessSensitivity';
import { checkDiscountSweep } from '../../src/pipeline/assessSweepCheck';
import { projectRun, SWEEP_FACTORS } from '../core/bootstrap/sweepSolveCases';

const limited = 'PI with a 2 %/min rate limit';

describe('the sweep check’s budget', () => {
  it('skips the degree-3 heating loop’s checks before running them, and says so', async () => {
    const run = await projectRun('heating-loop', 3);
    try {
      const context: AssessmentContext = { plan: run.plan, presentController: null, presentControllerModel: null, presentControllerReason: '' };
      const settings = SWEEP_FACTORS.map((f) => sweptDiscount(run.plan.discount, f)), works = run.models.map((m) => candidateWork(context, m));
      const points = works.map((w) => {
        const linear = w.model.linear!, solve = linearSolveSettings(run.plan, w.model);
        return settings.map((g) => reachedSolve({ ...solve, discount: g }, linear.statistics, meanStartFeatures(linear.startFeatures, linear.features.dim)));
      });
      const check = checkDiscountSweep(context, works, settings, 2, points, { level: 0.9, seed: 1, resamples: 200 });
      expect(check.note).toBe('The discount sweep of the candidates is not checked against what the costs allow: re-solving this fit on 200 resamples at every swept discount would take longer than the check is given.');
      expect(check.work).toEqual(works.map(() => 0));
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
