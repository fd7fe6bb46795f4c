/**
 * The app's parts, made once and wired together: the document store, the session, the worker
 * client and the commands over them. Components reach it through WorkspaceContext and call its
 * commands; the rules live in the modules it composes.
 */
import type { AppApi } from '../../shared/appApi';
import { createDocumentStore, type DocumentStore } from './document/documentStore';
import { syncDocumentState } from './files/documentTitle';
import { createProjectCommands, type ProjectCommands } from './files/projectCommands';
import { offerRecovery, startRecoveryAutosave } from './files/recovery';
import { startAutoImport } from './session/autoImport';
import { startResultsKeeping } from './session/savedResults';
import { createAssessmentRunner, type AssessmentRunner } from './session/assessmentRunner';
import { createDataLoading, type DataLoading } from './session/dataLoading';
import { createEvaluationRunner, type EvaluationRunner } from './session/evaluationRunner';
import { createRetuneMapRunner, type RetuneMapRunner } from './session/retuneMapRunner';
import { createSessionStore, type SessionStore } from './session/sessionStore';
import { createQuestionStore, type QuestionStore } from './state/questionStore';
import { createEvaluationClient, type EvaluationClient } from './worker/evaluationClient';

export interface Workspace {
  api: AppApi;
  documents: DocumentStore;
  session: SessionStore;
  questions: QuestionStore;
  client: EvaluationClient;
  data: DataLoading;
  files: ProjectCommands;
  runner: EvaluationRunner;
  assessor: AssessmentRunner;
  mapper: RetuneMapRunner;
  /** Start the background duties (title, autosave, imports, recovery offer); returns the stop function. */
  start(): () => void;
}

export function createWorkspace(api: AppApi, client: EvaluationClient = createEvaluationClient()): Workspace {
  const documents = createDocumentStore();
  const session = createSessionStore();
  const questions = createQuestionStore();
  const data = createDataLoading(api, documents, session, client);
  const files = createProjectCommands({ api, documents, session, questions, data });
  const assessor = createAssessmentRunner(session, client);
  const mapper = createRetuneMapRunner(session, client);
  // A new run stops the assessment and any maps in progress first (both extend the run it replaces).
  const runner = createEvaluationRunner(documents, session, client, { assess: assessor.assess, cancel: () => { assessor.cancel(); mapper.cancel(); } });
  return {
    api, documents, session, questions, client, data, files, runner, assessor, mapper,
    start() {
      const stops = [syncDocumentState(api, documents), startRecoveryAutosave(api, documents), startAutoImport(documents, session, client), startResultsKeeping(documents, session)];
      void files.refreshRecent();
      void offerRecovery({ api, documents, session, questions, data });
      return () => stops.forEach((stop) => stop());
    },
  };
}
