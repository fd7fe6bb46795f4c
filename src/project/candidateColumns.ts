/**
 * Keeping candidates in step when a state or action column is added or removed (pure edits of the
 * document, used by the app's column-role editor). Index-based fields follow the columns: the
 * affine form's offset and gain, the dither, the limits and the rate limit. Forms that name their
 * states (P/PI, schedule) need nothing for a state; a new action gets no loop of its own — the
 * consistency check then asks for it by field, since no loop can be guessed.
 */
import type { CandidateSpec } from './schema';

function inserted<T>(list: readonly T[], index: number, item: T): T[] {
  return [...list.slice(0, index), item, ...list.slice(index)];
}

function removed<T>(list: readonly T[], index: number): T[] {
  return list.filter((_, i) => i !== index);
}

export function candidateWithStateInserted(c: CandidateSpec, at: number): CandidateSpec {
  if (c.form.kind !== 'affine') return c;
  return { ...c, form: { ...c.form, gain: c.form.gain.map((row) => inserted(row, at, 0)) } };
}

export function candidateWithStateRemoved(c: CandidateSpec, index: number): CandidateSpec {
  if (c.form.kind !== 'affine') return c;
  return { ...c, form: { ...c.form, gain: c.form.gain.map((row) => removed(row, index)) } };
}

export function candidateWithActionInserted(c: CandidateSpec, at: number, stateCount: number): CandidateSpec {
  const form = c.form.kind === 'affine'
    ? { ...c.form, offset: inserted(c.form.offset, at, 0), gain: inserted(c.form.gain, at, new Array<number>(stateCount).fill(0)) }
    : c.form;
  return {
    ...c, form, dither: inserted(c.dither, at, 1),
    ...(c.bounds ? { bounds: { ...c.bounds, lo: inserted(c.bounds.lo, at, null), hi: inserted(c.bounds.hi, at, null) } } : {}),
    ...(c.rateLimit ? { rateLimit: { maxStep: inserted(c.rateLimit.maxStep, at, null), previousAction: inserted(c.rateLimit.previousAction, at, null) } } : {}),
  };
}

export function candidateWithActionRemoved(c: CandidateSpec, index: number): CandidateSpec {
  const form = c.form.kind === 'affine'
    ? { ...c.form, offset: removed(c.form.offset, index), gain: removed(c.form.gain, index) }
    : { ...c.form, loops: removed<(typeof c.form.loops)[number]>(c.form.loops, index) } as CandidateSpec['form'];
  return {
    ...c, form, dither: removed(c.dither, index),
    ...(c.bounds ? { bounds: { ...c.bounds, lo: removed(c.bounds.lo, index), hi: removed(c.bounds.hi, index) } } : {}),
    ...(c.rateLimit ? { rateLimit: { maxStep: removed(c.rateLimit.maxStep, index), previousAction: removed(c.rateLimit.previousAction, index) } } : {}),
  };
}
