/**
 * Candidate forms as a control engineer writes them, with states referred to by index, compiled
 * to the engine's Gaussian policy (gaussianPolicyTypes.ts). The project layer resolves column
 * names to these indices (src/pipeline/candidatePolicy.ts).
 *
 * P / PI on a setpoint error, per action (ISA standard form, e.g. Åström & Hägglund, "Advanced
 * PID Control", 2006, ch. 3; from memory):
 *   e = r − y (reverse acting: the output rises as the measurement falls below the setpoint, as
 *   a heating valve does) or e = y − r (direct acting: a cooling valve); common practice.
 *   a = bias + K_c·e + K_i·I,   K_i = K_c / T_i  (or given directly),
 * where I is the derived error-integral state Σ (r − y)·Δt (src/data/derivedStates.ts), whose
 * sign follows the same direction. With r a constant or a state this is affine in the states:
 *   offset = bias + σ·K_c·r,  gain[y] = −σ·K_c,  gain[r] = +σ·K_c,  gain[I] = σ·K_i  (σ = +1
 *   reverse, −1 direct), so the affine fields hold it exactly and every affine-only method applies.
 * Schedule: a = S(x) + optional P/PI feedback (no bias), S piecewise linear in one state x
 * (meanSchedule.ts); the schedule term is carried as such, the feedback in offset/gain.
 * Affine: a = offset + G·s (the original form).
 * Dither is the Gaussian spread (standard deviation per action); limits and rate limit as in
 * actionLimits.ts.
 */
import { createGaussianPolicy, type BoundMode, type GaussianPolicy, type GaussianPolicySpec } from '../policy';

export type ControlAction = 'reverse' | 'direct';

/** P or PI feedback on one action. Indices are state indices. */
export interface FeedbackLoop {
  readonly measurementState: number;
  readonly setpoint: { readonly value: number } | { readonly state: number };
  readonly proportionalGain: number; // K_c ≥ 0, action units per measurement unit
  /** Integral action: T_i in seconds or K_i directly (action units per measurement unit·second); absent for P only. */
  readonly integral?: { readonly timeSeconds: number } | { readonly gain: number };
  /** The error-integral state I = Σ (r − y)·Δt (needed with integral action). */
  readonly integralState?: number;
  readonly action: ControlAction;
}

export interface PiLoop extends FeedbackLoop {
  readonly bias: number; // output at zero error and zero integral, action units
}

export interface ScheduleLoop {
  readonly inputState: number;
  readonly breakpoints: readonly number[];
  readonly values: readonly number[];
  readonly feedback?: FeedbackLoop;
}

export type CandidateForm =
  | { readonly kind: 'affine'; readonly offset: readonly number[]; readonly gain: readonly (readonly number[])[] }
  | { readonly kind: 'pi'; readonly loops: readonly PiLoop[] } // one loop per action
  | { readonly kind: 'schedule'; readonly loops: readonly ScheduleLoop[] }; // one loop per action

export interface CandidateDefinition {
  readonly form: CandidateForm;
  readonly dither: readonly number[]; // m standard deviations
  readonly bounds?: { readonly lo: readonly number[]; readonly hi: readonly number[]; readonly mode: BoundMode };
  /** Per action: the previous-action state (−1 none) and the largest step per sample. */
  readonly rateLimit?: { readonly previousActionState: readonly number[]; readonly maxStep: readonly number[] };
}

export class CandidateFormError extends Error {
  constructor(message: string) {
    super(message);
    this.name = 'CandidateFormError';
  }
}

/** Compile a candidate to the engine's policy; messages name the field (form.loops[0].…). */
export function compileCandidate(candidate: CandidateDefinition, stateDim: number): GaussianPolicy {
  return createGaussianPolicy(compiledSpec(candidate, stateDim), stateDim);
}

/** The plain policy specification of a candidate (createGaussianPolicy's input). */
export function compiledSpec(candidate: CandidateDefinition, stateDim: number): GaussianPolicySpec {
  const form = candidate.form;
  const spec: GaussianPolicySpec = {
    offset: [], gain: [], std: [...candidate.dither],
    bounds: candidate.bounds && { lo: [...candidate.bounds.lo], hi: [...candidate.bounds.hi], mode: candidate.bounds.mode },
    rateLimit: candidate.rateLimit && { previousActionState: [...candidate.rateLimit.previousActionState], maxStep: [...candidate.rateLimit.maxStep] },
  };
  if (form.kind === 'affine') {
    spec.offset = [...form.offset];
    spec.gain = form.gain.map((row) => [...row]);
    return spec;
  }
  spec.offset = form.loops.map(() => 0);
  spec.gain = form.loops.map(() => new Array<number>(stateDim).fill(0));
  if (form.kind === 'pi') {
    form.loops.forEach((loop, j) => {
      spec.offset[j] = loop.bias;
      addFeedback(loop, j, spec, stateDim, `form.loops[${j}]`);
    });
    return spec;
  }
  spec.schedules = form.loops.map((loop, j) => ({ action: j, state: loop.inputState, breakpoints: [...loop.breakpoints], values: [...loop.values] }));
  form.loops.forEach((loop, j) => {
    checkState(loop.inputState, stateDim, `form.loops[${j}].input`);
    if (loop.feedback) addFeedback(loop.feedback, j, spec, stateDim, `form.loops[${j}].feedback`);
  });
  return spec;
}

/** Add σ·K_c·(r − y) + σ·K_i·I to action j's affine part. */
function addFeedback(loop: FeedbackLoop, j: number, spec: GaussianPolicySpec, ds: number, where: string): void {
  const sign = loop.action === 'reverse' ? 1 : loop.action === 'direct' ? -1 : NaN;
  if (Number.isNaN(sign)) throw new CandidateFormError(`${where}.action: expected "reverse" or "direct", got ${JSON.stringify(loop.action)}`);
  const kc = loop.proportionalGain;
  if (!(kc >= 0) || !Number.isFinite(kc)) throw new CandidateFormError(`${where}.proportionalGain: expected a finite gain ≥ 0 (the action direction sets the sign), got ${kc}`);
  checkState(loop.measurementState, ds, `${where}.measurement`);
  const row = spec.gain[j];
  row[loop.measurementState] -= sign * kc;
  if ('value' in loop.setpoint) spec.offset[j] += sign * kc * loop.setpoint.value;
  else {
    checkState(loop.setpoint.state, ds, `${where}.setpoint`);
    row[loop.setpoint.state] += sign * kc;
  }
  const ki = integralGainOf(loop, where);
  if (ki === 0) return;
  if (loop.integralState === undefined) throw new CandidateFormError(`${where}.integralState: integral action needs the error-integral state`);
  checkState(loop.integralState, ds, `${where}.integralState`);
  row[loop.integralState] += sign * ki;
}

/** K_i = K_c/T_i, or the given K_i; 0 without integral action. */
export function integralGainOf(loop: FeedbackLoop, where = 'loop'): number {
  const integral = loop.integral;
  if (!integral) return 0;
  if ('timeSeconds' in integral) {
    const ti = integral.timeSeconds;
    if (!(ti > 0) || !Number.isFinite(ti)) throw new CandidateFormError(`${where}.integralTimeSeconds: expected a positive time in seconds, got ${ti}`);
    return loop.proportionalGain / ti;
  }
  const ki = integral.gain;
  if (!(ki >= 0) || !Number.isFinite(ki)) throw new CandidateFormError(`${where}.integralGain: expected a finite gain ≥ 0, got ${ki}`);
  return ki;
}

function checkState(index: number, ds: number, where: string): void {
  if (!Number.isInteger(index) || index < 0 || index >= ds) throw new CandidateFormError(`${where}: expected a state index from 0 to ${ds - 1}, got ${index}`);
}
