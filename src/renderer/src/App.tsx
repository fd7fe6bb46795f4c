/**
 * The app shell: toolbar, notices, the step list and the current step's screen, and the dialog
 * host. Menu commands and keyboard shortcuts arrive here and go to the workspace's commands.
 */
import { startTransition, useCallback, useEffect, useRef, useState } from 'react';
import type { MenuCommand, MenuCommandDetail } from '../../shared/appApi';
import { keyCommand } from './commandKeys';
import { DialogHost } from './components/DialogHost';
import { useDocument, useDocumentState, useProblems, useSession, useStale } from './hooks';
import { NoticeBanner } from './NoticeBanner';
import { CandidatesScreen } from './screens/candidates/CandidatesScreen';
import { EstimatorScreen } from './screens/estimator/EstimatorScreen';
import { FindingsScreen } from './screens/findings/FindingsScreen';
import { PlantLogScreen } from './screens/plantLog/PlantLogScreen';
import { RunScreen } from './screens/run/RunScreen';
import { StepNav } from './StepNav';
import { stepStatuses, type StepId } from './steps';
import { toggleTheme } from './theme';
import { Toolbar } from './Toolbar';
import { reportCommand, type ReportAction } from './files/reportCommands';
import { HelpPanel } from './help/HelpPanel';
import { useWorkspace } from './WorkspaceContext';
import type { Workspace } from './workspace';

export function App() {
  const workspace = useWorkspace();
  const [step, setStep] = useState<StepId>('plant-log');
  const [helpOpen, setHelpOpen] = useState(false);
  const screen = useRef<HTMLElement>(null);
  const doc = useDocument();
  const session = useSession();
  const problems = useProblems();
  const stale = useStale();
  const statuses = stepStatuses(doc, session, problems, stale);

  const command = useCallback((c: MenuCommand, detail?: MenuCommandDetail): void => {
    const { files, documents, runner } = workspace;
    const actions: Record<MenuCommand, () => unknown> = {
      'new-project': files.newProject, 'open-project': files.openProject, 'save-project': files.save,
      'open-recent-project': () => detail && files.openRecent(detail.path),
      'save-project-as': files.saveAs, 'close-project': files.close, undo: documents.undo, redo: documents.redo,
      'toggle-theme': toggleTheme, 'run-evaluation': () => { setStep('run'); return runner.run(); }, 'cancel-evaluation': runner.cancel,
      'print-report': () => reportFromMenu('print', workspace), 'save-report-pdf': () => reportFromMenu('pdf', workspace),
    };
    void actions[c]();
  }, [workspace]);

  useEffect(() => workspace.api.onMenuCommand(command), [workspace, command]);
  // Another document (new, opened, restored) starts at the first step.
  const generation = useDocumentState((s) => s.generation);
  useEffect(() => setStep('plant-log'), [generation]);
  useEffect(() => {
    const onKey = (e: KeyboardEvent): void => {
      if (e.key === 'F1') {
        e.preventDefault();
        setHelpOpen(true);
        return;
      }
      if (e.key === 'Escape') setHelpOpen(false);
      const found = keyCommand(e, workspace.api.host);
      if (!found) return;
      e.preventDefault();
      if (found.kind === 'step') startTransition(() => setStep(found.step));
      else command(found.command);
    };
    window.addEventListener('keydown', onKey);
    return () => window.removeEventListener('keydown', onKey);
  }, [workspace, command]);

  // A step's screen can be large (Findings after a run): rendered as a transition, React yields to
  // input and painting every few milliseconds instead of building it in one long task.
  const go = (id: StepId): void => startTransition(() => setStep(id));
  return (
    <div className="app">
      <Toolbar onHelp={() => setHelpOpen((open) => !open)} />
      <NoticeBanner />
      <div className="body">
        <StepNav current={step} statuses={statuses} onSelect={go} />
        <main className="screen" id="screen" role="tabpanel" aria-labelledby={`tab-${step}`} ref={screen} tabIndex={-1}>
          {step === 'plant-log' && <PlantLogScreen onNext={() => go('candidates')} />}
          {step === 'candidates' && <CandidatesScreen onNext={() => go('estimator')} />}
          {step === 'estimator' && <EstimatorScreen onNext={() => go('run')} />}
          {step === 'run' && <RunScreen onFindings={() => go('findings')} />}
          {step === 'findings' && <FindingsScreen />}
        </main>
      </div>
      {helpOpen && <HelpPanel onClose={() => setHelpOpen(false)} />}
      <DialogHost questions={workspace.questions} />
    </div>
  );
}

/** The menu's report commands: the outcome (or why there is no report yet) as the session's notice. */
async function reportFromMenu(action: ReportAction, workspace: Workspace): Promise<void> {
  const outcome = await reportCommand(action, workspace.api, workspace.documents, workspace.session);
  if (outcome) workspace.session.set((s) => ({ ...s, notice: { tone: outcome.tone === 'error' ? 'warning' : 'info', title: outcome.text, problems: [] } }));
}
