/**
 * The two linear systems of linear fitted Q-evaluation, from the one-pass statistics.
 *
 * Ridge convention: λ is per sample, on the averaged normal equations, i.e. each regression step
 * minimises (1/n) Σ_i (φ_iᵀw − y_i)² + λ Σ_{j ≠ constant} w_j², whose normal equations are
 * (G + λD) w = Φᵀy/n with D = I except D = 0 at the constant feature. The constant is not
 * penalised, as in ordinary ridge regression (Hastie, Tibshirani & Friedman, ESL 2nd ed.,
 * §3.4.1): shrinking it would pull every value towards 0 and bias J by an amount that depends
 * on the reward's units. Because features are built on standardised inputs, one λ suits all.
 *
 *   FQE step:      (G + λD) w_{k+1} = b + γ M w_k                (Cholesky of G + λD, once)
 *   Fixed point:   (G + λD − γM) w = b                           (LSTD-Q; Lagoudakis & Parr 2003, §5)
 */
import { cholesky, choleskySolve, luFactor, luSolve, SingularMatrixError } from '../linalg/dense';
import type { BellmanStatistics } from './bellmanStatistics';
import { FqeDataError } from './fqeErrors';

/** G + λD: d×d row-major. */
export function ridgeGram(stats: BellmanStatistics, ridge: number, constantIndex: number | null): Float64Array {
  const d = stats.dim, a = Float64Array.from(stats.gram);
  for (let j = 0; j < d; j++) if (j !== constantIndex) a[j * d + j] += ridge;
  return a;
}

/** Lower Cholesky factor of G + λD, with a message a person can act on when it does not exist. */
export function ridgeGramFactor(ridgeGramMatrix: Float64Array, d: number, ridge: number): Float64Array {
  try {
    return cholesky(ridgeGramMatrix, d);
  } catch (error) {
    if (!(error instanceof SingularMatrixError)) throw error;
    throw new FqeDataError(
      `the least-squares problem has no unique solution with ridge ${ridge}: on these transitions some features are ` +
        'linearly dependent (for example a state or action that never changes, or fewer distinct transitions than features). ' +
        'Use a ridge above 0 or fewer features.',
    );
  }
}

/** T = γ (G + λD)⁻¹ M, the matrix of the FQE iteration w_{k+1} = T w_k + const. d×d row-major. */
export function iterationMatrix(stats: BellmanStatistics, factor: Float64Array, discount: number): Float64Array {
  const d = stats.dim, t = new Float64Array(d * d), column = new Float64Array(d);
  for (let c = 0; c < d; c++) {
    for (let r = 0; r < d; r++) column[r] = stats.crossNext[r * d + c];
    const x = choleskySolve(factor, d, column);
    for (let r = 0; r < d; r++) t[r * d + c] = discount * x[r];
  }
  return t;
}

/** The LSTD-Q fixed point, or the reason it does not exist. */
export function fixedPointWeights(
  stats: BellmanStatistics, ridgeGramMatrix: Float64Array, discount: number,
): { weights: Float64Array } | { failure: string } {
  const d = stats.dim, system = Float64Array.from(ridgeGramMatrix);
  for (let k = 0; k < d * d; k++) system[k] -= discount * stats.crossNext[k];
  try {
    const weights = luSolve(luFactor(system, d), stats.featureReward);
    if (weights.every(Number.isFinite)) return { weights };
    return { failure: 'the fixed-point equations (G + λD − γM)w = b are too badly conditioned to solve in double precision' };
  } catch (error) {
    if (!(error instanceof SingularMatrixError)) throw error;
    return {
      failure: 'the fixed-point equations (G + λD − γM)w = b are singular: the projected Bellman equation has no unique ' +
        'solution with these features and data (a larger ridge or a smaller discount usually restores one)',
    };
  }
}
