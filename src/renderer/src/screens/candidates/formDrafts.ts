/**
 * Pure edits behind the candidate editor's "Form" choice and its loop fields: plain starting
 * values for each form (bias at the logged mean action, gain 0, no integral action), switching a
 * candidate's form while keeping its name, description, dither and limits, and the derived states
 * a PI loop or a rate limit needs (found in `columns.derived`, never created here).
 */
import { previousSteps, type CandidateForm, type CandidateSpec, type DerivedStateSpec, type ProjectDocument } from '../../../../project/schema';
import type { DataImport } from '../../../../shared/workerMessages';
import { roundSignificant } from './candidateDrafts';

export type FormKind = CandidateForm['kind'];
export type PiForm = Extract<CandidateForm, { kind: 'pi' }>;
export type ScheduleForm = Extract<CandidateForm, { kind: 'schedule' }>;
export type PiLoop = PiForm['loops'][number];
export type ScheduleLoop = ScheduleForm['loops'][number];
/** A P/PI loop without its bias (a schedule's trim). */
export type Feedback = Omit<PiLoop, 'bias'>;

/** Logged statistics of a column from the import summary, or undefined. */
function logged(imported: DataImport | null, column: string): { mean: number; std: number; min: number; max: number } | undefined {
  return imported?.summary.columns.find((c) => c.name === column);
}

function derivedStates(doc: ProjectDocument): readonly DerivedStateSpec[] {
  return doc.columns.derived ?? [];
}

/** The first state column that is not a derived state (a measured signal), or the first state. */
export function firstMeasuredState(doc: ProjectDocument): string {
  const derived = new Set(derivedStates(doc).map((d) => d.name));
  const states = doc.columns.states.map((s) => s.column);
  return states.find((s) => !derived.has(s)) ?? states[0] ?? '';
}

/** Error-integral states among the state columns that integrate this measurement, the one with the same setpoint first. */
export function errorIntegralsFor(doc: ProjectDocument, measurement: string, setpoint?: number | string): string[] {
  const states = new Set(doc.columns.states.map((s) => s.column));
  const found = derivedStates(doc).filter((d): d is Extract<DerivedStateSpec, { kind: 'errorIntegral' }> => d.kind === 'errorIntegral' && d.measurement === measurement && states.has(d.name));
  return [...found.filter((d) => d.setpoint === setpoint), ...found.filter((d) => d.setpoint !== setpoint)].map((d) => d.name);
}

/** The derived previous value (one row back) of an action column among the state columns, or null. */
export function previousActionState(doc: ProjectDocument, actionColumn: string): string | null {
  const states = new Set(doc.columns.states.map((s) => s.column));
  return derivedStates(doc).find((d) => d.kind === 'previous' && previousSteps(d) === 1 && d.source === actionColumn && states.has(d.name))?.name ?? null;
}

/** A fixed setpoint to start from for a measurement: its error integral's constant setpoint, or 0. */
export function fixedSetpointFor(doc: ProjectDocument, measurement: string): number {
  const integral = derivedStates(doc).find((d) => d.kind === 'errorIntegral' && d.measurement === measurement && typeof d.setpoint === 'number');
  return integral?.kind === 'errorIntegral' && typeof integral.setpoint === 'number' ? integral.setpoint : 0;
}

/** Plain feedback on a measurement: setpoint from its error integral (or its logged mean), gain 0, P only, reverse. */
export function defaultFeedback(doc: ProjectDocument, imported: DataImport | null, measurement = firstMeasuredState(doc)): Feedback {
  const integral = derivedStates(doc).find((d) => d.kind === 'errorIntegral' && d.measurement === measurement);
  const setpoint = integral?.kind === 'errorIntegral' ? integral.setpoint : roundSignificant(logged(imported, measurement)?.mean ?? 0);
  return { measurement, setpoint, proportionalGain: 0, action: 'reverse' };
}

function loggedActionMean(doc: ProjectDocument, imported: DataImport | null, a: number): number {
  return roundSignificant(logged(imported, doc.columns.actions[a]?.column ?? '')?.mean ?? 0);
}

export function defaultPiForm(doc: ProjectDocument, imported: DataImport | null): PiForm {
  return { kind: 'pi', loops: doc.columns.actions.map((_, a) => ({ bias: loggedActionMean(doc, imported, a), ...defaultFeedback(doc, imported) })) };
}

/** Two breakpoints one logged standard deviation either side of the input's mean (or 0 and 1), both at the logged mean action. */
export function defaultScheduleForm(doc: ProjectDocument, imported: DataImport | null): ScheduleForm {
  const input = firstMeasuredState(doc);
  const stat = logged(imported, input);
  const breakpoints = stat && stat.std > 0 ? [roundSignificant(stat.mean - stat.std), roundSignificant(stat.mean + stat.std)] : [0, 1];
  if (!(breakpoints[1] > breakpoints[0])) breakpoints[1] = breakpoints[0] + 1;
  return {
    kind: 'schedule',
    loops: doc.columns.actions.map((_, a) => {
      const mean = loggedActionMean(doc, imported, a);
      return { input, breakpoints, values: [mean, mean] };
    }),
  };
}

export function defaultAffineForm(doc: ProjectDocument, imported: DataImport | null): CandidateForm {
  return {
    kind: 'affine',
    offset: doc.columns.actions.map((_, a) => loggedActionMean(doc, imported, a)),
    gain: doc.columns.actions.map(() => doc.columns.states.map(() => 0)),
  };
}

function feedbackOf(loop: PiLoop): Feedback {
  const { bias: _bias, ...feedback } = loop;
  return feedback;
}

/**
 * The candidate with a form of another kind, everything else (name, description, dither, actuator
 * limits, rate limit) kept. Between PI and schedule the feedback carries over (a PI loop becomes the
 * schedule's trim, with its bias as a flat schedule; a schedule's trim becomes the PI loop, with the
 * schedule's mean value as bias); from or to affine the new form starts from plain values.
 */
export function withFormKind(candidate: CandidateSpec, kind: FormKind, doc: ProjectDocument, imported: DataImport | null): CandidateSpec {
  const from = candidate.form;
  if (from.kind === kind) return candidate;
  if (kind === 'affine') return { ...candidate, form: defaultAffineForm(doc, imported) };
  if (kind === 'pi') {
    const form = defaultPiForm(doc, imported);
    if (from.kind === 'schedule') {
      form.loops = form.loops.map((loop, a) => {
        const s = from.loops[a];
        if (!s) return loop;
        const bias = roundSignificant(s.values.reduce((x, y) => x + y, 0) / Math.max(1, s.values.length));
        return s.feedback ? { bias, ...s.feedback } : { ...loop, bias };
      });
    }
    return { ...candidate, form };
  }
  const form = defaultScheduleForm(doc, imported);
  if (from.kind === 'pi') {
    form.loops = form.loops.map((loop, a) => {
      const p = from.loops[a];
      return p ? { ...loop, values: loop.values.map(() => p.bias), feedback: feedbackOf(p) } : loop;
    });
  }
  return { ...candidate, form };
}

/** Integral action of a loop: none, an integral time T_i or an integral gain K_i. */
export type IntegralMode = 'none' | 'time' | 'gain';

export function integralMode(loop: Feedback): IntegralMode {
  if (loop.integralTimeSeconds !== undefined) return 'time';
  if (loop.integralGain !== undefined) return 'gain';
  return 'none';
}

/** Integral time used when integral action is first switched on without a gain to convert (10 min). */
export const STARTING_INTEGRAL_TIME_SECONDS = 600;

/**
 * The loop with another integral mode. T_i and K_i convert through K_i = K_c/T_i where both are
 * defined (K_c > 0 and a non-zero value); the error-integral state is filled in from the
 * project's derived states when the loop has none.
 */
export function withIntegralMode<L extends Feedback>(loop: L, mode: IntegralMode, doc: ProjectDocument): L {
  const { integralTimeSeconds, integralGain, integralState, ...rest } = loop;
  if (mode === 'none') return { ...rest, ...(integralState !== undefined ? { integralState } : {}) } as L;
  const state = integralState ?? errorIntegralsFor(doc, loop.measurement, loop.setpoint)[0];
  const withState = { ...rest, ...(state !== undefined ? { integralState: state } : {}) };
  const kc = loop.proportionalGain;
  if (mode === 'time') {
    const fromGain = integralGain && kc > 0 ? roundSignificant(kc / integralGain) : undefined;
    return { ...withState, integralTimeSeconds: integralTimeSeconds ?? fromGain ?? STARTING_INTEGRAL_TIME_SECONDS } as L;
  }
  const fromTime = integralTimeSeconds ? roundSignificant(kc / integralTimeSeconds) : undefined;
  return { ...withState, integralGain: integralGain ?? fromTime ?? 0 } as L;
}

/**
 * The candidate's rate limit with action a's max step and previous-action state set (undefined
 * keeps the current one). A new max step fills in the action's derived previous state when the
 * project has one. The rate limit is removed when no action has a step or a previous state left.
 */
export function withRateLimit(
  candidate: CandidateSpec, doc: ProjectDocument, a: number,
  change: { maxStep?: number | null; previousAction?: string | null },
): CandidateSpec {
  const m = doc.columns.actions.length;
  const current = candidate.rateLimit ?? { maxStep: Array<number | null>(m).fill(null), previousAction: Array<string | null>(m).fill(null) };
  const maxStep = Array.from({ length: m }, (_, j) => current.maxStep[j] ?? null);
  const previousAction = Array.from({ length: m }, (_, j) => current.previousAction[j] ?? null);
  if (change.maxStep !== undefined) {
    maxStep[a] = change.maxStep;
    if (change.maxStep !== null && previousAction[a] === null) previousAction[a] = previousActionState(doc, doc.columns.actions[a]?.column ?? '');
  }
  if (change.previousAction !== undefined) previousAction[a] = change.previousAction;
  const { rateLimit: _old, ...rest } = candidate;
  if (maxStep.every((s) => s === null) && previousAction.every((p) => p === null)) return rest;
  return { ...rest, rateLimit: { maxStep, previousAction } };
}

export function withoutRateLimit(candidate: CandidateSpec): CandidateSpec {
  const { rateLimit: _old, ...rest } = candidate;
  return rest;
}
