/**
 * Cross-field checks of one candidate that the per-field schema cannot express: one loop (or
 * offset and gain row) per action, states named by the form are state columns, an integral state
 * is the derived error integral of the same measurement and setpoint, a rate limit names the
 * derived previous value of its own action column, limits one per action.
 */
import { previousSteps, type CandidateSpec, type DerivedStateSpec, type ProjectDocument } from './schema';

type Feedback = {
  measurement: string; setpoint: number | string; proportionalGain: number;
  integralTimeSeconds?: number; integralGain?: number; integralState?: string;
};

interface Context {
  readonly stateNames: readonly string[];
  readonly actionNames: readonly string[];
  readonly derived: readonly DerivedStateSpec[];
  readonly add: (path: string, message: string) => void;
}

export function checkCandidate(doc: ProjectDocument, c: CandidateSpec, add: (path: string, message: string) => void): void {
  const ctx: Context = {
    stateNames: doc.columns.states.map((s) => s.column), actionNames: doc.columns.actions.map((a) => a.column),
    derived: doc.columns.derived ?? [], add,
  };
  const m = ctx.actionNames.length;
  checkForm(c.form, ctx);
  if (c.dither.length !== m) add('dither', `expected ${m} value(s), one per action column, found ${c.dither.length}`);
  checkBounds(c, ctx);
  checkRateLimit(c, ctx);
}

function checkForm(form: CandidateSpec['form'], ctx: Context): void {
  const m = ctx.actionNames.length, ds = ctx.stateNames.length;
  if (form.kind === 'affine') {
    if (form.offset.length !== m) ctx.add('form.offset', `expected ${m} value(s), one per action column, found ${form.offset.length}`);
    if (form.gain.length !== m) ctx.add('form.gain', `expected ${m} row(s), one per action column, found ${form.gain.length}`);
    form.gain.forEach((row, r) => {
      if (row.length !== ds) ctx.add(`form.gain[${r}]`, `expected ${ds} value(s), one per state column, found ${row.length}`);
    });
    return;
  }
  if (form.loops.length !== m) ctx.add('form.loops', `expected ${m} loop(s), one per action column (${ctx.actionNames.join(', ')}), found ${form.loops.length}`);
  if (form.kind === 'pi') {
    form.loops.forEach((loop, j) => checkFeedback(loop, `form.loops[${j}]`, ctx));
    return;
  }
  form.loops.forEach((loop, j) => {
    const where = `form.loops[${j}]`;
    checkState(loop.input, `${where}.input`, ctx);
    if (loop.values.length !== loop.breakpoints.length) ctx.add(`${where}.values`, `expected ${loop.breakpoints.length} value(s), one per breakpoint, found ${loop.values.length}`);
    loop.breakpoints.forEach((b, k) => {
      if (k > 0 && !(b > loop.breakpoints[k - 1])) ctx.add(`${where}.breakpoints[${k}]`, `breakpoints must increase strictly, but ${b} follows ${loop.breakpoints[k - 1]}`);
    });
    if (loop.feedback) checkFeedback(loop.feedback, `${where}.feedback`, ctx);
  });
}

function checkFeedback(loop: Feedback, where: string, ctx: Context): void {
  checkState(loop.measurement, `${where}.measurement`, ctx);
  if (typeof loop.setpoint === 'string') checkState(loop.setpoint, `${where}.setpoint`, ctx);
  if (loop.integralTimeSeconds !== undefined && loop.integralGain !== undefined) {
    ctx.add(`${where}.integralGain`, 'give the integral action once, as an integral time T_i or as an integral gain K_i, not both');
  }
  if (loop.integralTimeSeconds !== undefined && loop.proportionalGain === 0) {
    ctx.add(`${where}.integralTimeSeconds`, 'with a proportional gain K_c of 0 an integral time gives no integral action (K_i = K_c/T_i = 0); give an integral gain K_i instead');
  }
  const integral = loop.integralTimeSeconds !== undefined || (loop.integralGain ?? 0) > 0;
  if (!integral) return;
  if (loop.integralState === undefined) {
    ctx.add(`${where}.integralState`, 'integral action needs the error-integral state: choose the integral of this loop’s error as its error-integral state (the project file computes one on import as a derived state of kind "errorIntegral" among the states)');
    return;
  }
  if (!checkState(loop.integralState, `${where}.integralState`, ctx)) return;
  const integralState = ctx.derived.find((d) => d.name === loop.integralState);
  if (!integralState || integralState.kind !== 'errorIntegral') {
    ctx.add(`${where}.integralState`, `"${loop.integralState}" is not an error integral computed on import; choose one of this loop’s error as its error-integral state`);
    return;
  }
  if (integralState.measurement !== loop.measurement || integralState.setpoint !== loop.setpoint) {
    ctx.add(`${where}.integralState`, `"${loop.integralState}" integrates ${JSON.stringify(integralState.setpoint)} − ${integralState.measurement}, but this loop’s error is ${JSON.stringify(loop.setpoint)} − ${loop.measurement}; choose an error-integral state of the same measurement and setpoint`);
  }
}

function checkState(name: string, where: string, ctx: Context): boolean {
  if (ctx.stateNames.includes(name)) return true;
  ctx.add(where, `"${name}" is not one of the state columns (${ctx.stateNames.join(', ')}); the candidate can act only on states`);
  return false;
}

function checkBounds(c: CandidateSpec, ctx: Context): void {
  if (!c.bounds) return;
  const m = ctx.actionNames.length;
  for (const side of ['lo', 'hi'] as const) {
    if (c.bounds[side].length !== m) ctx.add(`bounds.${side}`, `expected ${m} limit(s), one per action column (blank for none)`);
  }
  c.bounds.lo.forEach((lo, k) => {
    const hi = c.bounds!.hi[k];
    if (lo !== null && hi !== null && hi !== undefined && !(lo < hi)) ctx.add(`bounds.lo[${k}]`, `the lowest ${ctx.actionNames[k] ?? `action ${k + 1}`} (${lo}) must be below the highest (${hi})`);
  });
}

function checkRateLimit(c: CandidateSpec, ctx: Context): void {
  const rate = c.rateLimit;
  if (!rate) return;
  const m = ctx.actionNames.length;
  if (rate.maxStep.length !== m) ctx.add('rateLimit.maxStep', `expected ${m} largest step(s) per sample, one per action column (blank for no rate limit)`);
  if (rate.previousAction.length !== m) ctx.add('rateLimit.previousAction', `expected ${m} previous-action state(s), one per action column (none where there is no rate limit)`);
  if (c.bounds?.mode === 'truncate') ctx.add('rateLimit', 'a rate limit clips the action, so the actuator limits must clip too: set "At a limit" to Clip');
  rate.maxStep.forEach((step, j) => {
    const previous = rate.previousAction[j] ?? null, where = `rateLimit.previousAction[${j}]`;
    if (step === null) return;
    if (previous === null) {
      ctx.add(where, `a rate limit on ${ctx.actionNames[j] ?? `action ${j + 1}`} needs the previous value of that action among the states: choose it as the previous-action state`);
      return;
    }
    if (!checkState(previous, where, ctx)) return;
    const d = ctx.derived.find((x) => x.name === previous);
    if (!d || d.kind !== 'previous' || d.source !== ctx.actionNames[j] || previousSteps(d) !== 1) {
      ctx.add(where, `"${previous}" is not the previous value of ${ctx.actionNames[j]}; choose the state that holds ${ctx.actionNames[j]} one sample earlier as the previous-action state`);
    }
  });
}

/** Candidate i of the document as written, or undefined. */
export function writtenCandidate(written: unknown, i: number): unknown {
  const candidates = (written as { candidates?: unknown } | undefined)?.candidates;
  return Array.isArray(candidates) ? candidates[i] : undefined;
}

/** A held field path as the candidate wrote it: the older affine fields had no "form.", dither was "std". */
export function writtenCandidatePath(written: unknown, path: string): string {
  if (typeof written !== 'object' || written === null) return path;
  const w = written as Record<string, unknown>;
  if (!('form' in w) && /^form\.(offset|gain)/.test(path)) return path.slice('form.'.length);
  if ('std' in w && !('dither' in w) && /^dither\b/.test(path)) return `std${path.slice('dither'.length)}`;
  return path;
}
