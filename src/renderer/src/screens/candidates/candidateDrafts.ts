/**
 * New candidates for the editor: a plain start (the logged mean action, no feedback, the logged
 * spread) or one copied from the fitted behaviour model, with names that do not clash.
 * Values copied from a fit are rounded to four significant digits, so the fields read as numbers
 * a person would type.
 */
import type { BehaviourModel } from '../../../../core/behaviourModel';
import type { CandidateSpec, ProjectDocument } from '../../../../project/schema';
import type { DataImport } from '../../../../shared/workerMessages';

export function roundSignificant(x: number, digits = 4): number {
  return x === 0 || !Number.isFinite(x) ? x : Number(x.toPrecision(digits));
}

export function uniqueName(doc: ProjectDocument, base: string): string {
  const taken = new Set(doc.candidates.map((c) => c.name));
  if (!taken.has(base)) return base;
  for (let k = 2; ; k++) if (!taken.has(`${base} ${k}`)) return `${base} ${k}`;
}

/** Logged mean action and spread per action from the import summary, or 0 and 1 without one. */
function loggedActions(doc: ProjectDocument, imported: DataImport | null): { mean: number[]; std: number[] } {
  const columns = imported?.summary.columns ?? [];
  const stat = (name: string) => columns.find((c) => c.name === name);
  return {
    mean: doc.columns.actions.map((a) => roundSignificant(stat(a.column)?.mean ?? 0)),
    std: doc.columns.actions.map((a) => roundSignificant(stat(a.column)?.std || 1)),
  };
}

export function plainCandidate(doc: ProjectDocument, imported: DataImport | null): CandidateSpec {
  const { mean, std } = loggedActions(doc, imported);
  return {
    name: uniqueName(doc, `Candidate ${doc.candidates.length + 1}`),
    description: '',
    form: { kind: 'affine', offset: mean, gain: doc.columns.actions.map(() => doc.columns.states.map(() => 0)) },
    dither: std,
  };
}

export function candidateFromBehaviour(doc: ProjectDocument, model: BehaviourModel): CandidateSpec {
  return {
    name: uniqueName(doc, 'Like the logged controller'),
    description: 'Started from the behaviour model fitted to the log.',
    form: { kind: 'affine', offset: model.offset.map((v) => roundSignificant(v)), gain: model.gain.map((row) => row.map((v) => roundSignificant(v))) },
    dither: model.std.map((v) => roundSignificant(v)),
  };
}

export function duplicateCandidate(doc: ProjectDocument, candidate: CandidateSpec): CandidateSpec {
  return { ...structuredClone(candidate), name: uniqueName(doc, `${candidate.name} (copy)`) };
}
