/**
 * The work of a linear fit's solves, in one unit — multiply-adds, counted by what ran — so a budget
 * can weigh a resample's solves before and while they run (pipeline/assessSweepCheck.ts). One cost
 * model in one place: every count below is the operation count of the routine named beside it
 * (dense-matrix counts from Golub & Van Loan, "Matrix Computations", 4th ed., §1.1 and §3–4; the
 * leading term only, common practice for such estimates).
 *
 *   statistics of a resample    e·d²     (episodeBellmanSums.ts: each run's row of sums, weighted)
 *   ridge system                d³/6     (Cholesky of G + λD; ridgeSystem.ts ridgeGramFactor)
 *   fixed point                 d³/3     (LU of G + λD − γM; ridgeSystem.ts fixedPointWeights)
 *   iteration matrix            d³       (d Cholesky solves of d² each; ridgeSystem.ts iterationMatrix)
 *   spectral-radius bound       s·d³     (s squarings of a d×d matrix; spectralRadiusBound.ts)
 *   FQE iteration step          5·d²     (M w, a Cholesky solve, the Bellman residual's three products; fqeIteration.ts)
 */

/**
 * A running count of the work done, in multiply-adds; the caller owns it and reads it between blocks.
 * limit: where set, no FQE iteration is let run past it (its steps are the one part of a solve without
 * a bound of its own but maxIterations), and exhausted says that one was stopped there, so its answer
 * is not the solve's and the caller must not use the block's.
 */
export interface SolveTally {
  units: number;
  readonly limit?: number;
  exhausted?: boolean;
}

export const solveWork = {
  statistics: (episodes: number, d: number): number => episodes * d * d,
  ridgeSystem: (d: number): number => d ** 3 / 6,
  fixedPoint: (d: number): number => d ** 3 / 3,
  iterationMatrix: (d: number): number => d ** 3,
  bound: (d: number, squarings: number): number => squarings * d ** 3,
  steps: (d: number, steps: number): number => 5 * steps * d * d,
};

/** Steps of an FQE iteration on d features the tally still allows (Infinity without a tally or a limit). */
export function stepsAllowed(tally: SolveTally | undefined, d: number): number {
  if (tally?.limit === undefined) return Infinity;
  return Math.max(0, Math.floor((tally.limit - tally.units) / solveWork.steps(d, 1)));
}

/** True when the tally has reached its limit, or an iteration was stopped at it. */
export function overBudget(tally: SolveTally): boolean {
  return tally.exhausted === true || (tally.limit !== undefined && tally.units >= tally.limit);
}

/** Adds units to the tally where there is one. */
export function countWork(tally: SolveTally | undefined, units: number): void {
  if (tally) tally.units += units;
}
