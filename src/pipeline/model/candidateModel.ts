/**
 * One model per candidate, built once and extended: its policy, its action quadrature, the fit of
 * Q^π and — for the linear approximator — the per-episode sums behind it, from which the full-data
 * fit, every bootstrap resample, the discount sweep and the shift measure are solved without
 * another pass over the data. The evaluation reads J and surfaces from it; the assessment extends
 * it; the app's worker keeps it to answer surface and slice questions. Values are in reward terms
 * (the engine's sense); the pipeline turns them into the project's sense on the way out.
 */
import type { ActionQuadrature } from '../../core/actionQuadrature';
import type { EpisodeBellmanSums } from '../../core/bootstrap/episodeBellmanSums';
import type { LinearisedReplicates } from '../../core/bootstrap/linearisedReplicate';
import type { FeatureMap } from '../../core/features/featureMap';
import type { BellmanStatistics } from '../../core/fqe/bellmanStatistics';
import type { CandidateFit } from '../candidateFit';
import type { PlannedPolicy } from '../plan/evaluationPlan';

/**
 * How a linear fit's bootstrap resamples are solved: by reweighting its per-episode sums (exact), to
 * first order from per-episode influence values when the sums would be too many (linearised), or
 * not at all (the reason says why).
 */
export type LinearResampling =
  | { readonly kind: 'exact'; readonly sums: EpisodeBellmanSums }
  | { readonly kind: 'linearised'; readonly replicates: LinearisedReplicates }
  | { readonly kind: 'none'; readonly reason: string };

/** What a linear fit is: its features and the settings of its solve. */
export interface LinearFitSpec {
  readonly features: FeatureMap;
  readonly ridge: number;
  readonly tolerance: number;
  readonly maxIterations: number;
}

/** The linear fit's one-pass material. */
export interface LinearMaterial extends LinearFitSpec {
  readonly resampling: LinearResampling;
  /** The full data's Bellman statistics. */
  readonly statistics: BellmanStatistics;
  /** ξ(s0) per start state, count×d (startFeatures.ts): J(w) is their mean times w. */
  readonly startFeatures: Float64Array;
  /** Weights of the reported solution (d). */
  readonly weights: Float64Array;
  /** True when the reported solution is the LSTD-Q fixed point of the sums (resamples are then solved there directly). */
  readonly atFixedPoint: boolean;
}

export interface CandidateModel extends PlannedPolicy {
  readonly quadrature: ActionQuadrature;
  readonly fit: CandidateFit;
  /** Null for a network approximator. */
  readonly linear: LinearMaterial | null;
  /** Release what the fit holds (a network's tensors); a no-op for linear fits. */
  dispose(): void;
}
