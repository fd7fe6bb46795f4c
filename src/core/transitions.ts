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
  /**
   * The run column's cell on each episode's first kept row, as the import reads it (null where it could not
   * be read); absent where runs are not cut by a run column. Words name runs by it (core/runLabelText.ts).
   */
  readonly episodeLabels?: readonly (string | null)[]; // e
  /**
   * Bounds every step's reward keeps whatever the plant does under any policy, from the reward's
   * definition, in reward sense; either end may be infinite. Absent when nothing is known beyond the logs.
   */
  readonly rewardBounds?: RewardBounds;
  /**
   * The whole log, the runs left out by label included (data.csv.excludedRuns), for the run-order check
   * only (pipeline/runOrderCheck.ts): the runs kept cannot tell alone that they were cut from a log that
   * changed. Absent when no run is left out.
   */
  readonly wholeLog?: WholeLog;
}

/** Every run of the log in data order, kept or left out, and which are kept. */
export interface WholeLog {
  /** The same rows, problems and time windows as the import's, only the runs left out not applied. */
  readonly transitions: TransitionSet;
  /** Per episode of `transitions`: 1 where the run is among those evaluated, 0 where the project leaves it out. */
  readonly keptRuns: Uint8Array; // episodes of transitions
}

/**
 * What a reward's definition guarantees on every step, in reward sense: found from its formula
 * (src/data/expressionBounds.ts), or declared in the project for a column (checked on every logged row).
 */
export interface RewardBounds {
  readonly lower: number;
  readonly upper: number;
  readonly from: 'formula' | 'declaration';
}

/** The logged (s_i, a_i) of transition i into out (length ds + m): the input of a state–action feature map. */
export function loggedStateAction(data: TransitionSet, i: number, out: Float64Array): void {
  const ds = data.stateDim, m = data.actionDim;
  for (let c = 0; c < ds; c++) out[c] = data.states[i * ds + c];
  for (let c = 0; c < m; c++) out[ds + c] = data.actions[i * m + c];
}
