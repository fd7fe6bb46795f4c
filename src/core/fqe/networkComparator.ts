/**
 * The linear estimate the network's J is set beside: what the user would get from the linear
 * approximator at its default, full polynomial features of degree DEFAULT_POLYNOMIAL_DEGREE
 * (src/core/limits.ts) by the LSTD-Q fixed point (Lagoudakis & Parr, JMLR 2003, §5) with the
 * linear path's ridge, on the network's training episodes (all episodes at the default hold-out
 * of 0) and the network's input standardiser. The agreement rule (approximatorAgreement.ts) and
 * the class-error allowance (classErrorAllowance.ts) read the paired difference network − this.
 *
 * Why not the network's own polynomial part (networkLinearPart.ts, degree `linearPartDegree`): that
 * part is a choice inside the network, made for how the network fits, while the comparison is
 * there to tell the user whether two approximator classes they could run tell the same story. Tied
 * to the polynomial part, a richer part (degree 4) moves the comparator with it: the network and
 * its own quartic then agree by construction and the rule falls silent exactly where the
 * quadratic is biased (test/battery/README.md, "J over upsets"). The allowance's reasoning
 * (classErrorAllowance.ts) needs the network's class to contain the comparator's: the polynomial
 * part of degree ≥ the comparator's does, since its monomials include the comparator's.
 *
 * How: when the polynomial part has at least the comparator's degree on the same standardiser,
 * the comparator's features are its leading columns (polynomialFeatures.ts, leadsPolynomial), so
 * its LSTD-Q sums are the leading block of the part's sums, per episode and in total, to the last
 * bit (no pass over the data). Otherwise its features are formed on the training rows anew.
 *
 * Shapes: d2 comparator features; sums in the packed layout of networkLastLayerSums.ts with d = d2.
 */
import type { ActionQuadrature } from '../actionQuadrature';
import { createFeatureMap, type FeatureMap } from '../features/featureMap';
import { polynomialFeatureSpec, leadsPolynomial } from '../features/polynomialFeatures';
import type { TransitionSet } from '../transitions';
import { lastLayerStride, linearPartSums, type LastLayerSums } from './networkLastLayerSums';
import { createLinearPart, type LinearPart } from './networkLinearPart';
import { COMPARATOR_DEGREE } from './comparatorDegree';


export interface Comparator {
  readonly features: FeatureMap; // d2
  /** LSTD-Q sums over all training rows (one range) and per training episode (the part's ranges). */
  readonly total: LastLayerSums;
  readonly episodes: LastLayerSums;
}

export interface ComparatorInput {
  readonly data: TransitionSet;
  /** Training rows' indices into data, in row order (the part's rows). */
  readonly transitions: Int32Array;
  readonly standardiser: { mean: ArrayLike<number>; scale: ArrayLike<number> };
  readonly quadrature: ActionQuadrature;
  readonly discount: number;
  /** The network's polynomial part on the training rows, its sums in total and per episode. */
  readonly part: LinearPart;
  readonly partTotal: LastLayerSums;
  readonly partEpisodes: LastLayerSums;
  readonly rewards: Float64Array; // n
  readonly episodeRanges: Int32Array;
}

export function createComparator(input: ComparatorInput, degree = COMPARATOR_DEGREE): Comparator {
  const { standardiser } = input;
  const features = createFeatureMap(polynomialFeatureSpec({ mean: Array.from(standardiser.mean), scale: Array.from(standardiser.scale) }, degree));
  if (leadsPolynomial(features, input.part.features)) {
    return { features, total: leadingBlock(input.partTotal, features.dim), episodes: leadingBlock(input.partEpisodes, features.dim) };
  }
  const own = createLinearPart(input.data, input.transitions, standardiser, input.quadrature, input.discount, degree);
  const all = Int32Array.of(0, input.transitions.length);
  return { features, total: linearPartSums(own, input.rewards, all), episodes: linearPartSums(own, input.rewards, input.episodeRanges) };
}

/** The sums of the first d2 features of a polynomial part's sums (same ranges). */
export function leadingBlock(sums: LastLayerSums, d2: number): LastLayerSums {
  const d1 = sums.dim, w1 = 2 * d1 + 1, w2 = 2 * d2 + 1, stride = lastLayerStride(d2);
  const out = new Float64Array(sums.ranges * stride);
  for (let r = 0; r < sums.ranges; r++) {
    const from = r * sums.stride, to = r * stride;
    for (let a = 0; a < d2; a++) {
      for (let b = 0; b < d2; b++) {
        out[to + a * w2 + b] = sums.sums[from + a * w1 + b]; // G
        out[to + a * w2 + d2 + b] = sums.sums[from + a * w1 + d1 + b]; // M
      }
      out[to + a * w2 + 2 * d2] = sums.sums[from + a * w1 + 2 * d1]; // b
    }
    out[to + stride - 1] = sums.sums[from + sums.stride - 1]; // n
  }
  return { dim: d2, linearDim: d2, ranges: sums.ranges, stride, sums: out };
}
