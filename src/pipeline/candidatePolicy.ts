/**
 * A candidate as written in the project document → the engine's Gaussian policy: state and action
 * column names resolved to indices, then the core compile step (core/policy/candidateForms.ts).
 * The project's consistency check has already named any misplaced column; a fault found here is
 * reported as a PolicyError naming the candidate and the field.
 */
import { PolicyError, type GaussianPolicy } from '../core/policy';
import {
  CandidateFormError, compileCandidate, type CandidateDefinition, type CandidateForm, type FeedbackLoop,
} from '../core/policy/candidateForms';
import type { TransitionSet } from '../core/transitions';
import type { CandidateSpec } from '../project/schema';

/** The names the compile step resolves against: the imported data's state and action columns. */
export type CandidateColumns = Pick<TransitionSet, 'stateNames' | 'actionNames'>;

export function candidatePolicy(candidate: CandidateSpec, columns: CandidateColumns): GaussianPolicy {
  try {
    return compileCandidate(candidateDefinition(candidate, columns), columns.stateNames.length);
  } catch (error) {
    if (error instanceof CandidateFormError || error instanceof PolicyError) {
      throw new PolicyError(`candidate "${candidate.name}": ${error.message}`);
    }
    throw error;
  }
}

/** The candidate with names resolved to state indices (the core's input). */
export function candidateDefinition(candidate: CandidateSpec, columns: CandidateColumns): CandidateDefinition {
  const stateIndex = indexer(columns.stateNames, 'state');
  const bounds = candidate.bounds && {
    lo: candidate.bounds.lo.map((v) => v ?? -Infinity),
    hi: candidate.bounds.hi.map((v) => v ?? Infinity),
    mode: candidate.bounds.mode,
  };
  const rate = candidate.rateLimit;
  const rateLimit = rate && {
    previousActionState: rate.maxStep.map((step, j) => (step === null || rate.previousAction[j] == null ? -1 : stateIndex(rate.previousAction[j]!, `rateLimit.previousAction[${j}]`))),
    maxStep: rate.maxStep.map((step) => step ?? Infinity),
  };
  return { form: resolvedForm(candidate.form, stateIndex), dither: candidate.dither, bounds, rateLimit };
}

type StateIndex = (name: string, where: string) => number;

function indexer(names: readonly string[], what: string): StateIndex {
  return (name, where) => {
    const i = names.indexOf(name);
    if (i < 0) throw new CandidateFormError(`${where}: "${name}" is not one of the ${what} columns (${names.join(', ')})`);
    return i;
  };
}

function resolvedForm(form: CandidateSpec['form'], stateIndex: StateIndex): CandidateForm {
  if (form.kind === 'affine') return form;
  if (form.kind === 'pi') {
    return { kind: 'pi', loops: form.loops.map((loop, j) => ({ ...resolvedFeedback(loop, stateIndex, `form.loops[${j}]`), bias: loop.bias })) };
  }
  return {
    kind: 'schedule',
    loops: form.loops.map((loop, j) => ({
      inputState: stateIndex(loop.input, `form.loops[${j}].input`), breakpoints: loop.breakpoints, values: loop.values,
      feedback: loop.feedback && resolvedFeedback(loop.feedback, stateIndex, `form.loops[${j}].feedback`),
    })),
  };
}

type WrittenFeedback = Extract<CandidateSpec['form'], { kind: 'schedule' }>['loops'][number]['feedback'] & object;

function resolvedFeedback(loop: WrittenFeedback, stateIndex: StateIndex, where: string): FeedbackLoop {
  const integral = loop.integralTimeSeconds !== undefined ? { timeSeconds: loop.integralTimeSeconds }
    : loop.integralGain !== undefined ? { gain: loop.integralGain } : undefined;
  return {
    measurementState: stateIndex(loop.measurement, `${where}.measurement`),
    setpoint: typeof loop.setpoint === 'number' ? { value: loop.setpoint } : { state: stateIndex(loop.setpoint, `${where}.setpoint`) },
    proportionalGain: loop.proportionalGain,
    integral,
    integralState: loop.integralState === undefined ? undefined : stateIndex(loop.integralState, `${where}.integralState`),
    action: loop.action,
  };
}
