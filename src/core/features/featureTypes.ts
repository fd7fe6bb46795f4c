/**
 * The types of feature maps φ: R^p → R^d over the inputs z = [s, a] of an action-value function and
 * of their plain-JSON specifications, in a file of their own so that the map kinds
 * (polynomialFeatures.ts, radialBasisFeatures.ts) and the dispatcher (featureMap.ts) import them
 * without importing each other.
 */
import type { NodeAverage } from './polynomialNodeAverage';
import type { StandardiserSpec } from './standardiser';

export interface PolynomialFeatureSpec {
  kind: 'polynomial';
  /** Total degree k ≥ 0. */
  degree: number;
  standardiser: StandardiserSpec;
}

export interface RadialBasisFeatureSpec {
  kind: 'radialBasis';
  /** Centres in standardised coordinates, one array of p numbers each. */
  centres: number[][];
  /** Gaussian width in standard deviations of the inputs. */
  width: number;
  /** Also include the standardised inputs themselves as features. */
  linearTerms: boolean;
  standardiser: StandardiserSpec;
}

export type FeatureMapSpec = PolynomialFeatureSpec | RadialBasisFeatureSpec;

export interface FeatureMap {
  readonly dim: number; // d
  /** p: the input row length, stateDim + actionDim. */
  readonly inputDim: number;
  /** Index of the feature that is identically 1, or null when there is none (it is left unpenalised by ridge fits). */
  readonly constantIndex: number | null;
  /**
   * Write φ(input[inputOffset .. inputOffset+p)) into out[outOffset .. outOffset+d).
   * Allocates nothing, so it can run once per quadrature node per transition.
   */
  evaluate(input: ArrayLike<number>, inputOffset: number, out: Float64Array, outOffset: number): void;
  /**
   * Optional faster route to the quadrature average Σ_j ω_j φ(s, a_j) when the first ds inputs are
   * the state (e.g. polynomialNodeAverage.ts); the same values up to rounding. Absent: node by node.
   */
  nodeAverage?(ds: number): NodeAverage;
  /** Present when φ is the full polynomial basis of this spec (read-only), so E_{a~π} φ can be taken by closed-form moments (policyFeatureAverage.ts). */
  readonly polynomial?: Readonly<PolynomialFeatureSpec>;
  toSpec(): FeatureMapSpec;
}
