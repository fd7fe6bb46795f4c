/**
 * reachedSolve forms each resample's ridge system (G + λD and its Cholesky factor) once for every
 * swept discount, and the contraction bound once per solve (issue 11): before, the contraction test
 * formed the Gram and its factor again after the solve had, and where no contraction was proved the
 * iteration formed the bound a second time. The numbers must not move: every J, status and step count
 * of the sweep's routes is held bit for bit to what the code gave before the change
 * (test/fixtures/sweepSolves/before.json, recorded by sweepSolveCases.ts on the commit before it), on
 * every sample project, the heating loop with degree-3 features and the linear-quadratic cascade plant;
 * and the cascade's sweep is held to the exact discrete-Lyapunov value (Bertsekas, "Dynamic Programming
 * and Optimal Control", vol. I, 4th ed., §4.1; src/core/lq.ts).
 */
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it, vi } from 'vitest';
import { sweptDiscount } from '../../../src/pipeline/assessSensitivity';
import type { SolveTally } from '../../../src/core/bootstrap/solveWork';
import { linearFqeReplicateDiscounts, reachedSolve } from '../../../src/core/bootstrap/linearFqeReplicate';
import { episodeMultiplicities } from '../../../src/core/bootstrap/episodeMultiplicities';
import { RESAMPLE_BLOCK } from '../../../src/core/offPolicy/perDecisionResamples';
import { exactPolicyValue } from '../linearGaussianPlant';
import { cascadeLogging, cascadePlant } from '../testPlants';
import { cascadeCase, cascadeSetup, sampleCases, SWEEP_FACTORS, type RecordedCase } from './sweepSolveCases';

const calls = vi.hoisted(() => ({ factor: 0, matrix: 0 }));
vi.mock('../../../src/core/fqe/ridgeSystem', async (importOriginal) => {
  const actual = await importOriginal<typeof import('../../../src/core/fqe/ridgeSystem')>();
  return {
    ...actual,
    ridgeGramFactor: (...args: Parameters<typeof actual.ridgeGramFactor>) => (calls.factor++, actual.ridgeGramFactor(...args)),
    iterationMatrix: (...args: Parameters<typeof actual.iterationMatrix>) => (calls.matrix++, actual.iterationMatrix(...args)),
  };
});

const before = JSON.parse(readFileSync(join(__dirname, '..', '..', 'fixtures', 'sweepSolves', 'before.json'), 'utf8')) as RecordedCase[];

describe('the sweep’s solves with one ridge system per resample and the bound formed once', () => {
  it('gives every J, status and step count as before, bit for bit, on the samples and the cascade plant', async () => {
    const now = [cascadeCase(), ...(await sampleCases())];
    expect(now.map((c) => c.name)).toEqual(before.map((c) => c.name));
    now.forEach((c, i) => expect(c).toEqual(before[i]));
    // The cases reach both routes of the rule: resamples the iteration does not reach (degree 3, rate-limited PI) as well as proved contractions.
    expect(before.some((c) => c.resamples.some((r) => r.includes(null)))).toBe(true);
  }, 600_000);

  it('keeps the cascade plant’s sweep within three bootstrap standard errors of the exact discrete-Lyapunov value', () => {
    const { data, solve, full, xiBar } = cascadeSetup(), recorded = before[0];
    const replicates = recorded.resamples.map((r) => r.map((hex) => new DataView(BigUint64Array.of(BigInt(`0x${hex}`)).buffer).getFloat64(0, true)));
    SWEEP_FACTORS.forEach((f, k) => {
      const g = sweptDiscount(solve.discount, f), fit = reachedSolve({ ...solve, discount: g }, full, xiBar);
      const exact = exactPolicyValue(cascadePlant, cascadeLogging, g, data.startStates);
      const values = replicates.map((r) => r[k]), mean = values.reduce((a, b) => a + b, 0) / values.length;
      const se = Math.sqrt(values.reduce((a, b) => a + (b - mean) ** 2, 0) / (values.length - 1));
      expect(fit.status).toBe('converged');
      expect(Math.abs(fit.policyValue! - exact)).toBeLessThan(3 * se); // measured 0.3 % of J off at every γ
    });
  });

  it('forms one ridge factor per resample and at most one iteration matrix per solve, and counts the work it did', () => {
    const { data, solve, full, xiBar } = cascadeSetup(), setup = { ...cascadeSetup().setup };
    const settings = SWEEP_FACTORS.map((f) => sweptDiscount(solve.discount, f)), points = settings.map((g) => reachedSolve({ ...solve, discount: g }, full, xiBar));
    const block = Array.from({ length: RESAMPLE_BLOCK }, (_, r) => episodeMultiplicities(data.episodeCount, 1, r));
    const scratch = block.map(() => new Float64Array(setup.sums.stride)), tally: SolveTally = { units: 0 };
    calls.factor = 0;
    calls.matrix = 0;
    linearFqeReplicateDiscounts(setup, block, scratch, settings, points.map((p) => p.weights), tally);
    console.log(`cascade, ${block.length} resamples × ${settings.length} discounts: ${calls.factor} ridge factors, ${calls.matrix} iteration matrices, ${tally.units.toExponential(3)} multiply-adds counted`);
    expect(calls.factor).toBe(block.length);
    expect(calls.matrix).toBeLessThanOrEqual(block.length * settings.length);
    const d = setup.sums.dim;
    expect(tally.units).toBeGreaterThanOrEqual(block.length * (data.episodeCount * d * d + d ** 3 / 6 + settings.length * (d ** 3 / 3 + d ** 3)));
  });
});
