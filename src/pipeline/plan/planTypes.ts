/** The parts of an evaluation plan (evaluationPlan.ts) that its builders share, in a file of their own. */
import type { GaussianPolicy } from '../../core/policy';
import type { ValueSurfaceOptions } from '../../core/value';

/** A policy the plan evaluates: a candidate of the project (index into project.candidates). */
export interface PlannedPolicy {
  readonly index: number;
  readonly name: string;
  readonly policy: GaussianPolicy;
}

export interface StartStates {
  readonly states: Float64Array; // count×ds
  readonly count: number;
  /** True when the start states are episodes' first states (so they are resampled with their episodes). */
  readonly followEpisodes: boolean;
  /** Episode of each start state when some episode has none (TransitionSet.startEpisode); absent: start k is episode k's. */
  readonly episode?: Int32Array;
}

export type SurfaceGrid = ValueSurfaceOptions & { readonly xState: string; readonly yState: string };
