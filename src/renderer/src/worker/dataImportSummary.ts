/**
 * What the renderer needs to show after an import: the importer's own summary and report, the
 * state ranges and means for sliders, a small evenly spaced sample of the logged transitions to
 * draw, and the fitted behaviour model (or why it could not be fitted).
 */
import type { DeclaredActionBounds } from '../../../core/loggedActionLimits';
import type { TransitionSet } from '../../../core/transitions';
import type { OpenedProject } from '../../../pipeline/openProject';
import { declaredActionBounds } from '../../../pipeline/plan/declaredBounds';
import { fitPresentControllerLaw } from '../../../pipeline/plan/presentController';
import { heldRowsLeftOut } from '../../../pipeline/heldActionsCheck';
import {
  EXCLUDED_ROWS_SHOWN, LOGGED_SAMPLE_SIZE, RUN_LABELS_OFFERED, type BehaviourFit, type DataImport, type LoggedSample,
} from '../../../shared/workerMessages';

export function dataImportSummary(opened: OpenedProject): DataImport {
  const { dataset, imported } = opened;
  const { means, ranges } = stateMoments(dataset);
  return {
    summary: imported.summary,
    excluded: imported.excluded.slice(0, EXCLUDED_ROWS_SHOWN),
    episodeReport: imported.episodeReport,
    leftOutLines: imported.leftOutLines,
    rowCount: imported.rowCount,
    fingerprint: opened.fingerprint,
    warnings: opened.warnings,
    stateNames: [...dataset.stateNames],
    actionNames: [...dataset.actionNames],
    stateMeans: means,
    stateRanges: ranges,
    sample: loggedSample(dataset, LOGGED_SAMPLE_SIZE),
    behaviour: behaviourFit(dataset, declaredActionBounds(opened.project, dataset.actionDim)),
    timeWindows: imported.timeWindows,
    runsLeftOut: imported.runsLeftOut,
    runLabels: imported.runLabels.slice(0, RUN_LABELS_OFFERED),
    ...(imported.clock ? { clock: imported.clock } : {}),
    trend: imported.trend,
  };
}

function stateMoments(data: TransitionSet): { means: number[]; ranges: [number, number][] } {
  const ds = data.stateDim, n = data.count;
  const means = new Array<number>(ds).fill(0);
  const ranges = Array.from({ length: ds }, (): [number, number] => [Infinity, -Infinity]);
  for (let i = 0; i < n; i++) {
    for (let c = 0; c < ds; c++) {
      const v = data.states[i * ds + c];
      means[c] += v / n;
      if (v < ranges[c][0]) ranges[c][0] = v;
      if (v > ranges[c][1]) ranges[c][1] = v;
    }
  }
  return { means, ranges };
}

/** Every ⌈n/k⌉-th transition, so the drawing covers the whole log without drawing all of it. */
export function loggedSample(data: TransitionSet, size: number): LoggedSample {
  const ds = data.stateDim, m = data.actionDim;
  const step = Math.max(1, Math.ceil(data.count / size));
  const count = Math.ceil(data.count / step);
  const states = new Float64Array(count * ds), actions = new Float64Array(count * m);
  for (let k = 0; k < count; k++) {
    const i = k * step;
    states.set(data.states.subarray(i * ds, (i + 1) * ds), k * ds);
    actions.set(data.actions.subarray(i * m, (i + 1) * m), k * m);
  }
  return { count, states, actions };
}

/** The same law as the plan's present controller (src/pipeline/plan/presentController.ts), with the same declared bounds and the same held-actions repair. */
function behaviourFit(data: TransitionSet, declared: DeclaredActionBounds): BehaviourFit {
  const { fitted, error, held, lawFit } = fitPresentControllerLaw(data, declared);
  if (!fitted) return { ok: false, message: error };
  return { ok: true, model: fitted.model, heldRowsLeftOut: heldRowsLeftOut(held, lawFit) };
}
