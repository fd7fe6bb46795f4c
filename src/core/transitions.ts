/**
 * A dataset of logged transitions (s, a, r, s', done) in columnar form, as every estimator takes it.
 * Shapes in comments: n transitions, ds state dimensions, m action dimensions, e episodes.
 */
export interface TransitionSet {
  readonly count: number; // n
  readonly stateDim: number; // ds
  readonly actionDim: number; // m
  readonly stateNames: readonly string[];
  readonly actionNames: readonly string[];
  readonly states: Float64Array; // n×ds row-major
  readonly actions: Float64Array; // n×m row-major
  readonly rewards: Float64Array; // n (already a reward: costs were negated on import)
  readonly nextStates: Float64Array; // n×ds row-major
  /** 1 where s' is terminal (no bootstrapping past it), else 0. */
  readonly terminal: Uint8Array; // n
  /** Episode of each transition, 0-based, in file order. */
  readonly episode: Int32Array; // n
  readonly episodeCount: number; // e
  /** First state of each episode (the start-state distribution for J). */
  readonly startStates: Float64Array; // e×ds
  /** 1-based line number in the source file of the row each transition starts at (header = line 1). */
  readonly sourceLine: Int32Array; // n
}
