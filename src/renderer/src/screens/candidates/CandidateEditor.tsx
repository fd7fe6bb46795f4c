/**
 * One candidate policy π(a|s) = N(offset + gain·s, std²), optionally limited by actuator bounds
 * that clip the action or truncate its distribution. Each field shows its own validation message.
 */
import { NumberField } from '../../components/NumberField';
import { TextField } from '../../components/TextField';
import { problemAt, problemsUnder, type FieldProblem } from '../../document/projectProblems';
import type { CandidateSpec, ProjectDocument } from '../../../../project/schema';
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
  const unit = (a: number): string => actions[a].unit || 'action units';
  const generalProblems = problemsUnder(problems, path).filter((p) => !/\.(name|offset|gain|std|bounds)(\.|$)/.test(p.path.slice(path.length)));
  return (
    <article className="panel candidate" style={{ borderLeftColor: colour }} aria-label={`Candidate ${candidate.name}`} data-testid={`candidate-${index}`}>
      <div className="row">
        <TextField label="Name" value={candidate.name} message={problemAt(problems, `${path}.name`)} onChange={(name) => update('rename', (c) => ({ ...c, name }), 'name')} onBlur={documents.closeStep} />
        <TextField label="Description" value={candidate.description} className="wide" onChange={(description) => update('describe', (c) => ({ ...c, description }), 'description')} onBlur={documents.closeStep} />
      </div>
      {actions.map((action, a) => (
        <fieldset key={action.column}>
          <legend>{action.column}: mean μ = offset + Σ gain × state, with a dither around it</legend>
          <div className="row">
            <NumberField
              label={`Offset (${unit(a)})`} value={candidate.offset[a] ?? null} message={problemAt(problems, `${path}.offset.${a}`)}
              onCommit={(v) => v !== null && update('set the offset', (c) => ({ ...c, offset: setAt(c.offset, a, v) }), `offset.${a}`)} onBlur={documents.closeStep}
            />
            {states.map((state, s) => (
              <NumberField
                key={state.column} label={`Gain on ${state.column} (${unit(a)} per ${state.unit || 'unit'})`} value={candidate.gain[a]?.[s] ?? null}
                message={problemAt(problems, `${path}.gain.${a}.${s}`)}
                onCommit={(v) => v !== null && update('set a gain', (c) => ({ ...c, gain: c.gain.map((row, i) => (i === a ? setAt(row, s, v) : row)) }), `gain.${a}.${s}`)}
                onBlur={documents.closeStep}
              />
            ))}
            <NumberField
              label={`Dither, standard deviation (${unit(a)})`} value={candidate.std[a] ?? null} message={problemAt(problems, `${path}.std.${a}`)}
              help="How far the action wanders around its mean (one standard deviation of a Gaussian); above 0."
              onCommit={(v) => v !== null && update('set the standard deviation', (c) => ({ ...c, std: setAt(c.std, a, v) }), `std.${a}`)} onBlur={documents.closeStep}
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
