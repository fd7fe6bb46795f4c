/**
 * The rollout check's simulations (assessRollouts.ts), written once for whichever thread runs them:
 * per policy, J by model rollouts on the full data's one-step model and on its refit on each of the
 * first rollout resamples (multiplicities drawn from (seed, b), as the resample loop draws them).
 * They depend on nothing the fitted Q-evaluation computes, so a helper thread can run them while
 * the loop's own thread takes the resamples; rolloutCheck then pairs them with the fit's own
 * replicates. A ModelFitError or ModelValueError gives the policy's reason, on either thread; any
 * other error is thrown (a helper thread that meets one stops, and the loop's thread meets it again).
 *
 * What crosses a thread boundary is plain data: the job with its feature maps as specs (rebuilt on
 * the thread by createFeatureMap: the same spec, the same numbers) and the moments' sums
 * transferred (`rolloutTransferables`), and the values, or the reason as words.
 */
import { episodeMultiplicities } from '../core/bootstrap/episodeMultiplicities';
import { createFeatureMap } from '../core/features/featureMap';
import type { FeatureMapSpec } from '../core/features/featureTypes';
import { throwIfCancelled, type CancellationCheck } from '../core/fqe/cancellation';
import { ModelFitError } from '../core/offPolicy/linearQuadraticModel';
import { ModelValueError } from '../core/offPolicy/modelBasedValue';
import { modelRolloutValue, TAIL_WEIGHT, type RolloutSettings, type RolloutValue } from '../core/offPolicy/modelRollouts';
import { fitPolynomialModel, type PolynomialModelFit, type PolynomialModelRegressions } from '../core/offPolicy/polynomialDynamicsModel';
import type { GaussianPolicy } from '../core/policy';

/** Everything a thread needs to simulate every policy's rollouts on its own. */
export interface RolloutJob {
  readonly regressions: PolynomialModelRegressions;
  /** Per policy in the check's order (the candidates, then the present controller). */
  readonly policies: readonly GaussianPolicy[];
  readonly discount: number;
  readonly startStates: Float64Array; // count×ds, the check's subset
  readonly rollout: RolloutSettings;
  /** Resamples 0 … resamples − 1 of the bootstrap with this seed over this many episodes. */
  readonly seed: number;
  readonly episodes: number;
  readonly resamples: number;
}

/** A policy's rollouts: on the full data, and on each rollout resample; or why there are none. */
export type RolloutValues = { readonly full: RolloutValue; readonly resampled: readonly number[] } | { readonly reason: string };

/** The job as it crosses a thread boundary: its feature maps as specs. */
export type SentRolloutJob = Omit<RolloutJob, 'regressions'> & {
  readonly regressions: Omit<PolynomialModelRegressions, 'dynamicsFeatures' | 'rewardFeatures'> & { readonly dynamicsFeatures: FeatureMapSpec; readonly rewardFeatures: FeatureMapSpec };
};

/** Every policy's rollouts, the model's refits formed once for every policy (a failed refit fails every policy alike). */
export function rolloutValues(job: RolloutJob, cancel?: CancellationCheck): RolloutValues[] {
  const full = fitOrError(job.regressions), refits = new Map<number, PolynomialModelFit | ModelFitError>();
  const refit = (b: number, c: Uint32Array): PolynomialModelFit => {
    let fit = refits.get(b);
    if (!fit) refits.set(b, (fit = fitOrError(job.regressions, c)));
    if (fit instanceof ModelFitError) throw fit;
    return fit;
  };
  return job.policies.map((policy) => {
    try {
      if (full instanceof ModelFitError) throw full;
      const value = modelRolloutValue(full, policy, job.discount, job.startStates, job.rollout), c = new Uint32Array(job.episodes), resampled: number[] = [];
      for (let b = 0; b < job.resamples; b++) {
        throwIfCancelled(cancel);
        episodeMultiplicities(job.episodes, job.seed, b, c);
        resampled.push(modelRolloutValue(refit(b, c), policy, job.discount, job.startStates, job.rollout).value);
      }
      return { full: value, resampled };
    } catch (error) {
      if (error instanceof ModelFitError || error instanceof ModelValueError) return { reason: error.message };
      throw error;
    }
  });
}

function fitOrError(regressions: PolynomialModelRegressions, c?: Uint32Array): PolynomialModelFit | ModelFitError {
  try {
    return fitPolynomialModel(regressions, c);
  } catch (error) {
    if (error instanceof ModelFitError) return error;
    throw error;
  }
}

export function sendRolloutJob(job: RolloutJob): SentRolloutJob {
  const r = job.regressions;
  return { ...job, regressions: { ...r, dynamicsFeatures: r.dynamicsFeatures.toSpec(), rewardFeatures: r.rewardFeatures.toSpec() } };
}

export function receiveRolloutJob(sent: SentRolloutJob): RolloutJob {
  const r = sent.regressions;
  return { ...sent, regressions: { ...r, dynamicsFeatures: createFeatureMap(r.dynamicsFeatures), rewardFeatures: createFeatureMap(r.rewardFeatures) } };
}

/** The answer has one entry per policy of the job, each values with one per resample or a reason. */
export function answersRollouts(values: readonly RolloutValues[], job: Pick<RolloutJob, 'policies' | 'resamples'>): boolean {
  return values.length === job.policies.length && values.every((v) => 'reason' in v || v.resampled.length === job.resamples);
}

/** The buffers of the episodes' moments (the large arrays): a host transfers these instead of copying them. */
export function rolloutTransferables(job: SentRolloutJob): ArrayBuffer[] {
  return [job.regressions.dynamics.sums.buffer, job.regressions.reward.sums.buffer].filter((b): b is ArrayBuffer => b instanceof ArrayBuffer);
}

/** Simulated steps in all (policies × (resamples + 1) × starts × rollouts per start × steps per rollout): a measure of the job's work (perDecisionRoute.ts). */
export function rolloutSteps(job: Omit<SentRolloutJob, 'regressions'> & { readonly regressions: { readonly stateDim: number } }): number {
  const starts = job.startStates.length / job.regressions.stateDim, steps = Math.ceil(Math.log(TAIL_WEIGHT) / Math.log(job.discount));
  return job.policies.length * (job.resamples + 1) * starts * job.rollout.rolloutsPerStart * steps;
}
