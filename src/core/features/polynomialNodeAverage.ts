/**
 * The quadrature average ξ(s) = Σ_j ω_j φ(s, a_j) of full polynomial features over action nodes a_j,
 * formed by factoring each monomial into a state part and an action part:
 *   φ_e(s, a) = z_s^{e_s} · z_a^{e_a}   ⇒   ξ_e(s) = z_s^{e_s} · Σ_j ω_j z_{a_j}^{e_a},
 * so the state monomials are formed once per state and only the action-only monomials once per node
 * (for one action and degree k, k + 1 of them instead of all C(p+k, k)). Exact algebra; the values
 * agree with the node-by-node sum up to rounding in the last places (the products are grouped
 * differently). Ours; the factorisation is the distributive law.
 *
 * Shapes: inputs z = [s (ds), a (m)]; d = C(ds+m+k, k) monomials in the graded order of monomials.ts.
 */
import { monomialBasis, type MonomialBasis } from './monomials';

export interface NodeAverage {
  /**
   * Write ξ(s) to out[outOffset .. outOffset+d) for the state at state[stateOffset …] (ds values, raw
   * units) and k nodes (points k×m raw units, weights k).
   */
  (state: ArrayLike<number>, stateOffset: number, points: Float64Array, weights: Float64Array, k: number, out: Float64Array, outOffset: number): void;
}

interface Split {
  readonly stateIndex: Int32Array; // d: the monomial with the state exponents of monomial e
  readonly actionIndex: Int32Array; // d: position in `actionOnly` of the monomial with its action exponents
  readonly actionOnly: Int32Array; // the monomials with no state exponent, in basis order (constant first)
}

/** Index the basis by exponent vector and split each monomial into its state and action parts. */
function splitBasis(basis: MonomialBasis, ds: number): Split {
  const n = basis.variableCount, d = basis.size, key = (e: ArrayLike<number>) => Array.prototype.join.call(e, ',');
  const indexOf = new Map<string, number>();
  for (let e = 0; e < d; e++) indexOf.set(key(basis.exponents.subarray(e * n, (e + 1) * n)), e);
  const actionOnly: number[] = [], positionInActions = new Int32Array(d).fill(-1);
  for (let e = 0; e < d; e++) {
    let stateDegree = 0;
    for (let v = 0; v < ds; v++) stateDegree += basis.exponents[e * n + v];
    if (stateDegree === 0) { positionInActions[e] = actionOnly.length; actionOnly.push(e); }
  }
  const stateIndex = new Int32Array(d), actionIndex = new Int32Array(d), part = new Int32Array(n);
  for (let e = 0; e < d; e++) {
    const row = basis.exponents.subarray(e * n, (e + 1) * n);
    part.set(row); part.fill(0, ds);
    stateIndex[e] = indexOf.get(key(part))!;
    part.fill(0); part.set(row.subarray(ds), ds);
    actionIndex[e] = positionInActions[indexOf.get(key(part))!];
  }
  return { stateIndex, actionIndex, actionOnly: Int32Array.from(actionOnly) };
}

/** ξ(s) for polynomial features of `degree` in standardised inputs (mean, scale per input), ds of them state. */
export function polynomialNodeAverage(mean: Float64Array, scale: Float64Array, degree: number, ds: number): NodeAverage {
  const n = mean.length, m = n - ds, basis = monomialBasis(n, degree), d = basis.size;
  const { stateIndex, actionIndex, actionOnly } = splitBasis(basis, ds), q = actionOnly.length;
  const { parent, variable } = basis;
  const stateValue = new Float64Array(Math.max(d, n + 1)), nodeValue = new Float64Array(q), moment = new Float64Array(q);
  // Action-only monomial t = its parent (also action-only) × one action variable.
  const actionParent = new Int32Array(q), actionVariable = new Int32Array(q);
  for (let t = 1; t < q; t++) {
    const e = actionOnly[t];
    actionParent[t] = actionIndex[parent[e]];
    actionVariable[t] = variable[e] - ds;
  }
  const za = new Float64Array(m);
  return (state, stateOffset, points, weights, k, out, outOffset) => {
    // State monomials: the graded recurrence with the action inputs at zero (monomials with an action factor unused).
    stateValue[0] = 1;
    for (let v = 0; v < n; v++) stateValue[1 + v] = v < ds ? (state[stateOffset + v] - mean[v]) / scale[v] : 0;
    for (let e = n + 1; e < d; e++) stateValue[e] = stateValue[parent[e]] * stateValue[1 + variable[e]];
    moment.fill(0);
    for (let j = 0; j < k; j++) {
      for (let c = 0; c < m; c++) za[c] = (points[j * m + c] - mean[ds + c]) / scale[ds + c];
      nodeValue[0] = 1;
      for (let t = 1; t < q; t++) nodeValue[t] = nodeValue[actionParent[t]] * za[actionVariable[t]];
      const w = weights[j];
      for (let t = 0; t < q; t++) moment[t] += w * nodeValue[t];
    }
    for (let e = 0; e < d; e++) out[outOffset + e] = stateValue[stateIndex[e]] * moment[actionIndex[e]];
  };
}
