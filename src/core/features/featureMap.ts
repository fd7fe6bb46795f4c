/**
 * Feature maps φ: R^p → R^d over the inputs z = [s, a] of an action-value function, and their
 * plain-JSON specification (kind, degree or centres and width, and the standardiser's numbers)
 * so a fitted Q can be saved in a project file and rebuilt exactly.
 */
import { FeatureSpecError } from './featureSpecError';
import { monomialBasis } from './monomials';
import { createPolynomialFeatures } from './polynomialFeatures';
import { createRadialBasisFeatures } from './radialBasisFeatures';
import type { FeatureMap } from './featureTypes';
import type { FeatureMapSpec } from './featureTypes';

export type { FeatureMap, FeatureMapSpec, PolynomialFeatureSpec, RadialBasisFeatureSpec } from './featureTypes';

/** Build a feature map from its specification; messages name the field at fault. */
export function createFeatureMap(spec: FeatureMapSpec): FeatureMap {
  if (!spec || typeof spec !== 'object') throw new FeatureSpecError('features: expected an object with a "kind"');
  switch (spec.kind) {
    case 'polynomial':
      return createPolynomialFeatures(spec);
    case 'radialBasis':
      return createRadialBasisFeatures(spec);
    default:
      throw new FeatureSpecError(`features.kind: expected "polynomial" or "radialBasis", got ${JSON.stringify((spec as { kind?: unknown }).kind)}`);
  }
}

/** Human-readable names of the features in order, e.g. "1", "level", "level^2·flow", "rbf 3". */
export function featureLabels(spec: FeatureMapSpec, inputNames: readonly string[]): string[] {
  const n = spec.standardiser.mean.length;
  if (inputNames.length !== n) throw new FeatureSpecError(`feature labels: expected ${n} input names, got ${inputNames.length}`);
  if (spec.kind === 'radialBasis') {
    return ['1', ...(spec.linearTerms ? inputNames : []), ...spec.centres.map((_, j) => `rbf ${j + 1}`)];
  }
  const { size, exponents } = monomialBasis(n, spec.degree);
  const labels: string[] = [];
  for (let j = 0; j < size; j++) {
    const factors: string[] = [];
    for (let v = 0; v < n; v++) {
      const e = exponents[j * n + v];
      if (e > 0) factors.push(e === 1 ? inputNames[v] : `${inputNames[v]}^${e}`);
    }
    labels.push(factors.length === 0 ? '1' : factors.join('·'));
  }
  return labels;
}
