/**
 * The evaluation as plain JSON (typed arrays become number arrays), for `--json` output and files.
 * Field names here are a published interface of the CLI: add fields, do not rename them.
 */
import type { ImportedDataset } from '../data/importDataset';
import type { Evaluation, PolicyEstimate, ValueSurface } from './estimates';

export function evaluationToJson(evaluation: Evaluation): Record<string, unknown> {
  return {
    project: evaluation.project,
    evaluatedAt: evaluation.evaluatedAt,
    valueSense: evaluation.valueSense,
    settings: evaluation.settings,
    behaviour: evaluation.behaviour,
    presentController: evaluation.presentController && { ...evaluation.presentController, estimate: policyJson(evaluation.presentController.estimate) },
    presentControllerReason: evaluation.presentControllerReason,
    policies: evaluation.policies.map(policyJson),
    warnings: evaluation.warnings,
    cautions: evaluation.cautions,
  };
}

function policyJson(p: Omit<PolicyEstimate, 'surface'> & { surface?: ValueSurface | null }): Record<string, unknown> {
  return {
    name: p.name, policyValue: p.policyValue, standardError: p.standardError, fixedPointValue: p.fixedPointValue, status: p.status,
    message: p.message, iterations: p.iterations, featureCount: p.featureCount, backend: p.backend, history: p.history,
    surface: p.surface && {
      xState: p.surface.xState, yState: p.surface.yState, x: Array.from(p.surface.x), y: Array.from(p.surface.y),
      values: Array.from(p.surface.values), heldState: p.surface.heldState, visits: Array.from(p.surface.visits),
    },
  };
}

/** The import's account for `--json`: counts, the rules that made episodes, every excluded row, the time windows and the runs left out. */
export function importToJson(imported: ImportedDataset): Record<string, unknown> {
  const s = imported.summary;
  return {
    rows: s.rowCount,
    usedRows: s.usedRowCount,
    excludedRows: s.excludedRowCount,
    transitions: s.transitionCount,
    episodes: s.episodeCount,
    samplingPeriodSeconds: s.samplingPeriodSeconds,
    delimiter: s.delimiter,
    decimalMark: s.decimalMark,
    dateOrder: s.dateOrder,
    report: imported.episodeReport,
    excluded: imported.excluded,
    /** Each time window left out, in seconds on the timestamp column's clock, and the rows it left out. */
    timeWindows: imported.timeWindows,
    /** Each range of runs left out by label (data.csv.excludedRuns): its first and last label, reason, runs and rows. */
    runsLeftOut: imported.runsLeftOut,
  };
}
