/**
 * The network's last layer by the LSTD-Q fixed point on the current features (least-squares
 * update of a deep network's last layer: Levine, Zahavy, Mankowitz, Tamar & Mannor, "Shallow
 * updates for deep reinforcement learning", NeurIPS 2017; the fixed point itself: Lagoudakis &
 * Parr, JMLR 2003, §5). With the joint features F = [φ, h] and the averaged sums of
 * networkLastLayerSums.ts,
 *   (G − M + Λ) v = b,   G = ΣFFᵀ/n,  M = ΣFPᵀ/n (P discounted),  b = ΣFr/n,
 * solves the projected Bellman equation over the whole horizon at once: the value no longer has
 * to creep outwards at rate γ per outer iteration, and gradient steps only have to improve the
 * features.
 *
 * Ridge Λ (a choice, measured on the battery): the quadratic part gets the linear approximator's
 * default λ = 10⁻⁶ (not on its constant), as a linear fit would; each hidden feature j gets
 * λ_h·(G_jj + 10⁻³·mean_k G_kk), relative to its own second moment so the penalty does not
 * depend on the features' scale, with a small floor so that a feature that is 0 on every row
 * (a dead rectifier) gets weight 0 instead of making the system singular. Shapes: d = d1 + dh.
 */
import { luFactor, luSolve, SingularMatrixError } from '../linalg/dense';
import { RIDGE } from '../limits';
import { NO_HIGHER_TERM_RIDGE, type HigherTermRidge } from './networkHigherTermRidge';

/** The linear approximator's default ridge (src/core/limits.ts), read from there so the two cannot drift apart. */
export const LINEAR_PART_RIDGE = RIDGE.default;

export type LastLayerSolve = { readonly weights: Float64Array } | { readonly failure: string };

/**
 * packed: one range's (or a combination's) sums in the layout of networkLastLayerSums.ts; higher:
 * the ridge on the polynomial part's terms above degree 2 (networkHigherTermRidge.ts), none by default.
 */
export function solveLastLayer(packed: Float64Array, d: number, d1: number, hiddenRidge: number, higher: HigherTermRidge = NO_HIGHER_TERM_RIDGE): LastLayerSolve {
  const n = packed[packed.length - 1], width = 2 * d + 1;
  if (!(n > 0)) return { failure: 'no transitions to solve the last layer on' };
  const a = new Float64Array(d * d), b = new Float64Array(d);
  let hiddenTrace = 0;
  for (let j = d1; j < d; j++) hiddenTrace += packed[j * width + j] / n;
  const floor = d > d1 ? 1e-3 * (hiddenTrace / (d - d1)) + 1e-12 : 0;
  for (let r = 0; r < d; r++) {
    for (let c = 0; c < d; c++) a[r * d + c] = (packed[r * width + c] - packed[r * width + d + c]) / n;
    b[r] = packed[r * width + 2 * d] / n;
    if (r > 0 && r < d1) a[r * d + r] += LINEAR_PART_RIDGE;
    if (r >= higher.from && r < d1) a[r * d + r] += higher.ridge * (packed[r * width + r] / n);
    if (r >= d1) a[r * d + r] += hiddenRidge * (packed[r * width + r] / n + floor);
  }
  try {
    const weights = luSolve(luFactor(a, d), b);
    return weights.every(Number.isFinite) ? { weights } : { failure: 'the last-layer system is too badly conditioned to solve in double precision' };
  } catch (error) {
    if (!(error instanceof SingularMatrixError)) throw error;
    return { failure: 'the last-layer system (G − M + Λ)v = b is singular on these features' };
  }
}
