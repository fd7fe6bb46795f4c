/**
 * The run-order check on a project's log (src/core/diagnostics/runOrder.ts), once per project, not per
 * candidate: is the log one plant under one controller from its first run to its last? Its rule and
 * words come from src/core/diagnostics/runOrderFinding.ts; its numbers go to the assessment as `runOrder`.
 */
import { runOrderTrends, type RunOrderData } from '../core/diagnostics/runOrder';
import { changedTrends, fewestRunsToShow, runOrderFinding, trendSeverity, type RunOrderNames } from '../core/diagnostics/runOrderFinding';
import { RUN_ORDER_MIN_RUNS } from '../core/limits';
import type { AssessmentWarning } from './assessment';

/** The check's numbers (plain JSON): runs read, runs skipped per fit, coefficients tested, and those that changed. */
export type RunOrderSummary =
  | {
    readonly runs: number; readonly lawRunsSkipped: number; readonly modelRunsSkipped: number; readonly coefficientsTested: number;
    /** The smallest Bonferroni-corrected p over the coefficients (K·p, at most 1). */
    readonly smallestCorrectedP: number;
    readonly changed: { fit: 'law' | 'model'; output: string; input: string; rho: number; z: number; correctedP: number; early: number; late: number; severity: 'caution' | 'serious' }[];
  }
  | { readonly reason: string };

/** `limits`: the actuator limits the baseline read from the log (its fitted model's, core/behaviourModel.ts), so a run's law is fitted as the baseline's is. */
export function runOrderAssessment(data: RunOrderData & RunOrderNames, limits?: RunOrderData['actionLimits']): { summary: RunOrderSummary; warnings: AssessmentWarning[] } {
  const result = data.count > 0 ? runOrderTrends({ ...data, actionLimits: limits ?? data.actionLimits }, RUN_ORDER_MIN_RUNS) : { reason: 'the log has no transitions' };
  const finding = runOrderFinding(result, data);
  const warnings = finding ? [finding] : [];
  if ('reason' in result) return { summary: { reason: result.reason }, warnings };
  const fewest = fewestRunsToShow(result.trends.length), most = Math.max(...result.trends.map((t) => t.runs));
  if (most < fewest) {
    return { summary: { reason: `its ${most.toLocaleString('en-US')} fitted runs cannot show a change at this level: with ${result.trends.length} coefficients tested, even a perfect trend needs ${fewest} runs` }, warnings };
  }
  const k = result.trends.length, names = [...data.stateNames, ...data.actionNames];
  const output = (block: 'law' | 'model', i: number) => (block === 'law' ? data.actionNames[i] ?? `action ${i + 1}` : data.stateNames[i] ?? `state ${i + 1}`);
  return {
    summary: {
      runs: result.runs, lawRunsSkipped: result.lawSkipped, modelRunsSkipped: result.modelSkipped, coefficientsTested: k,
      smallestCorrectedP: Math.min(1, ...result.trends.map((t) => t.p * k)),
      changed: changedTrends(result).map((t) => ({
        fit: t.block, output: output(t.block, t.output), input: t.input < 0 ? 'intercept' : names[t.input] ?? `input ${t.input + 1}`,
        rho: t.rho, z: t.z, correctedP: Math.min(1, t.p * k), early: t.early, late: t.late, severity: trendSeverity(t),
      })),
    },
    warnings,
  };
}
