/**
 * The renderer's entry: the preload API (window.setpointCritic), the workspace over it, and the
 * app. Without a host API (the page opened on its own) a short explanation is shown instead.
 */
import { StrictMode } from 'react';
import { createRoot } from 'react-dom/client';
import { App } from './App';
import { applyTheme, themeStore } from './theme';
import { createWorkspace } from './workspace';
import { WorkspaceContext } from './WorkspaceContext';
import './app.css';

applyTheme(themeStore.get());
const root = document.getElementById('root');
const api = window.setpointCritic;
if (root && api) {
  const workspace = createWorkspace(api);
  workspace.start();
  createRoot(root).render(
    <StrictMode>
      <WorkspaceContext.Provider value={workspace}><App /></WorkspaceContext.Provider>
    </StrictMode>,
  );
} else if (root) {
  createRoot(root).render(
    <main className="screen">
      <h1>Setpoint Critic</h1>
      <p>This page runs inside the Setpoint Critic desktop app, which gives it access to project and data files. Start the app with <code>npm start</code>.</p>
    </main>,
  );
}
