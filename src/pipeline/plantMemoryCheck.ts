/**
 * The plant-memory check on a project's log (src/core/diagnostics/plantMemory.ts), once per project,
 * not per candidate: monomials of the present state and action up to two degrees above the product's
 * own one-step plant model (memoryBaseDegree below) as the base regression, PLANT_MEMORY_LAGS earlier rows and at
 * most PLANT_MEMORY_ROWS rows (src/core/limits.ts). Its finding and words come from
 * src/core/diagnostics/plantMemoryFinding.ts; its numbers go to the assessment as `plantMemory`.
 */
import { plantMemory, type MemoryData, type PlantMemoryResult } from '../core/diagnostics/plantMemory';
import { adjustedPartialRSquared, memoryComponent, plantMemoryFinding, type MemoryNames } from '../core/diagnostics/plantMemoryFinding';
import { createFeatureMap } from '../core/features/featureMap';
import { polynomialFeatureSpec } from '../core/features/polynomialFeatures';
import { fitStateActionStandardiser } from '../core/features/standardiser';
import { PLANT_MEMORY_BASE_MONOMIALS, PLANT_MEMORY_LAGS, PLANT_MEMORY_ROWS } from '../core/limits';
import { monomialCount } from '../core/features/monomials';
import type { AssessmentWarning } from './assessment';
import { rolloutModelOptions } from './assessRollouts';

/** One next-state value's result, with names (plain JSON). */
export interface StateMemory {
  readonly state: string;
  /** Share of the one-step model's residual sum of squares the earlier rows explain, and the same adjusted for chance. */
  readonly partialRSquared: number;
  readonly adjustedPartialRSquared: number;
  readonly fStatistic: number;
  readonly degreesOfFreedom: [number, number];
  /** The earlier signal that alone explains most, its rows back and its partial R²; null if none can be read. */
  readonly strongest: { signal: string; kind: 'state' | 'action'; rowsBack: number; partialRSquared: number } | null;
}

export type PlantMemorySummary =
  | { readonly rowsUsed: number; readonly usableRows: number; readonly rowsBack: number; readonly read: string | null; readonly states: StateMemory[] }
  | { readonly reason: string };

export function loggedPlantMemory(data: MemoryData): PlantMemoryResult {
  if (data.count < 1) return { reason: 'the log has no transitions' };
  const standardiser = fitStateActionStandardiser(data).spec;
  const features = createFeatureMap(polynomialFeatureSpec(standardiser, memoryBaseDegree(data)));
  return plantMemory(data, { features, standardiser, lags: PLANT_MEMORY_LAGS, maxRows: PLANT_MEMORY_ROWS });
}

/**
 * The base regression's degree: the one-step plant model's (assessRollouts.ts) raised by up to two while
 * its monomials stay within PLANT_MEMORY_BASE_MONOMIALS. Earlier rows predict the present one, so they
 * also "explain" whatever the base misfits about it: a first-order plant x' = 0.7x + 0.5·sin 3x + 0.3u,
 * with no memory at all, read 62–63 % (serious) on a cubic base and 0.6 % on a quintic one. Memory
 * that a richer function of the present row explains away is misfit, not memory; a dead time is not
 * explained away (the valve's effect 4 rows back is not a function of the present row).
 */
export function memoryBaseDegree(data: { readonly stateDim: number; readonly actionDim: number }): number {
  const inputs = data.stateDim + data.actionDim, model = rolloutModelOptions(data).degree;
  for (const degree of [model + 2, model + 1]) if (monomialCount(inputs, degree) <= PLANT_MEMORY_BASE_MONOMIALS) return degree;
  return model;
}

/** The check's numbers (read: the state the rule read, if any passed its F guard) and its warnings (none or one). */
export function plantMemoryAssessment(data: MemoryData & MemoryNames): { summary: PlantMemorySummary; warnings: AssessmentWarning[] } {
  const result = loggedPlantMemory(data), finding = plantMemoryFinding(result, data);
  const warnings = finding ? [finding] : [];
  if ('reason' in result) return { summary: { reason: result.reason }, warnings };
  const read = memoryComponent(result), name = (i: number) => data.stateNames[i] ?? `state ${i + 1}`;
  return {
    summary: {
      rowsUsed: result.rows, usableRows: result.usableRows, rowsBack: result.lags, read: read ? name(read.component) : null,
      states: result.components.map((c) => ({
        state: name(c.component), partialRSquared: c.partialRSquared, adjustedPartialRSquared: adjustedPartialRSquared(c),
        fStatistic: c.fStatistic, degreesOfFreedom: [c.numeratorDf, c.denominatorDf],
        strongest: c.strongest && {
          signal: (c.strongest.kind === 'state' ? data.stateNames : data.actionNames)[c.strongest.index] ?? `${c.strongest.kind} ${c.strongest.index + 1}`,
          kind: c.strongest.kind, rowsBack: c.strongest.lag, partialRSquared: c.strongest.partialRSquared,
        },
      })),
    },
    warnings,
  };
}

/**
 * Why the checks that simulate a one-step model of the plant (the model rollouts and the
 * linear-quadratic closed form) are not applied, or null: they assume the next state depends on the
 * present state and action only, so where the plant-memory finding is serious they would share the
 * estimate's blind spot and could "confirm" a J that the missing memory has moved (a pipe heater with a
 * dead time, logged without it: rollouts agreed with a J whose range missed the truth on 3 of 5 seeds).
 */
export function modelChecksReason(memory: { warnings: readonly AssessmentWarning[] }): string | null {
  return memory.warnings.some((w) => w.topic === 'plantMemory' && w.severity === 'serious') ? MODEL_CHECKS_REASON : null;
}

export const MODEL_CHECKS_REASON = 'the plant-memory finding is serious, and this check simulates a one-step model of the plant that assumes the next state depends on the present state and action only';
