/** Reading the workspace's stores in components. Selectors return stored values, never new objects. */
import { useMemo } from 'react';
import type { ProjectDocument } from '../../project/schema';
import { isDirty, type DocumentState } from './document/documentStore';
import { projectProblems, type FieldProblem } from './document/projectProblems';
import { runKey } from '../../shared/runKey';
import type { SessionState } from './session/sessionStore';
import { useStore } from './state/useStore';
import { useWorkspace } from './WorkspaceContext';

const presentOf = (s: DocumentState): ProjectDocument => s.history.present;
const sessionOf = (s: SessionState): SessionState => s;

export function useDocument(): ProjectDocument {
  return useStore(useWorkspace().documents, presentOf);
}

export function useDocumentState<S>(select: (state: DocumentState) => S): S {
  return useStore(useWorkspace().documents, select);
}

export function useDirty(): boolean {
  return useStore(useWorkspace().documents, isDirty);
}

export function useSession(): SessionState {
  return useStore(useWorkspace().session, sessionOf);
}

export function useProblems(): FieldProblem[] {
  const doc = useDocument();
  return useMemo(() => projectProblems(doc), [doc]);
}

/** True when the last evaluation was made with other settings or data than the document has now. */
export function useStale(): boolean {
  const doc = useDocument();
  const session = useSession();
  return useMemo(() => {
    if (!session.evaluation) return false;
    const fingerprint = session.importState.status === 'done' ? session.importState.result.fingerprint : '';
    return session.evaluation.runKey !== runKey(doc, fingerprint);
  }, [doc, session.evaluation, session.importState]);
}
