/**
 * The quadrature average ξ(s) = Σ_j ω_j φ(s, a_j) of Gaussian bumps on a full tensor grid, by
 * splitting each bump into its state and action factors (radialBasisFeatures.ts: the bump is the
 * product of one-dimensional factors, the last input fastest):
 *   φ_(k,m)(s, a) = S_k(s)·A_m(a)   ⇒   ξ_(k,m)(s) = S_k(s) · Σ_j ω_j A_m(a_j),
 * so per state the state factors are expanded once and per node only the action factors (for one
 * action and p centres per input, p exponentials and p products instead of p^n). Exact algebra,
 * the same values up to rounding; the constant and linear terms average the same way. Ours; the
 * factorisation is the distributive law.
 *
 * Shapes: inputs z = [s (ds), a (m)] standardised; features [1, (z), bumps (Π p_v, odometer order)].
 */
import type { NodeAverage } from './polynomialNodeAverage';

/** Products of one-dimensional factors expanded in odometer order (the last factor fastest) into out[0 …]; returns their count. */
export function expandProducts(factors: readonly Float64Array[], out: Float64Array): number {
  out[0] = 1;
  let size = 1;
  for (const f of factors) {
    for (let k = size - 1; k >= 0; k--) {
      const prefix = out[k];
      for (let i = f.length - 1; i >= 0; i--) out[k * f.length + i] = prefix * f[i];
    }
    size *= f.length;
  }
  return size;
}

export interface GridAverageSpec {
  readonly mean: Float64Array;
  readonly scale: Float64Array;
  readonly axes: readonly Float64Array[]; // one per input
  readonly inverseTwoWidthSq: number; // 1/(2w²)
  readonly linear: boolean;
}

export function gridNodeAverage(spec: GridAverageSpec, ds: number): NodeAverage {
  const { mean, scale, axes, inverseTwoWidthSq, linear } = spec, n = mean.length, m = n - ds;
  const factors = axes.map((a) => new Float64Array(a.length)), stateFactors = factors.slice(0, ds), actionFactors = factors.slice(ds);
  const stateCount = axes.slice(0, ds).reduce((k, a) => k * a.length, 1), actionCount = axes.slice(ds).reduce((k, a) => k * a.length, 1);
  const stateBumps = new Float64Array(stateCount), nodeBumps = new Float64Array(actionCount), actionMean = new Float64Array(actionCount);
  const zMean = new Float64Array(m), first = linear ? 1 + n : 1;
  const fill = (v: number, z: number) => {
    for (let i = 0; i < axes[v].length; i++) factors[v][i] = Math.exp(-((z - axes[v][i]) ** 2) * inverseTwoWidthSq);
  };
  return (state, stateOffset, points, weights, k, out, outOffset) => {
    for (let v = 0; v < ds; v++) fill(v, (state[stateOffset + v] - mean[v]) / scale[v]);
    expandProducts(stateFactors, stateBumps);
    actionMean.fill(0);
    zMean.fill(0);
    let weightSum = 0;
    for (let j = 0; j < k; j++) {
      const w = weights[j];
      for (let c = 0; c < m; c++) {
        const z = (points[j * m + c] - mean[ds + c]) / scale[ds + c];
        fill(ds + c, z);
        zMean[c] += w * z;
      }
      expandProducts(actionFactors, nodeBumps);
      for (let a = 0; a < actionCount; a++) actionMean[a] += w * nodeBumps[a];
      weightSum += w;
    }
    out[outOffset] = weightSum;
    if (linear) {
      for (let v = 0; v < ds; v++) out[outOffset + 1 + v] = weightSum * ((state[stateOffset + v] - mean[v]) / scale[v]);
      for (let c = 0; c < m; c++) out[outOffset + 1 + ds + c] = zMean[c];
    }
    for (let s = 0; s < stateCount; s++) {
      const f = stateBumps[s], o = outOffset + first + s * actionCount;
      for (let a = 0; a < actionCount; a++) out[o + a] = f * actionMean[a];
    }
  };
}
