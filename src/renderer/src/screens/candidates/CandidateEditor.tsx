/**
 * One candidate policy π(a|s) = N(μ(s), dither²), optionally limited by actuator bounds that clip
 * the action or truncate its distribution. The affine form μ = offset + gain·s is edited here; a
 * P/PI or schedule form is shown in words (its editor is still to come) and its dither and limits
 * are edited as for any form. Each field shows its own validation message.
 */
import { NumberField } from '../../components/NumberField';
import { TextField } from '../../components/TextField';
import { problemAt, problemsUnder, type FieldProblem } from '../../document/projectProblems';
import type { CandidateSpec, ProjectDocument } from '../../../../project/schema';
import { summariseCandidate } from '../../../../project/candidateSummary';
import { useWorkspace } from '../../WorkspaceContext';
import { BoundsEditor } from './BoundsEditor';

interface Props {
  doc: ProjectDocument;
  index: number;
  problems: readonly FieldProblem[];
  colour: string;
  onDuplicate: () => void;
}

export function CandidateEditor({ doc, index, problems, colour, onDuplicate }: Props) {
  const { documents } = useWorkspace();
  const candidate = doc.candidates[index];
  const path = `candidates.${index}`;
  const { states, actions } = doc.columns;
  const update = (label: string, f: (c: CandidateSpec) => CandidateSpec, key: string): void =>
    documents.edit(`${label} of ${candidate.name}`, (d) => ({ ...d, candidates: d.candidates.map((c, i) => (i === index ? f(c) : c)) }), `${path}.${key}`);
  const setAt = (list: number[], k: number, v: number): number[] => list.map((x, i) => (i === k ? v : x));
  type Affine = Extract<CandidateSpec['form'], { kind: 'affine' }>;
  const affine = candidate.form.kind === 'affine' ? candidate.form : null;
  const withAffine = (c: CandidateSpec, f: (form: Affine) => Affine): CandidateSpec => (c.form.kind === 'affine' ? { ...c, form: f(c.form) } : c);
  const unit = (a: number): string => actions[a].unit || 'action units';
  const generalProblems = problemsUnder(problems, path).filter((p) => !/\.(name|form\.offset|form\.gain|dither|bounds)(\.|$)/.test(p.path.slice(path.length)));
  return (
    <article className="panel candidate" style={{ borderLeftColor: colour }} aria-label={`Candidate ${candidate.name}`} data-testid={`candidate-${index}`}>
      <div className="row">
        <TextField label="Name" value={candidate.name} message={problemAt(problems, `${path}.name`)} onChange={(name) => update('rename', (c) => ({ ...c, name }), 'name')} onBlur={documents.closeStep} />
        <TextField label="Description" value={candidate.description} className="wide" onChange={(description) => update('describe', (c) => ({ ...c, description }), 'description')} onBlur={documents.closeStep} />
      </div>
      {affine ? null : <p className="small">{summariseCandidate(candidate, doc.columns).mean.join('; ')}. This form is edited in the project file for now.</p>}
      {actions.map((action, a) => (
        <fieldset key={action.column}>
          <legend>{affine ? <>{action.column}: mean μ = offset + Σ gain × state, with a dither around it</> : <>{action.column}: dither around the mean of the form above</>}</legend>
          <div className="row">
            {affine ? (
              <NumberField
                label={`Offset (${unit(a)})`} value={affine.offset[a] ?? null} message={problemAt(problems, `${path}.form.offset.${a}`)}
                onCommit={(v) => v !== null && update('set the offset', (c) => withAffine(c, (f) => ({ ...f, offset: setAt(f.offset, a, v) })), `form.offset.${a}`)} onBlur={documents.closeStep}
              />
            ) : null}
            {affine ? states.map((state, s) => (
              <NumberField
                key={state.column} label={`Gain on ${state.column} (${unit(a)} per ${state.unit || 'unit'})`} value={affine.gain[a]?.[s] ?? null}
                message={problemAt(problems, `${path}.form.gain.${a}.${s}`)}
                onCommit={(v) => v !== null && update('set a gain', (c) => withAffine(c, (f) => ({ ...f, gain: f.gain.map((row, i) => (i === a ? setAt(row, s, v) : row)) })), `form.gain.${a}.${s}`)}
                onBlur={documents.closeStep}
              />
            )) : null}
            <NumberField
              label={`Dither, standard deviation (${unit(a)})`} value={candidate.dither[a] ?? null} message={problemAt(problems, `${path}.dither.${a}`)}
              help="How far the action wanders around its mean (one standard deviation of a Gaussian); above 0."
              onCommit={(v) => v !== null && update('set the dither', (c) => ({ ...c, dither: setAt(c.dither, a, v) }), `dither.${a}`)} onBlur={documents.closeStep}
            />
          </div>
        </fieldset>
      ))}
      <BoundsEditor doc={doc} index={index} problems={problems} />
      {generalProblems.map((p) => <p key={p.path + p.message} className="error-text">{p.path}: {p.message}</p>)}
      <div className="row">
        <button onClick={onDuplicate}>Duplicate</button>
        <button className="danger" onClick={() => documents.edit(`remove ${candidate.name}`, (d) => ({ ...d, candidates: d.candidates.filter((_, i) => i !== index) }))}>Remove</button>
      </div>
    </article>
  );
}
