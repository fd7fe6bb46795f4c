/**
 * The rollout check's simulations (assessRollouts.ts), written once for whichever thread runs them:
 * the one-step model's regressions formed from the log, then per policy, J by model rollouts on the
 * full data's model and on its refit on each of the first rollout resamples (multiplicities drawn
 * from (seed, b), as the resample loop draws them). They depend on nothing the fitted Q-evaluation
 * computes, so a helper thread can run all of it — the model's pass over the data included — while
 * the loop's thread fits the function classes; rolloutCheck then pairs them with the fit's own
 * replicates. A ModelFitError or ModelValueError gives the policy's reason (every policy's, where
 * the model itself cannot be fitted), on either thread; where the log's runs end in an end state,
 * the model includes the chance that a step ends its run (endChanceModel.ts), refitted with it; any other error is thrown (a helper thread
 * that meets one stops, and the loop's thread meets it again).
 *
 * What crosses a thread boundary is plain data: the columns the model reads (ModelData, copied:
 * the loop's thread keeps its own), the episode index, the settings; and the values, or the reason
 * as words.
 */
import { episodeMultiplicities } from '../core/bootstrap/episodeMultiplicities';
import type { EpisodeIndex } from '../core/bootstrap/episodeTransitions';
import { throwIfCancelled, type CancellationCheck } from '../core/fqe/cancellation';
import { ModelFitError } from '../core/offPolicy/linearQuadraticModel';
import { endChanceData, fitEndChance, type EndChanceData, type EndChanceFit } from '../core/offPolicy/endChanceModel';
import { ModelValueError } from '../core/offPolicy/modelBasedValue';
import { modelRolloutValue, TAIL_WEIGHT, type RolloutSettings, type RolloutValue } from '../core/offPolicy/modelRollouts';
import {
  fitPolynomialModel, fitPolynomialModels, polynomialModelRegressions, type ModelData, type PolynomialModelFit, type PolynomialModelOptions, type PolynomialModelRegressions,
} from '../core/offPolicy/polynomialDynamicsModel';
import { PolicyError, type GaussianPolicy } from '../core/policy';
import { recordedStreams } from '../core/recordedRandom';

/** What the one-step model is formed from: the log's columns it reads, its episodes, its degrees. */
export interface RolloutSource {
  readonly data: ModelData;
  readonly index: EpisodeIndex;
  readonly options: PolynomialModelOptions;
}

/** Everything a thread needs to form the model and simulate every policy's rollouts on its own. */
export interface RolloutJob {
  readonly source: RolloutSource;
  /** Per policy in the check's order (the candidates, then the present controller). */
  readonly policies: readonly GaussianPolicy[];
  readonly discount: number;
  readonly startStates: Float64Array; // count×ds, the check’s subset
  readonly rollout: RolloutSettings;
  /** Resamples 0 … resamples − 1 of the bootstrap with this seed over this many episodes. */
  readonly seed: number;
  readonly episodes: number;
  readonly resamples: number;
}

/** A policy's rollouts: on the full data, and on each rollout resample; or why there are none. */
export type RolloutValues = { readonly full: RolloutValue; readonly resampled: readonly number[] } | { readonly reason: string };

/**
 * Every policy's rollouts, the model's refits formed once for every policy (a failed refit fails
 * every policy alike); where the model cannot be fitted to the full data, that reason for each.
 */
export function rolloutValues(job: RolloutJob, cancel?: CancellationCheck): RolloutValues[] {
  const model = fullModel(job.source);
  if (model instanceof ModelFitError) return job.policies.map(() => ({ reason: `no one-step model of the plant could be fitted (${model.message})` }));
  const { regressions, fit: full, ends } = model, refits = job.policies.length > 0 ? modelRefits(regressions, ends, job, cancel) : [];
  const streams = recordedStreams(); // every policy and refit runs from the same streams (common random numbers)
  return job.policies.map((policy) => {
    try {
      const value = modelRolloutValue(full, policy, job.discount, job.startStates, job.rollout, null, ends?.fit, streams);
      const resampled: number[] = [];
      for (const again of refits) {
        throwIfCancelled(cancel);
        if (again instanceof ModelFitError) throw again;
        resampled.push(modelRolloutValue(again.fit, policy, job.discount, job.startStates, job.rollout, null, again.ends, streams).value);
      }
      return { full: value, resampled };
    } catch (error) {
      if (error instanceof ModelFitError || error instanceof ModelValueError) return { reason: error.message };
      // A truncated policy whose mean the simulated plant drives dozens of dithers past its limits: this check only, said why.
      if (error instanceof PolicyError) return { reason: `the simulated plant reaches a state where the policy’s actions cannot be drawn (${error.message.replace(/^sampling: /, '')})` };
      throw error;
    }
  });
}

/** The end-chance model's data and its fit on the full data, where the log's runs end. */
interface EndChance {
  readonly data: EndChanceData;
  readonly fit: EndChanceFit;
}

interface ModelRefit {
  readonly fit: PolynomialModelFit;
  readonly ends: EndChanceFit | null;
}

/** The model's regressions (one pass over the data), its fit on the full data and its end chance; or why there is none. */
function fullModel(source: RolloutSource): { regressions: PolynomialModelRegressions; fit: PolynomialModelFit; ends: EndChance | null } | ModelFitError {
  try {
    const regressions = polynomialModelRegressions(source.data, source.index, source.options);
    const endData = endChanceData(source.data, source.index, regressions.rewardFeatures);
    return { regressions, fit: fitPolynomialModel(regressions), ends: endData && { data: endData, fit: fitEndChance(endData) } };
  } catch (error) {
    if (error instanceof ModelFitError) return error;
    throw error;
  }
}

/**
 * The model refitted on each rollout resample (multiplicities drawn from (seed, b)), their moments
 * summed four resamples to a read of the episodes' (fitPolynomialModels), each with its end chance
 * from the full data's (a few Newton steps); a refit that fails gives its error, met by every policy
 * that reaches it.
 */
function modelRefits(regressions: PolynomialModelRegressions, ends: EndChance | null, job: RolloutJob, cancel?: CancellationCheck): (ModelRefit | ModelFitError)[] {
  const out: (ModelRefit | ModelFitError)[] = [];
  for (let first = 0; first < job.resamples; first += REFITS_PER_READ) {
    throwIfCancelled(cancel);
    const block = Array.from({ length: Math.min(REFITS_PER_READ, job.resamples - first) }, (_, i) => episodeMultiplicities(job.episodes, job.seed, first + i, new Uint32Array(job.episodes)));
    fitPolynomialModels(regressions, block).forEach((fit, i) => out.push(fit instanceof ModelFitError ? fit : withEnds(fit, ends, block[i])));
  }
  return out;
}

/** Resamples refitted per read of the episodes' moments: resampleMomentsBlock sums four at a time. */
const REFITS_PER_READ = 4;

function withEnds(fit: PolynomialModelFit, ends: EndChance | null, c: Uint32Array): ModelRefit | ModelFitError {
  try {
    return { fit, ends: ends && fitEndChance(ends.data, c, ends.fit.weights) };
  } catch (error) {
    if (error instanceof ModelFitError) return error;
    throw error;
  }
}

/** The answer has one entry per policy of the job, each values with one per resample or a reason. */
export function answersRollouts(values: readonly RolloutValues[], job: Pick<RolloutJob, 'policies' | 'resamples'>): boolean {
  return values.length === job.policies.length && values.every((v) => 'reason' in v || v.resampled.length === job.resamples);
}

/**
 * Simulated steps in all (policies × (resamples + 1) × starts × rollouts per start × steps per
 * rollout): a measure of the job's work (perDecisionRoute.ts). The model's pass over the data is
 * not counted: it is done on one thread or the other in any case, and before the loop either way.
 */
export function rolloutSteps(job: Pick<RolloutJob, 'policies' | 'resamples' | 'startStates' | 'rollout' | 'discount'> & { readonly source: { readonly data: Pick<ModelData, 'stateDim'> } }): number {
  const starts = job.startStates.length / job.source.data.stateDim, steps = Math.ceil(Math.log(TAIL_WEIGHT) / Math.log(job.discount));
  return job.policies.length * (job.resamples + 1) * starts * job.rollout.rolloutsPerStart * steps;
}
