/** The top bar: project file commands, undo and redo, the theme, and the project's name and state. */
import { useCallback } from 'react';
import { useDirty, useDocumentState, useSession } from './hooks';
import { fileNameOf } from './document/dataPath';
import { redoLabel, undoLabel } from './document/editHistory';
import { useStore } from './state/useStore';
import { themeStore, toggleTheme, type Theme } from './theme';
import { useWorkspace } from './WorkspaceContext';

const same = (t: Theme) => t;

/** Keeps --toolbar-height on <html> equal to the toolbar's height, so the sticky step list sits under it. */
function useToolbarHeight(): (element: HTMLElement | null) => void {
  return useCallback((element: HTMLElement | null) => {
    if (!element || typeof ResizeObserver === 'undefined') return;
    const set = () => document.documentElement.style.setProperty('--toolbar-height', `${element.getBoundingClientRect().height}px`);
    set();
    new ResizeObserver(set).observe(element);
  }, []);
}

export function Toolbar({ onHelp }: { onHelp: () => void }) {
  const toolbarRef = useToolbarHeight();
  const { files, documents } = useWorkspace();
  const name = useDocumentState((s) => s.history.present.name);
  const path = useDocumentState((s) => s.projectPath);
  const undoText = useDocumentState((s) => undoLabel(s.history));
  const redoText = useDocumentState((s) => redoLabel(s.history));
  const dirty = useDirty();
  const recent = useSession().recentProjects;
  const theme = useStore(themeStore, same);
  const shownName = `${name}${dirty ? ' • unsaved changes' : ''}`;
  return (
    <header className="toolbar" ref={toolbarRef}>
      <h1 className="title">Setpoint Critic</h1>
      {/* Cut with an ellipsis where the window is narrow: the tooltip gives the whole name, then the file. */}
      <span className="project-name" data-testid="project-title" title={`${shownName}\n${path ?? 'not saved yet'}`}>{shownName}</span>
      <span className="spacer" />
      <div className="group" role="group" aria-label="Project file">
        <button onClick={() => void files.newProject()} data-testid="new-project">New</button>
        <button onClick={() => void files.openProject()} data-testid="open-project">Open…</button>
        <label className="sr-only" htmlFor="recent-projects">Open a recent project</label>
        <select
          id="recent-projects" value="" disabled={recent.length === 0} data-testid="recent-projects"
          onChange={(e) => e.target.value && void files.openRecent(e.target.value)}
        >
          <option value="">{recent.length === 0 ? 'No recent projects' : 'Open recent…'}</option>
          {recent.map((p) => <option key={p} value={p} title={p}>{fileNameOf(p)}</option>)}
        </select>
        <button onClick={() => void files.save()} data-testid="save-project">Save</button>
        <button onClick={() => void files.saveAs()} data-testid="save-project-as">Save as…</button>
        <button onClick={() => void files.close()} data-testid="close-project">Close</button>
      </div>
      <div className="group" role="group" aria-label="Edit">
        <button onClick={documents.undo} disabled={!undoText} title={undoText ? `Undo ${undoText} (Ctrl+Z)` : 'Nothing to undo'} data-testid="undo">Undo</button>
        <button onClick={documents.redo} disabled={!redoText} title={redoText ? `Redo ${redoText} (Ctrl+Y or Ctrl+Shift+Z)` : 'Nothing to redo'} data-testid="redo">Redo</button>
      </div>
      <button onClick={onHelp} data-testid="open-help" title="Steps, sample projects and the glossary (F1)">Help</button>
      <button onClick={toggleTheme} aria-pressed={theme === 'dark'} data-testid="toggle-theme" title="Switch between light and dark">
        {theme === 'dark' ? 'Light theme' : 'Dark theme'}
      </button>
    </header>
  );
}
