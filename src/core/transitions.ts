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
  /**
   * The start-state distribution for J: the first state of each episode whose first row is in the
   * data (k ≤ e rows; an episode whose first row was excluded has no start state).
   */
  readonly startStates: Float64Array; // k×ds
  /**
   * Episode of each start state (k), when some episode has none; absent means start state k is
   * episode k's (k = e). A bootstrap that resamples starts with their episodes maps through it
   * (bootstrap/startFeatures.ts, startMultiplicities).
   */
  readonly startEpisode?: Int32Array; // k
  /** 1-based line number in the source file of the row each transition starts at (header = line 1). */
  readonly sourceLine: Int32Array; // n
}
