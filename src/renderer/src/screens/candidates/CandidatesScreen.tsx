/** Step 2, the candidates: the policies to evaluate, drawn against the log and the fitted behaviour model. */
import { useState } from 'react';
import { SelectField } from '../../components/SelectField';
import { candidateColour } from '../../format/candidatePalette';
import { useDocument, useProblems, useSession } from '../../hooks';
import { useWorkspace } from '../../WorkspaceContext';
import { problemsUnder } from '../../document/projectProblems';
import { BehaviourModelPanel } from './BehaviourModelPanel';
import { CandidateChart } from './CandidateChart';
import { CandidateEditor } from './CandidateEditor';
import { candidateFromBehaviour, duplicateCandidate, plainCandidate } from './candidateDrafts';
import type { CandidateSpec } from '../../../../project/schema';
import type { BehaviourFit } from '../../../../shared/workerMessages';

export function CandidatesScreen(props: { onNext: () => void }) {
  const { documents } = useWorkspace();
  const doc = useDocument();
  const problems = useProblems();
  const mapProblems = problemsUnder(problems, 'retuneMaps');
  const importState = useSession().importState;
  const imported = importState.status === 'done' ? importState.result : null;
  const [axis, setAxis] = useState(0);
  const [action, setAction] = useState(0);
  const add = (label: string, make: () => CandidateSpec): void => documents.edit(label, (d) => ({ ...d, candidates: [...d.candidates, make()] }));
  const startFromBehaviour = (fit: BehaviourFit): void => {
    if (fit.ok) add('start a candidate from the present controller’s model', () => candidateFromBehaviour(doc, fit.model));
  };
  const ready = doc.columns.states.length > 0 && doc.columns.actions.length > 0;
  const shapesMatch = imported !== null && imported.stateNames.length === doc.columns.states.length && imported.actionNames.length === doc.columns.actions.length;
  return (
    <>
      <header>
        <h2>Candidates</h2>
        <p>
          Each candidate is a control policy for the setpoint or valve: its mean action is written as a P/PI loop, a schedule on one state, or an offset plus a gain on each state, with a small random
          dither around it (a Gaussian policy), and optionally actuator limits and a rate limit. Define as many as you want to compare; each is evaluated against the same log.
        </p>
      </header>
      {!ready && <p className="problems info">Give columns the roles “state” and “action” on the Plant log step first.</p>}
      {ready && (
        <>
          {doc.candidates.map((_, i) => (
            <CandidateEditor key={i} doc={doc} imported={imported} index={i} problems={problems} colour={candidateColour(i)}
              onDuplicate={() => add('duplicate a candidate', () => duplicateCandidate(doc, doc.candidates[i]))} />
          ))}
          <p className="row">
            <button className="primary" onClick={() => add('add a candidate', () => plainCandidate(doc, imported))} data-testid="add-candidate">Add a candidate</button>
          </p>
          {mapProblems.length > 0 && (
            // A retune map names a candidate: renaming or removing it leaves the map pointing nowhere, which blocks a run.
            <div className="problems error" role="alert" data-testid="retune-map-problems">
              <p>The project’s retune maps no longer fit the candidates (a map names one by its name; the maps are written in the project file):</p>
              <ul>{mapProblems.map((p) => <li key={`${p.path}|${p.message}`}>{p.message}</li>)}</ul>
            </div>
          )}
          {imported && shapesMatch && (
            <div className="grid-2">
              <section className="panel" aria-labelledby="chart-heading">
                <h3 id="chart-heading">Mean action against the log</h3>
                <div className="row">
                  <SelectField label="State axis" value={String(Math.min(axis, doc.columns.states.length - 1))}
                    options={doc.columns.states.map((s, i) => ({ value: String(i), label: s.column }))} onChange={(v) => setAxis(Number(v))} />
                  {doc.columns.actions.length > 1 && (
                    <SelectField label="Action" value={String(Math.min(action, doc.columns.actions.length - 1))}
                      options={doc.columns.actions.map((a, i) => ({ value: String(i), label: a.column }))} onChange={(v) => setAction(Number(v))} />
                  )}
                </div>
                <CandidateChart doc={doc} imported={imported} axis={Math.min(axis, doc.columns.states.length - 1)} action={Math.min(action, doc.columns.actions.length - 1)} />
                <p className="small muted">Lines: each candidate’s expected action (within its actuator limits) and the present controller’s model (dashed, within the limits the log shows), the other states held at their logged means. Points: an even sample of the logged steps.</p>
              </section>
              <BehaviourModelPanel doc={doc} behaviour={imported.behaviour}
                onStart={() => startFromBehaviour(imported.behaviour)} />
            </div>
          )}
        </>
      )}
      <button className="primary" onClick={props.onNext} disabled={doc.candidates.length === 0} data-testid="next-estimator">Next: method</button>
    </>
  );
}
