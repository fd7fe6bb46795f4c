/**
 * A candidate's rate limit: per action the largest step per sample (blank = none), applied as a
 * clip around the previous action, and the state that carries the previous action.
 */
import { useState } from 'react';
import { NumberField } from '../../components/NumberField';
import { SelectField } from '../../components/SelectField';
import { problemAt, type FieldProblem } from '../../document/projectProblems';
import type { ProjectDocument } from '../../../../project/schema';
import { useWorkspace } from '../../WorkspaceContext';
import { previousActionState, withoutRateLimit, withRateLimit } from './formDrafts';

const NONE = '\u0000none';

export function RateLimitEditor({ doc, index, problems }: { doc: ProjectDocument; index: number; problems: readonly FieldProblem[] }) {
  const { documents } = useWorkspace();
  const candidate = doc.candidates[index];
  const path = `candidates.${index}.rateLimit`;
  const rate = candidate.rateLimit;
  // Open while the engineer is writing one; a rate limit with no step and no state is not kept in the document.
  const [open, setOpen] = useState(rate !== undefined);
  const shown = open || rate !== undefined;
  const stateOptions = doc.columns.states.map((s) => ({ value: s.column, label: s.unit ? `${s.column} (${s.unit})` : s.column }));
  const set = (label: string, a: number, change: { maxStep?: number | null; previousAction?: string | null }, key: string): void =>
    documents.edit(`${label} of ${candidate.name}`, (d) => ({
      ...d, candidates: d.candidates.map((c, i) => (i === index ? withRateLimit(c, d, a, change) : c)),
    }), `${path}.${key}`);
  return (
    <fieldset>
      <legend>Rate limit</legend>
      <label className="choice">
        <input type="checkbox" checked={shown} onChange={(e) => {
          setOpen(e.target.checked);
          if (!e.target.checked && rate) {
            documents.edit(`remove the rate limit of ${candidate.name}`, (d) => ({
              ...d, candidates: d.candidates.map((c, i) => (i === index ? withoutRateLimit(c) : c)),
            }));
          }
        }} />
        The output may move only so far per sample
      </label>
      {shown && <p className="small muted">|output − previous output| ≤ the largest step, per sample; the output is clipped to that band around the previous action.</p>}
      {shown && doc.columns.actions.map((action, a) => {
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
