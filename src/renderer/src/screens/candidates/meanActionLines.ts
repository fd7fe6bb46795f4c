/**
 * What the candidate chart draws (src/figures/charts/candidateActions.ts), from the project and
 * its import: the logged (state, action) pairs of the even sample, each candidate's mean applied
 * action along one state axis with the other states at their logged means (after its actuator
 * limits, src/figures/parts/meanActionCurve.ts), the present controller's fitted line, and the
 * limits on that action.
 */
import type { CandidateActionsPlotProps } from '../../../../figures/charts/candidateActions';
import { actionLimits, meanActionCurve, meanCurve, type AffineCandidate, type Curve } from '../../../../figures/parts/meanActionCurve';
import { PolicyError, policyMean, type GaussianPolicy } from '../../../../core/policy';
import { candidatePolicy, type CandidateColumns } from '../../../../pipeline/candidatePolicy';
import type { Theme } from '../../../../figures/parts/plotTheme';
import { formatValue } from '../../../../figures/parts/tickFormat';
import type { ProjectDocument } from '../../../../project/schema';
import type { DataImport, LoggedSample } from '../../../../shared/workerMessages';

export function loggedCurve(sample: LoggedSample, stateDim: number, actionDim: number, axis: number, action: number): Curve {
  const x = new Float64Array(sample.count), y = new Float64Array(sample.count);
  for (let k = 0; k < sample.count; k++) {
    x[k] = sample.states[k * stateDim + axis];
    y[k] = sample.actions[k * actionDim + action];
  }
  return { x, y };
}

const withUnit = (name: string, unit: string | undefined) => (unit ? `${name} (${unit})` : name);

/** The limits the chart draws: those of the first candidate that has any on this action. */
function shownLimits(doc: ProjectDocument, action: number) {
  for (const c of doc.candidates) {
    const l = actionLimits({ offset: [], gain: [], std: [], bounds: c.bounds }, action);
    if (l) return { lo: Number.isFinite(l.lo) ? l.lo : null, hi: Number.isFinite(l.hi) ? l.hi : null, mode: l.mode };
  }
  return null;
}

/**
 * Any candidate form compiled to the engine's policy (pipeline/candidatePolicy.ts) and its mean
 * taken along the axis; null when it does not compile yet (the editor names the fault). A rate
 * limit moves with the previous action and is not drawn; the position limits are.
 */
function candidateCurve(
  c: ProjectDocument['candidates'][number], columns: CandidateColumns, axis: number, action: number, range: [number, number], held: readonly number[],
): Curve | null {
  let policy: GaussianPolicy;
  try {
    policy = candidatePolicy(c, columns);
  } catch (error) {
    if (error instanceof PolicyError) return null;
    throw error;
  }
  if (held.length !== policy.stateDim || action >= policy.actionDim) return null;
  const state = Float64Array.from(held), out = new Float64Array(policy.actionDim);
  const meanAt = (s: number) => {
    state[axis] = s;
    policyMean(policy, state, out);
    return out[action];
  };
  return meanCurve(meanAt, c.dither[action] ?? 0, actionLimits({ offset: [], gain: [], std: [], bounds: c.bounds }, action), range);
}

/** The behaviour model's clip (±Infinity where the log shows no limit) as the curve's bounds (null where open). */
function presentBounds(b: { lo: number[]; hi: number[]; mode: 'clip' }): AffineCandidate['bounds'] {
  const open = (v: number) => (Number.isFinite(v) ? v : null);
  return { lo: b.lo.map(open), hi: b.hi.map(open), mode: b.mode };
}

export function candidateActionsProps(doc: ProjectDocument, imported: DataImport, axis: number, action: number, theme: Theme): CandidateActionsPlotProps {
  const range = imported.stateRanges[axis], held = imported.stateMeans, ds = imported.stateNames.length;
  const columns = { stateNames: doc.columns.states.map((s) => s.column), actionNames: doc.columns.actions.map((a) => a.column) };
  const candidates = doc.candidates.flatMap((c) => {
    const curve = candidateCurve(c, columns, axis, action, range, held);
    return curve ? [{ name: c.name, ...curve }] : [];
  });
  const model = imported.behaviour.ok ? imported.behaviour.model : null;
  // The present controller's model clips at the limits the log shows (behaviourModel.ts), so its line is drawn within them as the candidates' are
  // (it ran past 100 % on the heating-loop sample while the note said "within its actuator limits").
  const present = model ? meanActionCurve({ offset: model.offset, gain: model.gain, std: model.std, bounds: model.bounds && presentBounds(model.bounds) }, axis, action, range, held) : null;
  const limits = shownLimits(doc, action), unit = doc.columns.actions[action]?.unit ?? '';
  const others = ds > 1 ? 'the other states held at their logged means' : '';
  const limitWords = limits ? `mean applied action within the limits ${formatValue(limits.lo ?? -Infinity)} to ${formatValue(limits.hi ?? Infinity)}${unit ? ` ${unit}` : ''} (${limits.mode === 'clip' ? 'clipped' : 'truncated'})` : 'mean action';
  return {
    logged: loggedCurve(imported.sample, ds, imported.actionNames.length, axis, action),
    candidates, present, limits: limits && { lo: limits.lo, hi: limits.hi },
    xLabel: withUnit(doc.columns.states[axis]?.column ?? '', doc.columns.states[axis]?.unit),
    yLabel: withUnit(doc.columns.actions[action]?.column ?? '', unit),
    title: '', subtitle: [limitWords, others].filter(Boolean), theme,
  };
}
