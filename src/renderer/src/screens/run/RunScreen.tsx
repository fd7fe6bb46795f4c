/**
 * Step 4, the run: what will be evaluated, the button that starts it, its progress (candidate,
 * iteration, Bellman residual, time remaining) and Cancel. The fit runs in the worker, so the
 * screen stays responsive throughout.
 */
import { useMemo } from 'react';
import { ProblemList } from '../../components/ProblemList';
import { projectProblems } from '../../document/projectProblems';
import { formatDuration, formatNumber, screenMessage } from '../../format/numberFormat';
import { useDocument, useSession, useStale } from '../../hooks';
import { importKey } from '../../../../shared/runKey';
import { runBlockers } from '../../session/evaluationRunner';
import { useWorkspace } from '../../WorkspaceContext';
import { progressView } from './runProgressView';
import { describeApproximator } from '../../../../pipeline/plan/approximatorLabel';
import { progressText } from '../../../../core/shareText';
import { discountWithHorizon } from '../estimator/discountHorizon';
import type { Evaluation } from '../../../../pipeline/estimates';

export function RunScreen(props: { onFindings: () => void }) {
  const { runner } = useWorkspace();
  const doc = useDocument();
  const session = useSession();
  const stale = useStale();
  const blockers = useMemo(() => runBlockers(session, projectProblems(doc), importKey(doc, session.sourceVersion)), [doc, session]);
  const running = session.run.status === 'running';
  const periodSeconds = session.importState.status === 'done' ? session.importState.result.summary.samplingPeriodSeconds : null;
  return (
    <>
      <header>
        <h2>Run</h2>
        <p>Fit Q for every candidate and compute its value. The fit runs in the background; you can look at other steps meanwhile, or cancel it.</p>
      </header>
      <section className="panel" aria-labelledby="plan-heading">
        <h3 id="plan-heading">What will run</h3>
        <dl className="facts">
          <dt>Candidates</dt><dd>{doc.candidates.map((c) => c.name).join(', ') || '—'}</dd>
          <dt>Approximator</dt><dd>{describeApproximator(doc.approximator)}</dd>
          <dt>Discount factor γ</dt><dd data-testid="run-discount">{discountWithHorizon(doc.discount, periodSeconds)}</dd>
          <dt>Seed</dt><dd>{doc.seed}</dd>
        </dl>
        {blockers && !running && <ProblemList title="Before it can run" problems={blockers} tone="info" testId="run-blockers" />}
        <div className="row">
          <button className="primary" onClick={() => void runner.run()} disabled={blockers !== null} data-testid="run-evaluation">
            {session.evaluation ? 'Run again' : 'Run the evaluation'}
          </button>
          <button onClick={runner.cancel} disabled={!running} data-testid="cancel-evaluation">Cancel</button>
        </div>
      </section>
      {session.run.status === 'running' && <Progress reports={session.run.progress} startsMs={session.run.startsMs} />}
      {session.run.status === 'cancelled' && <p className="problems warning" role="status" data-testid="run-cancelled">The run was cancelled; no results were kept.</p>}
      {session.run.status === 'failed' && <ProblemList title="The evaluation did not finish" problems={session.run.problems} testId="run-problems" />}
      {session.evaluation && session.run.status !== 'running' && (
        <section className="panel" aria-labelledby="done-heading" data-testid="run-finished">
          <h3 id="done-heading">{stale ? 'Results of an earlier run (settings or data have changed since)' : 'Finished'}</h3>
          <ul>
            {session.evaluation.evaluation.policies.map((p) => <li key={p.name}>{p.name}: {screenMessage(p.message)}</li>)}
          </ul>
          {polynomialPartLine(session.evaluation.evaluation) && <p className="small" data-testid="run-polynomial-part">{polynomialPartLine(session.evaluation.evaluation)}</p>}
          <button className="primary" onClick={props.onFindings} data-testid="see-findings">See the findings</button>
        </section>
      )}
    </>
  );
}

/** The network's polynomial part as the fits used it, said once: not where the fits' messages already end with it (networkFqe.ts). */
function polynomialPartLine(evaluation: Evaluation): string | null {
  const reason = evaluation.settings.polynomialPart?.reason;
  return reason && !evaluation.policies.some((p) => p.message.includes(reason)) ? reason : null;
}

function Progress({ reports, startsMs }: { reports: Parameters<typeof progressView>[0]; startsMs: number[] }) {
  const view = progressView(reports, startsMs);
  return (
    <section className="panel" aria-labelledby="progress-heading" data-testid="run-progress">
      <h3 id="progress-heading">Running…</h3>
      <div className="progress" role="progressbar" aria-valuemin={0} aria-valuemax={100} aria-valuenow={Math.round((view?.fraction ?? 0) * 100)} aria-label="Evaluation progress">
        <div style={{ width: `${(view?.fraction ?? 0) * 100}%` }} />
      </div>
      {view ? (
        <dl className="facts" aria-live="polite">
          <dt>Candidate</dt><dd>{view.candidate} ({view.candidateNumber} of {view.candidateCount})</dd>
          <dt>Iteration</dt><dd data-testid="progress-iteration">{view.iteration !== null && view.member ? `${view.iteration} (${view.member})` : view.iteration ?? (view.dataPass === null ? 'starting' : `reading the data (${progressText(view.dataPass)})`)}</dd>
          {view.bellmanResidual !== null && <><dt title="How far Q is from its own one-step target r + γV(s′) on the logged steps (the Bellman residual)">One-step mismatch</dt><dd>{formatNumber(view.bellmanResidual)}</dd></>}
          {view.weightChange !== null && <><dt title="Relative change of the fitted weights in the last iteration">Weight change</dt><dd>{formatNumber(view.weightChange)}</dd></>}
          <dt>Elapsed</dt><dd>{formatDuration(view.elapsedMs)}</dd>
          <dt>Time remaining</dt><dd>{view.remainingMs === null ? 'estimating…' : `about ${formatDuration(view.remainingMs)}`}</dd>
        </dl>
      ) : <p>Importing the data and preparing the fit…</p>}
    </section>
  );
}
