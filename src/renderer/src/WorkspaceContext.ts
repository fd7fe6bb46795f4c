/** The workspace for components: useWorkspace() inside <WorkspaceContext.Provider>. */
import { createContext, useContext } from 'react';
import type { Workspace } from './workspace';

export const WorkspaceContext = createContext<Workspace | null>(null);

export function useWorkspace(): Workspace {
  const workspace = useContext(WorkspaceContext);
  if (!workspace) throw new Error('useWorkspace: no WorkspaceContext.Provider above this component');
  return workspace;
}
