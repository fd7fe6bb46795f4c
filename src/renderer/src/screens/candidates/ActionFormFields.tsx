/**
 * The fields of one action column's part of a candidate's form: the affine offset and gains, the
 * PI loop (bias and feedback), or the schedule (table and optional trim). Edits go through the one
 * project store, keyed by field so typing in one field makes one undo step.
 */
import { NumberField } from '../../components/NumberField';
import { problemAt, type FieldProblem } from '../../document/projectProblems';
import type { CandidateSpec, ProjectDocument } from '../../../../project/schema';
import type { DataImport } from '../../../../shared/workerMessages';
import { useWorkspace } from '../../WorkspaceContext';
import { FeedbackFields } from './FeedbackFields';
import { ScheduleFields } from './ScheduleFields';
import type { PiLoop, ScheduleLoop } from './formDrafts';

type Update = (label: string, f: (c: CandidateSpec) => CandidateSpec, key: string) => void;

interface Props {
  doc: ProjectDocument;
  imported: DataImport | null;
  index: number;
  action: number;
  problems: readonly FieldProblem[];
  update: Update;
}

export function ActionFormFields({ doc, imported, index, action: a, problems, update }: Props) {
  const { documents } = useWorkspace();
  const form = doc.candidates[index].form;
  const path = `candidates.${index}.form`;
  const unit = doc.columns.actions[a]?.unit || 'action units';
  const setAt = (list: number[], k: number, v: number): number[] => list.map((x, i) => (i === k ? v : x));
  const piLoop = (f: (loop: PiLoop) => PiLoop) => (c: CandidateSpec): CandidateSpec =>
    (c.form.kind === 'pi' ? { ...c, form: { ...c.form, loops: c.form.loops.map((l, j) => (j === a ? f(l) : l)) } } : c);
  const scheduleLoop = (f: (loop: ScheduleLoop) => ScheduleLoop) => (c: CandidateSpec): CandidateSpec =>
    (c.form.kind === 'schedule' ? { ...c, form: { ...c.form, loops: c.form.loops.map((l, j) => (j === a ? f(l) : l)) } } : c);
  if (form.kind === 'affine') {
    const withAffine = (f: (form: Extract<CandidateSpec['form'], { kind: 'affine' }>) => CandidateSpec['form']) => (c: CandidateSpec): CandidateSpec =>
      (c.form.kind === 'affine' ? { ...c, form: f(c.form) } : c);
    return (
      <div className="row">
        <NumberField label={`Offset (${unit})`} value={form.offset[a] ?? null} message={problemAt(problems, `${path}.offset.${a}`)}
          onCommit={(v) => v !== null && update('set the offset', withAffine((f) => ({ ...f, offset: setAt(f.offset, a, v) })), `form.offset.${a}`)} onBlur={documents.closeStep} />
        {doc.columns.states.map((state, s) => (
          <NumberField key={state.column} label={`Gain on ${state.column} (${unit} per ${state.unit || 'unit'})`} value={form.gain[a]?.[s] ?? null}
            message={problemAt(problems, `${path}.gain.${a}.${s}`)}
            onCommit={(v) => v !== null && update('set a gain', withAffine((f) => ({ ...f, gain: f.gain.map((row, i) => (i === a ? setAt(row, s, v) : row)) })), `form.gain.${a}.${s}`)}
            onBlur={documents.closeStep} />
        ))}
      </div>
    );
  }
  const loopPath = `${path}.loops.${a}`;
  if (form.kind === 'pi') {
    const loop = form.loops[a];
    if (!loop) return <p className="error-text">No loop for this action yet; switch the form to start one.</p>;
    return (
      <FeedbackFields doc={doc} path={loopPath} action={a} loop={loop} problems={problems}
        edit={(label, f, key) => update(label, piLoop((l) => f(l)), `form.loops.${a}.${key}`)}
        leading={
          <NumberField label={`Bias (${unit})`} value={loop.bias} message={problemAt(problems, `${loopPath}.bias`)}
            help="The output at zero error and zero integral, e.g. the opening that holds the setpoint."
            onCommit={(v) => v !== null && update('set the bias', piLoop((l) => ({ ...l, bias: v })), `form.loops.${a}.bias`)} onBlur={documents.closeStep} />
        } />
    );
  }
  const loop = form.loops[a];
  if (!loop) return <p className="error-text">No schedule for this action yet; switch the form to start one.</p>;
  return (
    <ScheduleFields doc={doc} imported={imported} path={loopPath} action={a} loop={loop} problems={problems}
      edit={(label, f, key) => update(label, scheduleLoop(f), `form.loops.${a}.${key}`)} />
  );
}
