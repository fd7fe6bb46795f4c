/**
 * The workflow's steps, in order, and what each still needs. The step list shows the need under
 * each step's name, so a new user can see where to go next without a manual.
 */
import type { FieldProblem } from './document/projectProblems';
import { rolesComplete } from './session/autoImport';
import type { SessionState } from './session/sessionStore';
import type { ProjectDocument } from '../../project/schema';

export type StepId = 'plant-log' | 'candidates' | 'estimator' | 'run' | 'findings';

export interface StepDefinition {
  id: StepId;
  title: string;
  /** What the step is for, in a line. */
  purpose: string;
}

export const STEPS: readonly StepDefinition[] = [
  { id: 'plant-log', title: 'Plant log', purpose: 'The logged data: which file, and what each column is.' },
  { id: 'candidates', title: 'Candidates', purpose: 'The setpoint policies to evaluate.' },
  { id: 'estimator', title: 'Method', purpose: 'How the values are estimated from the log: discount, approximator of Q, intervals.' },
  { id: 'run', title: 'Run', purpose: 'Fit every candidate and watch the progress.' },
  { id: 'findings', title: 'Findings', purpose: 'Values, surfaces, slices and exports.' },
];

export interface StepStatus {
  done: boolean;
  /** What the step still needs, or what it holds once done. */
  status: string;
}

const ESTIMATOR_FIELDS = ['discount', 'approximator', 'quadratureNodes', 'seed', 'startStates', 'surface'];

export function stepStatuses(doc: ProjectDocument, session: SessionState, problems: readonly FieldProblem[], stale: boolean): Record<StepId, StepStatus> {
  const imported = session.importState;
  const plantLog: StepStatus = session.dataProblems.length > 0 ? { done: false, status: 'The data file could not be read' }
    : session.source.kind === 'none' ? { done: false, status: 'Needs a data file (CSV)' }
      : !rolesComplete(doc) ? { done: false, status: 'Needs column roles: a state, an action and a reward or cost' }
        : imported.status === 'failed' ? { done: false, status: 'The import found problems' }
          : imported.status === 'done' ? { done: true, status: `${imported.result.summary.transitionCount.toLocaleString('en-US')} transitions` }
            : { done: false, status: 'Importing…' };
  const candidateProblems = problems.filter((p) => p.path.startsWith('candidates'));
  const candidates: StepStatus = doc.candidates.length === 0 ? { done: false, status: 'Needs at least one candidate' }
    : candidateProblems.length > 0 ? { done: false, status: `${candidateProblems.length} field${candidateProblems.length === 1 ? '' : 's'} to fix` }
      : { done: true, status: `${doc.candidates.length} candidate${doc.candidates.length === 1 ? '' : 's'}` };
  const estimatorProblems = problems.filter((p) => ESTIMATOR_FIELDS.some((f) => p.path === f || p.path.startsWith(`${f}.`)));
  const estimator: StepStatus = estimatorProblems.length > 0 ? { done: false, status: `${estimatorProblems.length} setting${estimatorProblems.length === 1 ? '' : 's'} to fix` }
    : { done: true, status: doc.approximator.kind === 'linear' ? 'Linear in features' : 'Neural network' };
  const run: StepStatus = session.run.status === 'running' ? { done: false, status: 'Running…' }
    : session.evaluation && !stale ? { done: true, status: 'Finished' }
      : plantLog.done && candidates.done && estimator.done ? { done: false, status: stale ? 'Settings changed: run again' : 'Ready to run' }
        : { done: false, status: 'Needs the steps above' };
  const findings: StepStatus = session.evaluation ? { done: !stale, status: stale ? 'From an earlier run' : 'Results ready' } : { done: false, status: 'Needs a finished run' };
  return { 'plant-log': plantLog, candidates, estimator, run, findings };
}
