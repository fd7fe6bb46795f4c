/**
 * The linear-quadratic model cross-check's share of the resample loop (assessResamples.ts), written
 * once for whichever thread runs it, like the per-decision share (perDecisionBlocks.ts): per block
 * of resamples, the model refitted from the episodes' moments (fitLinearQuadraticModels, one read
 * of the moments per block) and J of each candidate it applies to on every refit (modelPolicyValue,
 * the start states weighted by the resample's multiplicities where they follow the episodes). A
 * refit that fails (ModelFitError) or a value the closed form cannot give (assessModelCheck.ts,
 * isModelValueFailure) is a null replicate on either thread; any other error is thrown, and a
 * helper thread that meets one stops, so that the loop's own thread meets it again.
 *
 * What crosses a thread boundary is plain data: the job (the moments' sums transferred, not copied:
 * `modelTransferables`) and each block's values, numbers or null.
 */
import { startMultiplicities } from '../core/bootstrap/startMultiplicities';
import { fitLinearQuadraticModels, ModelFitError, type ModelRegressions } from '../core/offPolicy/linearQuadraticModel';
import { modelPolicyValue } from '../core/offPolicy/modelBasedValue';
import type { GaussianPolicy } from '../core/policy';
import { isModelValueFailure } from './assessModelCheck';

/** Everything a thread needs to compute the model's replicates on its own. */
export interface ModelJob {
  readonly regressions: ModelRegressions;
  /** Per candidate in the loop's order: its policy where the model applies to it, else null (no replicates). */
  readonly policies: readonly (GaussianPolicy | null)[];
  readonly discount: number;
  /** count×ds, and the episode of each start state when they follow the episodes (StartStates in plan/planTypes.ts). */
  readonly starts: { readonly states: Float64Array; readonly followEpisodes: boolean; readonly episode?: Int32Array };
}

/** Per candidate of the job, J on each resample of the block (null where the refit or the value failed); null for a candidate without replicates. */
export type ModelBlockValues = ((number | null)[] | null)[];

/** The model's replicates on the block's resamples (multiplicities, one array per resample). */
export function modelBlock(job: ModelJob, drawn: readonly Uint32Array[]): ModelBlockValues {
  const fitted = fitLinearQuadraticModels(job.regressions, drawn).map((f) => (f instanceof ModelFitError ? null : f));
  const { discount, starts } = job;
  return job.policies.map((policy) => policy && drawn.map((c, i) => {
    const fit = fitted[i];
    if (!fit) return null;
    const weights = starts.followEpisodes ? startMultiplicities(c, starts.episode) : undefined;
    try {
      return modelPolicyValue(fit, policy, discount, starts.states, weights);
    } catch (error) {
      if (isModelValueFailure(error)) return null;
      throw error;
    }
  }));
}

/** The answer has one row per candidate of the job, null exactly where the job has no policy, each row one value per resample drawn. */
export function answersModelBlock(values: ModelBlockValues, job: Pick<ModelJob, 'policies'>, count: number): boolean {
  return values.length === job.policies.length && values.every((row, k) => (row === null ? job.policies[k] === null : job.policies[k] !== null && row.length === count));
}

/** Moment values read per resample: a measure of the model's share of the work (perDecisionRoute.ts). */
export function modelMomentValues(job: ModelJob): number {
  return job.regressions.dynamics.sums.length + job.regressions.cost.sums.length;
}

/** The buffers of the episodes' moments (the large arrays): a host transfers these instead of copying them. */
export function modelTransferables(job: ModelJob): ArrayBuffer[] {
  return [job.regressions.dynamics.sums.buffer, job.regressions.cost.sums.buffer].filter((b): b is ArrayBuffer => b instanceof ArrayBuffer);
}
