/**
 * The numbers of a candidate a retune map may sweep, named by their dotted path in the document
 * ("form.loops.0.proportionalGain", "dither.0", "rateLimit.maxStep.0"), with a label in the trade's
 * words; reading one, and a copy of the candidate with one set. Pure edits of the document.
 */
import type { CandidateSpec, ColumnRoles } from './schema';

export interface TunableParameter {
  readonly path: string;
  readonly label: string;
  readonly unit: string;
}

/** The value at a dotted path, or undefined when the path does not name a number. */
export function candidateParameter(candidate: CandidateSpec, path: string): number | undefined {
  let node: unknown = candidate;
  for (const key of path.split('.')) {
    if (node === null || typeof node !== 'object') return undefined;
    node = (node as Record<string, unknown>)[key];
  }
  return typeof node === 'number' && Number.isFinite(node) ? node : undefined;
}

/** A copy of the candidate with the number at `path` replaced (the path must name a number). */
export function withCandidateParameter(candidate: CandidateSpec, path: string, value: number): CandidateSpec {
  if (candidateParameter(candidate, path) === undefined) throw new RangeError(`${path}: not a number of candidate "${candidate.name}"`);
  const copy = structuredClone(candidate) as unknown as Record<string, unknown>;
  const keys = path.split('.');
  let node = copy;
  for (const key of keys.slice(0, -1)) node = node[key] as Record<string, unknown>;
  node[keys[keys.length - 1]] = value;
  return copy as unknown as CandidateSpec;
}

/** The sweepable numbers of a candidate, in the order an engineer would reach for them. */
export function tunableParameters(candidate: CandidateSpec, columns: ColumnRoles): TunableParameter[] {
  const actionUnit = (j: number): string => columns.actions[j]?.unit ?? '';
  const stateUnit = (name: string): string => columns.states.find((s) => s.column === name)?.unit ?? '';
  // "% per °C", as the candidate editor writes a gain's unit (one notation wherever the engineer reads it).
  const per = (j: number, state: string): string => `${actionUnit(j) || 'unit'} per ${stateUnit(state) || 'unit'}`;
  const out: TunableParameter[] = [];
  const loopTag = (j: number): string => (columns.actions.length > 1 ? ` (${columns.actions[j]?.column ?? `action ${j + 1}`})` : '');
  const form = candidate.form;
  const feedback = (prefix: string, loop: { measurement: string; integralTimeSeconds?: number; integralGain?: number }, j: number): void => {
    out.push({ path: `${prefix}.proportionalGain`, label: `proportional gain K_c${loopTag(j)}`, unit: per(j, loop.measurement) });
    if (loop.integralTimeSeconds !== undefined) out.push({ path: `${prefix}.integralTimeSeconds`, label: `integral time T_i${loopTag(j)}`, unit: 's' });
    if (loop.integralGain !== undefined) out.push({ path: `${prefix}.integralGain`, label: `integral gain K_i${loopTag(j)}`, unit: `${per(j, loop.measurement)}·s` });
  };
  if (form.kind === 'affine') {
    form.offset.forEach((_, j) => out.push({ path: `form.offset.${j}`, label: `offset${loopTag(j)}`, unit: actionUnit(j) }));
    form.gain.forEach((row, j) => row.forEach((_, k) => {
      const state = columns.states[k]?.column ?? `state ${k + 1}`;
      out.push({ path: `form.gain.${j}.${k}`, label: `gain on ${state}${loopTag(j)}`, unit: per(j, state) });
    }));
  } else if (form.kind === 'pi') {
    form.loops.forEach((loop, j) => {
      feedback(`form.loops.${j}`, loop, j);
      out.push({ path: `form.loops.${j}.bias`, label: `bias${loopTag(j)}`, unit: actionUnit(j) });
    });
  } else {
    form.loops.forEach((loop, j) => {
      if (loop.feedback) feedback(`form.loops.${j}.feedback`, loop.feedback, j);
      loop.values.forEach((_, k) => out.push({ path: `form.loops.${j}.values.${k}`, label: `schedule value at ${loop.input} = ${loop.breakpoints[k]}${loopTag(j)}`, unit: actionUnit(j) }));
    });
  }
  candidate.dither.forEach((_, j) => out.push({ path: `dither.${j}`, label: `dither${loopTag(j)}`, unit: actionUnit(j) }));
  candidate.rateLimit?.maxStep.forEach((step, j) => {
    if (step !== null) out.push({ path: `rateLimit.maxStep.${j}`, label: `rate limit per step${loopTag(j)}`, unit: actionUnit(j) });
  });
  return out;
}
