/**
 * The interface every fitted action-value function Q(s, a) offers to the value computations,
 * whether it is linear in features or a neural network.
 */
export interface ActionValueFunction {
  readonly stateDim: number;
  readonly actionDim: number;
  /**
   * Evaluate Q at `count` points. inputs: count×(stateDim+actionDim) row-major, each row [s, a];
   * writes Q to out[0..count).
   */
  evaluate(inputs: Float64Array, count: number, out: Float64Array): void;
}
