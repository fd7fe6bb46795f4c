/**
 * Other intervals of a linear candidate's difference from the present controller, on the very
 * resamples the assessment draws (episodeMultiplicities(e, seed, b), b < B): the percentile
 * interval again (it must equal the assessment's: a check that the resamples are the same), the
 * studentised (bootstrap-t) interval with each resample's standard error from the per-run
 * influence values — held at the full-data fit ("fixed"), or taken again at the resample's own fit
 * ("refit", the textbook form: v* is the same function of the resample as v of the data) — and
 * BCa (Efron & Tibshirani 1993, §14.3, acceleration from the empirical influence values, Davison &
 * Hinkley 1997, eq. 5.25). Values in the project's sense. Used by differenceCoverage.ts (ALT=1).
 */
import { sampleQuantile } from '../src/core/bootstrap/bootstrapInterval';
import { resampleBellmanStatistics, type EpisodeBellmanSums } from '../src/core/bootstrap/episodeBellmanSums';
import { episodeMultiplicities } from '../src/core/bootstrap/episodeMultiplicities';
import { linearFqeReplicate, type LinearReplicateSetup } from '../src/core/bootstrap/linearFqeReplicate';
import { linearisedReplicatesFromSums, type LinearisationInput } from '../src/core/bootstrap/linearisedReplicate';
import { policyValueInfluence } from '../src/core/bootstrap/policyValueInfluence';
import { startMultiplicities } from '../src/core/bootstrap/startMultiplicities';
import { influenceStandardError, studentisedInterval } from '../src/core/bootstrap/studentisedInterval';
import { meanStartFeatures } from '../src/core/features/policyFeatures';
import { normalCdf } from '../src/core/normalDistribution';
import { linearSolveSettings } from '../src/pipeline/assessCandidate';
import type { CandidateModel } from '../src/pipeline/model/candidateModel';
import type { ProjectRun } from '../src/pipeline/projectRun';

export type Interval = readonly [number, number];
export interface DifferenceIntervals { percentile: Interval; studentisedFixed: Interval; studentisedRefit: Interval; bca: Interval }

interface PolicyResamples { point: number; influence: Float64Array; values: number[]; refitInfluence: Float64Array[] }

function resamplesOf(run: ProjectRun, model: CandidateModel, seed: number, resamples: number): PolicyResamples {
  const { plan } = run, linear = model.linear;
  if (!linear || linear.resampling.kind !== 'exact') throw new Error(`${model.name}: needs a linear fit with exact resamples`);
  const sums: EpisodeBellmanSums = linear.resampling.sums, e = plan.episodes.episodes, d = linear.features.dim;
  const setup: LinearReplicateSetup = {
    ...linearSolveSettings(plan, model), sums, startFeatures: linear.startFeatures, startsFollowEpisodes: plan.starts.followEpisodes, startEpisode: plan.starts.episode,
  };
  const input: LinearisationInput = {
    data: plan.data, index: plan.episodes, features: linear.features, quadrature: model.quadrature, statistics: linear.statistics, weights: linear.weights,
    ridge: linear.ridge, discount: plan.discount, startFeatures: linear.startFeatures, startsFollowEpisodes: plan.starts.followEpisodes, startEpisode: plan.starts.episode,
  };
  const point = linearFqeReplicate(setup, new Uint32Array(e).fill(1)).policyValue!;
  const influence = policyValueInfluence(linearisedReplicatesFromSums(input, sums));
  const values: number[] = [], refitInfluence: Float64Array[] = [];
  for (let b = 0; b < resamples; b++) {
    const c = episodeMultiplicities(e, seed, b), r = linearFqeReplicate(setup, c);
    if (r.policyValue === null || !r.weights) throw new Error(`${model.name}: resample ${b} has no value (${r.status})`);
    values.push(r.policyValue);
    const starts = plan.starts.followEpisodes ? startMultiplicities(c, plan.starts.episode) : undefined;
    const at = { ...input, statistics: resampleBellmanStatistics(sums, c), weights: r.weights, meanStartFeatures: meanStartFeatures(linear.startFeatures, d, starts) };
    refitInfluence.push(policyValueInfluence(linearisedReplicatesFromSums(at, sums), c));
  }
  return { point, influence, values, refitInfluence };
}

/** Φ⁻¹ by bisection on Φ (normalDistribution.ts, accurate to about 1e-15): 80 halvings of [−40, 40]. */
function normalQuantile(p: number): number {
  let lo = -40, hi = 40;
  for (let i = 0; i < 80; i++) {
    const mid = (lo + hi) / 2;
    if (normalCdf(mid) < p) lo = mid; else hi = mid;
  }
  return (lo + hi) / 2;
}

function bca(point: number, values: number[], influence: Float64Array, level: number): Interval {
  const sorted = Float64Array.from(values).sort(), below = values.filter((v) => v < point).length;
  const z0 = normalQuantile(below / values.length);
  let s2 = 0, s3 = 0;
  for (const l of influence) { s2 += l * l; s3 += l * l * l; }
  const a = s3 / (6 * s2 ** 1.5), alpha = 1 - level;
  const at = (z: number) => normalCdf(z0 + (z0 + z) / (1 - a * (z0 + z)));
  return [sampleQuantile(sorted, at(normalQuantile(alpha / 2))), sampleQuantile(sorted, at(normalQuantile(1 - alpha / 2)))];
}

/** Per candidate, in the run's order: the intervals of candidate − present controller. */
export function differenceIntervals(run: ProjectRun, seed: number, resamples: number, level: number): DifferenceIntervals[] {
  const today = resamplesOf(run, run.presentController!, seed, resamples), sign = run.plan.sign;
  const flip = ([lo, hi]: Interval): Interval => (sign > 0 ? [lo, hi] : [-hi, -lo]);
  return run.models.map((m) => {
    const own = resamplesOf(run, m, seed, resamples), point = own.point - today.point;
    const values = own.values.map((v, b) => v - today.values[b]);
    const influence = own.influence.map((l, k) => l - today.influence[k]), se = influenceStandardError(influence);
    const fixed = values.map((_, b) => influenceStandardError(influence, episodeMultiplicities(influence.length, seed, b)));
    const refit = values.map((_, b) => influenceStandardError(own.refitInfluence[b].map((l, k) => l - today.refitInfluence[b][k]), episodeMultiplicities(influence.length, seed, b)));
    const sorted = Float64Array.from(values).sort();
    return {
      percentile: flip([sampleQuantile(sorted, (1 - level) / 2), sampleQuantile(sorted, (1 + level) / 2)]),
      studentisedFixed: flip(studentisedInterval(point, se, values, fixed, level).interval),
      studentisedRefit: flip(studentisedInterval(point, se, values, refit, level).interval),
      bca: flip(bca(point, values, influence, level)),
    };
  });
}
