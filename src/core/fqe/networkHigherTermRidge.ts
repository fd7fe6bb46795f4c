/**
 * A ridge on the polynomial part's terms above degree 2 only (networkLinearPart.ts with
 * linearPartDegree > 2), so that a quartic part is shrunk toward the quadratic one rather than
 * fitted freely: the penalty λ_p·G_jj·v_j² on each cubic and quartic term j (G_jj its own second
 * moment over the training rows, as for the hidden features in networkLastLayer.ts, so it does not
 * depend on the features' scale) leaves the constant, linear and quadratic terms under the linear
 * approximator's tiny ridge only. As λ_p → ∞ those terms' weights tend to 0 and the fixed point
 * tends to the degree-2 part's (with the same hidden features); at λ_p = 0 it is the free quartic.
 * Ridge-regularised LSTD: Farahmand, Ghavamzadeh, Szepesvári & Mannor, NeurIPS 2008; a penalty on
 * higher-order terms only is the usual way of shrinking a polynomial toward a lower degree
 * (generalised ridge, Hoerl & Kennard, Technometrics 1970).
 *
 * The polynomial features are listed by degree (monomials.ts), so the terms above degree 2 are the
 * rows [from, d1) with from = C(p + 2, 2), p = ds + m inputs.
 */
import { monomialCount } from '../features/monomials';
import { LINEAR_PART_DEGREE } from './networkLinearPart';

export interface HigherTermRidge {
  /** First row of the polynomial part that is penalised (rows from … d1 − 1). */
  readonly from: number;
  /** λ_p, relative to each term's second moment. */
  readonly ridge: number;
}

/** No penalty: every fit at the defaults, and every fit of degree ≤ 2. */
export const NO_HIGHER_TERM_RIDGE: HigherTermRidge = Object.freeze({ from: Number.POSITIVE_INFINITY, ridge: 0 });

/** inputs: p = ds + m; degree: the polynomial part's; ridge: λ_p (networkMethod.ts). */
export function higherTermRidge(inputs: number, degree: number, ridge: number): HigherTermRidge {
  if (!(ridge > 0) || degree <= LINEAR_PART_DEGREE) return NO_HIGHER_TERM_RIDGE;
  return { from: monomialCount(inputs, LINEAR_PART_DEGREE), ridge };
}
