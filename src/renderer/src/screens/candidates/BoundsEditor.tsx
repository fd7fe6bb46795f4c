/** A candidate's actuator limits: per action a lower and an upper limit (blank = none), and clip or truncate. */
import { NumberField } from '../../components/NumberField';
import { SelectField } from '../../components/SelectField';
import { problemAt, type FieldProblem } from '../../document/projectProblems';
import type { CandidateSpec, ProjectDocument } from '../../../../project/schema';
import { useWorkspace } from '../../WorkspaceContext';

export function BoundsEditor({ doc, index, problems }: { doc: ProjectDocument; index: number; problems: readonly FieldProblem[] }) {
  const { documents } = useWorkspace();
  const candidate = doc.candidates[index];
  const path = `candidates.${index}.bounds`;
  const actions = doc.columns.actions;
  const update = (label: string, f: (c: CandidateSpec) => CandidateSpec, key?: string): void =>
    documents.edit(`${label} of ${candidate.name}`, (d) => ({ ...d, candidates: d.candidates.map((c, i) => (i === index ? f(c) : c)) }), key && `${path}.${key}`);
  const bounds = candidate.bounds;
  const toggle = (on: boolean): void => update(on ? 'add actuator limits' : 'remove the actuator limits', (c) => ({
    ...c, bounds: on ? { lo: actions.map(() => null), hi: actions.map(() => null), mode: 'clip' } : undefined,
  }));
  const setLimit = (side: 'lo' | 'hi', a: number, v: number | null): void => update('set a limit', (c) => ({
    ...c, bounds: c.bounds && { ...c.bounds, [side]: c.bounds[side].map((x, i) => (i === a ? v : x)) },
  }), `${side}.${a}`);
  return (
    <fieldset>
      <legend>Actuator limits</legend>
      <label className="choice">
        <input type="checkbox" checked={bounds !== undefined} onChange={(e) => toggle(e.target.checked)} />
        The actuator has limits
      </label>
      {bounds && (
        <div className="row">
          {actions.map((action, a) => (
            <div className="row" key={action.column}>
              <NumberField label={`Lowest ${action.column} (${action.unit || 'units'})`} value={bounds.lo[a] ?? null} allowBlank placeholder="none"
                message={problemAt(problems, `${path}.lo.${a}`)} onCommit={(v) => setLimit('lo', a, v)} onBlur={documents.closeStep} />
              <NumberField label={`Highest ${action.column} (${action.unit || 'units'})`} value={bounds.hi[a] ?? null} allowBlank placeholder="none"
                message={problemAt(problems, `${path}.hi.${a}`)} onCommit={(v) => setLimit('hi', a, v)} onBlur={documents.closeStep} />
            </div>
          ))}
          <ModeSelect value={bounds.mode} onChange={(mode) => update('change the limit mode', (c) => ({ ...c, bounds: c.bounds && { ...c.bounds, mode } }))} />
        </div>
      )}
      {problemAt(problems, path) && <p className="error-text">{problemAt(problems, path)}</p>}
    </fieldset>
  );
}

function ModeSelect(props: { value: 'clip' | 'truncate'; onChange: (mode: 'clip' | 'truncate') => void }) {
  return (
    <SelectField
      label="At a limit" value={props.value} onChange={props.onChange}
      options={[{ value: 'clip', label: 'Clip (action sits at the limit)' }, { value: 'truncate', label: 'Truncate (distribution cut and renormalised)' }]}
      help="Clip: the valve stops at its end. Truncate: the policy never asks beyond the limit."
    />
  );
}
