/**
 * The sums of the degree choice's on-policy LSTD fits (networkDegreeChoice.ts), per fold of runs, in
 * one pass over the data:
 *   A_f = Σ_{i in f} φ_i (φ_i − γ φ'_i)ᵀ,  b_f = Σ_{i in f} φ_i r_i,  n_f,
 * φ_i the polynomial features of the logged (s_i, a_i), φ'_i those of the next row's logged
 * (s_{i+1}, a_{i+1}) (0 after a terminal row). Rows whose next action was not logged are left out.
 *
 * Cost: the d×d products dominate (n·d² multiply-adds). They are formed a block of rows at a time by
 * blockProducts.ts (a WebAssembly SIMD kernel where the host has one, three to four times the scalar
 * loop's speed; bench/blockProductsBench.ts), as the Bellman statistics' pass does; each block is
 * summed from 0 and then added (blocked summation, rounding error ~(n/B + B)·u instead of n·u;
 * Higham, "Accuracy and Stability of Numerical Algorithms", 2nd ed., §4.2). A block holds rows of one
 * fold only. The choice is skipped altogether above DEGREE_CHOICE_MAX_FEATURES (limits.ts).
 *
 * Shapes: A_f d×d row-major; b_f length d.
 */
import type { FeatureMap } from '../features/featureMap';
import { loggedStateAction, type TransitionSet } from '../transitions';
import { blockRowsFor } from './bellmanStatistics';
import { createBlockProducts } from './blockProducts';

export interface FoldSums {
  readonly a: Float64Array[]; // per fold, d×d
  readonly b: Float64Array[]; // per fold, d
  readonly counts: Float64Array; // per fold
}

/**
 * continues[i] = 1 when row i + 1 is the same run's next step; fold[run] the fold of each run.
 * features: the top degree's map of the standardised (s, a).
 */
export function foldLstdSums(
  data: TransitionSet, features: FeatureMap, gamma: number, continues: Uint8Array, fold: Int32Array, folds: number,
): FoldSums {
  const d = features.dim, n = data.count, p = data.stateDim + data.actionDim;
  const a = Array.from({ length: folds }, () => new Float64Array(d * d));
  const b = Array.from({ length: folds }, () => new Float64Array(d)), counts = new Float64Array(folds);
  const rows = blockRowsFor(d), products = createBlockProducts(d, rows), phi = products.phi, diff = products.psi;
  const input = new Float64Array(p), next = new Float64Array(d);
  let size = 0, blockFold = -1;
  const flush = () => {
    if (size > 0) products.add(phi, diff, size, a[blockFold], 0, false);
    size = 0;
  };
  for (let i = 0; i < n; i++) {
    const terminal = data.terminal[i] !== 0;
    if (!terminal && !continues[i]) continue; // the next action was not logged: no on-policy target
    const f = fold[data.episode[i]];
    if (f !== blockFold || size === rows) { flush(); blockFold = f; }
    const at = size * d;
    loggedStateAction(data, i, input);
    features.evaluate(input, 0, phi, at);
    if (terminal) next.fill(0);
    else {
      loggedStateAction(data, i + 1, input);
      features.evaluate(input, 0, next, 0);
    }
    const bf = b[f], r = data.rewards[i];
    for (let k = 0; k < d; k++) {
      diff[at + k] = phi[at + k] - gamma * next[k];
      bf[k] += phi[at + k] * r;
    }
    counts[f]++;
    size++;
  }
  flush();
  return { a, b, counts };
}

