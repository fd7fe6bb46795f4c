/** The feature map a project's linear approximator asks for, standardised on the project's data. */
import { createFeatureMap, type FeatureMap } from '../../core/features/featureMap';
import { polynomialFeatureSpec } from '../../core/features/polynomialFeatures';
import { radialBasisGridSpec } from '../../core/features/radialBasisFeatures';
import { fitStateActionStandardiser, type StandardiserSpec } from '../../core/features/standardiser';
import { FeatureSpecError } from '../../core/features/featureSpecError';
import { failure, success, type Result } from '../../core/result';
import type { TransitionSet } from '../../core/transitions';
import { checkEnoughTransitions } from '../../data/datasetChecks';
import type { ApproximatorSettings } from '../../project/approximatorSchema';

/** Half-width of the radial-basis grid in standard deviations (radialBasisFeatures.ts default). */
const RBF_HALF_RANGE = 2;

/**
 * The standardiser of each transition set, fitted once: a run asks for feature maps of several
 * degrees on the same data (the plan's, the function classes', the sensitivity sweep's), and each fit
 * is two passes over every state and action. Keyed by the set itself, whose arrays are not written
 * after import (transitions.ts); the same numbers as a fresh fit, to the last bit.
 */
const standardisers = new WeakMap<TransitionSet, StandardiserSpec>();

function standardiserOf(data: TransitionSet): StandardiserSpec {
  let spec = standardisers.get(data);
  if (!spec) standardisers.set(data, (spec = fitStateActionStandardiser(data).spec));
  return spec;
}

export function featureMapFor(settings: Extract<ApproximatorSettings, { kind: 'linear' }>, data: TransitionSet): FeatureMap {
  const standardiser = standardiserOf(data);
  const f = settings.features;
  if (f.kind === 'polynomial') return createFeatureMap(polynomialFeatureSpec(standardiser, f.degree));
  const spacing = (2 * RBF_HALF_RANGE) / (f.centresPerInput - 1);
  return createFeatureMap(radialBasisGridSpec(standardiser, {
    pointsPerDimension: f.centresPerInput, halfRange: RBF_HALF_RANGE, width: f.widthScale * spacing, linearTerms: true,
  }));
}

/** The feature map with the checks a plan needs: a map that can be built, and enough transitions to fit it. */
export function planFeatures(settings: Extract<ApproximatorSettings, { kind: 'linear' }>, data: TransitionSet): Result<FeatureMap> {
  let features: FeatureMap;
  try {
    features = featureMapFor(settings, data);
  } catch (error) {
    if (!(error instanceof FeatureSpecError)) throw error;
    return failure({ where: 'approximator.features', field: ['approximator', 'features'], message: error.message });
  }
  const enough = checkEnoughTransitions(data.count, features.dim);
  if (!enough.ok) return failure(...enough.problems.map((p) => ({ ...p, field: ['approximator', 'features'] })));
  return success(features, enough.warnings);
}
