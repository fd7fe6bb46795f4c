/**
 * One candidate policy π(a|s) = N(μ(s), dither²), optionally limited by actuator bounds (clip or
 * truncate) and a rate limit. The mean μ is written in one of three forms, chosen here: P/PI on a
 * setpoint error, a schedule on one state with an optional trim, or affine in the states.
 * Switching form keeps the name, dither and limits. Each field shows its own validation message;
 * what no field shows is listed below in words.
 */
import { NumberField } from '../../components/NumberField';
import { SelectField } from '../../components/SelectField';
import { TextField } from '../../components/TextField';
import { RichText } from '../../components/RichText';
import { problemAt, problemsUnder, type FieldProblem } from '../../document/projectProblems';
import type { CandidateSpec, ProjectDocument } from '../../../../project/schema';
import type { DataImport } from '../../../../shared/workerMessages';
import { useWorkspace } from '../../WorkspaceContext';
import { ActionFormFields } from './ActionFormFields';
import { BoundsEditor } from './BoundsEditor';
import { problemPlace, shownBesideField } from './candidateProblemPlaces';
import { withFormKind, type FormKind } from './formDrafts';
import { RateLimitEditor } from './RateLimitEditor';

interface Props {
  doc: ProjectDocument;
  imported: DataImport | null;
  index: number;
  problems: readonly FieldProblem[];
  colour: string;
  onDuplicate: () => void;
}

const FORMS: readonly { value: FormKind; label: string }[] = [
  { value: 'pi', label: 'P / PI loop' },
  { value: 'schedule', label: 'Schedule (+ P/PI trim)' },
  { value: 'affine', label: 'Affine in the states' },
];

/** What each form means, in one line (RichText markup: K_{c} is K with a subscript c). */
export const FORM_MEANING: Record<FormKind, string> = {
  pi: 'output = bias ± K_{c}·(setpoint − measurement) ± K_{c}/T_{i}·∫(setpoint − measurement) dt; + for reverse action, − for direct.',
  schedule: 'output = the scheduled value at the input (straight lines between breakpoints, flat beyond the ends) + an optional P/PI trim on a setpoint error.',
  affine: 'output = offset + Σ gain × state, in the units of the action and state columns.',
};

export function CandidateEditor({ doc, imported, index, problems, colour, onDuplicate }: Props) {
  const { documents } = useWorkspace();
  const candidate = doc.candidates[index];
  const path = `candidates.${index}`;
  const actions = doc.columns.actions;
  const update = (label: string, f: (c: CandidateSpec) => CandidateSpec, key: string): void =>
    documents.edit(`${label} of ${candidate.name}`, (d) => ({ ...d, candidates: d.candidates.map((c, i) => (i === index ? f(c) : c)) }), `${path}.${key}`);
  const setAt = (list: number[], k: number, v: number): number[] => list.map((x, i) => (i === k ? v : x));
  const unit = (a: number): string => actions[a].unit || 'action units';
  const generalProblems = problemsUnder(problems, path)
    .map((p) => ({ ...p, relative: p.path.slice(path.length + 1) }))
    .filter((p) => !shownBesideField(p.relative));
  const kind = candidate.form.kind;
  return (
    <article className="panel candidate" style={{ borderLeftColor: colour }} aria-label={`Candidate ${candidate.name}`} data-testid={`candidate-${index}`}>
      <div className="row">
        <TextField label="Name" value={candidate.name} className="name-field" message={problemAt(problems, `${path}.name`)} onChange={(name) => update('rename', (c) => ({ ...c, name }), 'name')} onBlur={documents.closeStep} />
        <TextField label="Description" value={candidate.description} className="wide prose" multiline onChange={(description) => update('describe', (c) => ({ ...c, description }), 'description')} onBlur={documents.closeStep} />
      </div>
      <div className="row form-choice">
        <SelectField<FormKind> label="Form" value={kind} options={FORMS} testId={`candidate-form-${index}`}
          onChange={(next) => documents.edit(`change the form of ${candidate.name}`, (d) => ({
            ...d, candidates: d.candidates.map((c, i) => (i === index ? withFormKind(c, next, d, imported) : c)),
          }))} />
        <p className="small form-meaning" data-testid={`candidate-form-meaning-${index}`}><RichText text={FORM_MEANING[kind]} /></p>
      </div>
      {actions.map((action, a) => (
        <fieldset key={action.column}>
          <legend>{action.column}{action.unit ? ` (${action.unit})` : ''}</legend>
          <ActionFormFields doc={doc} imported={imported} index={index} action={a} problems={problems} update={update} />
          <div className="row">
            <NumberField
              label={`Dither, standard deviation (${unit(a)})`} value={candidate.dither[a] ?? null} message={problemAt(problems, `${path}.dither.${a}`)}
              help="How far the action wanders around its mean (one standard deviation of a Gaussian); above 0."
              onCommit={(v) => v !== null && update('set the dither', (c) => ({ ...c, dither: setAt(c.dither, a, v) }), `dither.${a}`)} onBlur={documents.closeStep}
            />
          </div>
        </fieldset>
      ))}
      <BoundsEditor doc={doc} index={index} problems={problems} />
      <RateLimitEditor doc={doc} index={index} problems={problems} />
      {generalProblems.map((p) => (
        <p key={p.path + p.message} className="error-text" role="alert">{problemPlace(p.relative, actions.map((x) => x.column))}: {p.message}</p>
      ))}
      <div className="row">
        <button onClick={onDuplicate}>Duplicate candidate</button>
        <button className="danger" data-testid={`remove-candidate-${index}`} onClick={() => documents.edit(`remove ${candidate.name}`, (d) => ({ ...d, candidates: d.candidates.filter((_, i) => i !== index) }))}>Remove candidate</button>
      </div>
    </article>
  );
}
