/**
 * A candidate's rate limit: per action the largest step per sample (blank = none), applied as a
 * clip around the previous action, and the state that carries the previous action.
 */
import { NumberField } from '../../components/NumberField';
import { SelectField } from '../../components/SelectField';
import { problemAt, type FieldProblem } from '../../document/projectProblems';
import type { ProjectDocument } from '../../../../project/schema';
import { useWorkspace } from '../../WorkspaceContext';
import { previousActionState, withRateLimit } from './formDrafts';

const NONE = '\u0000none';

export function RateLimitEditor({ doc, index, problems }: { doc: ProjectDocument; index: number; problems: readonly FieldProblem[] }) {
  const { documents } = useWorkspace();
  const candidate = doc.candidates[index];
  const path = `candidates.${index}.rateLimit`;
  const rate = candidate.rateLimit;
  const stateOptions = doc.columns.states.map((s) => ({ value: s.column, label: s.unit ? `${s.column} (${s.unit})` : s.column }));
  const set = (label: string, a: number, change: { maxStep?: number | null; previousAction?: string | null }, key: string): void =>
    documents.edit(`${label} of ${candidate.name}`, (d) => ({
      ...d, candidates: d.candidates.map((c, i) => (i === index ? withRateLimit(c, d, a, change) : c)),
    }), `${path}.${key}`);
  return (
    <fieldset>
      <legend>Rate limit</legend>
      <p className="small muted">|output − previous output| ≤ the largest step, per sample; the output is clipped to that band around the previous action.</p>
      {doc.columns.actions.map((action, a) => {
        const step = rate?.maxStep[a] ?? null;
        const previous = rate?.previousAction[a] ?? null;
        const unit = action.unit || 'units';
        const of = doc.columns.actions.length > 1 ? ` of ${action.column}` : '';
        return (
          <div key={action.column}>
            <div className="row">
              <NumberField label={`Largest step${of} per sample (${unit})`} value={step} allowBlank placeholder="none"
                help="Blank: no rate limit." message={problemAt(problems, `${path}.maxStep.${a}`)}
                onCommit={(v) => set('set the rate limit', a, { maxStep: v }, `maxStep.${a}`)} onBlur={documents.closeStep} />
              <SelectField label={`Previous-action state${of}`} value={previous ?? NONE} message={problemAt(problems, `${path}.previousAction.${a}`)}
                options={[{ value: NONE, label: 'Not chosen' }, ...stateOptions]}
                help={`The state holding ${action.column} one sample earlier.`}
                onChange={(v) => set('choose the previous-action state', a, { previousAction: v === NONE ? null : v }, `previousAction.${a}`)} />
            </div>
            {step !== null && previousActionState(doc, action.column) === null && (
              <p className="small muted" data-testid="previous-action-hint">
                This project has no previous value of {action.column}: add one in the project file under columns.derived
                (kind “previous”, source “{action.column}”) and give it the role “state”.
              </p>
            )}
          </div>
        );
      })}
      {['', '.maxStep', '.previousAction'].map((k) => problemAt(problems, `${path}${k}`)).filter(Boolean).map((m) => (
        <p key={m} className="error-text" role="alert">{m}</p>
      ))}
    </fieldset>
  );
}
