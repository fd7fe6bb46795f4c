/**
 * Full polynomial features of total degree ≤ k in the standardised inputs z = (x − mean)/scale,
 * all cross terms and the constant included: φ(x) = (z^e : |e| ≤ k), d = C(n+k, k).
 */
import type { FeatureMap, PolynomialFeatureSpec } from './featureTypes';
import { FeatureSpecError } from './featureSpecError';
import { monomialBasis, monomialCount } from './monomials';
import { MAX_FEATURES } from '../limits';
import { polynomialNodeAverage } from './polynomialNodeAverage';
import { readStandardiser, type StandardiserSpec } from './standardiser';

export function polynomialFeatureSpec(standardiser: StandardiserSpec, degree: number): PolynomialFeatureSpec {
  return { kind: 'polynomial', degree, standardiser: { mean: [...standardiser.mean], scale: [...standardiser.scale] } };
}

export function createPolynomialFeatures(spec: PolynomialFeatureSpec): FeatureMap {
  const { mean, scale } = readStandardiser(spec.standardiser);
  const n = mean.length, k = spec.degree;
  if (!Number.isInteger(k) || k < 0) throw new FeatureSpecError(`polynomial degree: expected a whole number ≥ 0, got ${k}`);
  const count = monomialCount(n, k);
  if (count > MAX_FEATURES) {
    throw new FeatureSpecError(`polynomial degree ${k} in ${n} inputs gives ${count} features; at most ${MAX_FEATURES} are supported`);
  }
  const basis = monomialBasis(n, k);
  const { parent, variable, size: d } = basis;
  const frozen = polynomialFeatureSpec({ mean: [...mean], scale: [...scale] }, k);
  return {
    dim: d,
    inputDim: n,
    constantIndex: 0,
    evaluate(input, inputOffset, out, outOffset) {
      out[outOffset] = 1;
      if (k === 0) return;
      // Degree-1 monomials are exactly z in variable order (indices 1..n), so z lives in `out`.
      for (let v = 0; v < n; v++) out[outOffset + 1 + v] = (input[inputOffset + v] - mean[v]) / scale[v];
      for (let j = n + 1; j < d; j++) out[outOffset + j] = out[outOffset + parent[j]] * out[outOffset + 1 + variable[j]];
    },
    nodeAverage: (ds) => polynomialNodeAverage(mean, scale, k, ds),
    polynomial: frozen,
    toSpec: () => structuredClone(frozen),
  };
}

/**
 * True when `inner` is a polynomial map of no higher degree than `outer` on the same standardised
 * inputs: its monomials are then outer's first (monomialBasis lists them by degree, each built from
 * the same parent), so its features are the leading part of outer's, to the last bit.
 */
export function leadsPolynomial(inner: FeatureMap, outer: FeatureMap): boolean {
  const a = inner.toSpec(), b = outer.toSpec();
  if (a.kind !== 'polynomial' || b.kind !== 'polynomial' || a.degree > b.degree) return false;
  const same = (x: number[], y: number[]) => x.length === y.length && x.every((v, i) => Object.is(v, y[i]));
  return same(a.standardiser.mean, b.standardiser.mean) && same(a.standardiser.scale, b.standardiser.scale);
}
