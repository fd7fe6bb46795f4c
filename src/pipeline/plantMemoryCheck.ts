/**
 * The plant-memory check on a project's log (src/core/diagnostics/plantMemory.ts): once per project,
 * not per candidate, with the monomials of the product's own one-step plant model (the degree the
 * rollout cross-check uses, assessRollouts.ts) as the base regression, PLANT_MEMORY_LAGS earlier
 * rows and at most PLANT_MEMORY_ROWS rows (src/core/limits.ts).
 */
import { plantMemory, type MemoryData, type PlantMemoryResult } from '../core/diagnostics/plantMemory';
import { createFeatureMap } from '../core/features/featureMap';
import { polynomialFeatureSpec } from '../core/features/polynomialFeatures';
import { fitStateActionStandardiser } from '../core/features/standardiser';
import { PLANT_MEMORY_LAGS, PLANT_MEMORY_ROWS } from '../core/limits';
import { rolloutModelOptions } from './assessRollouts';

export function loggedPlantMemory(data: MemoryData): PlantMemoryResult {
  if (data.count < 1) return { reason: 'the log has no transitions' };
  const standardiser = fitStateActionStandardiser(data).spec;
  const features = createFeatureMap(polynomialFeatureSpec(standardiser, rolloutModelOptions(data).degree));
  return plantMemory(data, { features, standardiser, lags: PLANT_MEMORY_LAGS, maxRows: PLANT_MEMORY_ROWS });
}
