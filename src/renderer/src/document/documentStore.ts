/**
 * The one store for the open project document: its edit history, where it lives on disk, and the
 * text it had when last opened or saved (so "unsaved changes" means "differs from the file", and
 * undoing back to the saved state clears the marker).
 */
import type { ProjectDocument, SavedResults } from '../../../project/schema';
import { createStore, type Store } from '../state/store';
import { applyEdit, closeStep, createHistory, mapHistory, redo, undo, type EditHistory } from './editHistory';
import { newProjectDocument } from './newProject';
import { settingsText } from './documentText';

export { serializedDocument } from './documentText';

/** What the document was when last opened or saved: its settings' text and its kept results (by identity). */
export interface Baseline {
  readonly settingsText: string;
  readonly results: SavedResults | undefined;
}

export interface DocumentState {
  readonly history: EditHistory<ProjectDocument>;
  /** Absolute path of the project file; null until first saved. */
  readonly projectPath: string | null;
  /** The document as last opened or saved (or as created); null for work never saved (restored, migrated). */
  readonly baseline: Baseline | null;
  /** Increments whenever a different document is loaded, so screens can reset local state. */
  readonly generation: number;
}

export type DocumentRecipe = (document: ProjectDocument) => ProjectDocument;

export interface DocumentStore extends Store<DocumentState> {
  /** One user edit, with its undo label; edits with the same coalesceKey merge until closeStep. */
  edit(label: string, recipe: DocumentRecipe, coalesceKey?: string): void;
  closeStep(): void;
  undo(): void;
  redo(): void;
  /** Replace the document and forget its history (new, open, restore); saved=false marks it as unsaved work. */
  load(document: ProjectDocument, projectPath: string | null, saved?: boolean): void;
  /** The present document was written to projectPath. */
  markSaved(projectPath: string): void;
  /** A fact that is not an edit (e.g. the data fingerprint), applied to every snapshot. */
  amendAll(recipe: DocumentRecipe): void;
}

export function currentDocument(state: DocumentState): ProjectDocument {
  return state.history.present;
}

const baselineOf = (document: ProjectDocument): Baseline => ({ settingsText: settingsText(document), results: document.results });

/**
 * Unsaved changes: the settings differ from the file's, or the results are not the ones it holds.
 * Comparing the settings' text, not the whole file's, keeps this cheap on every edit during a run.
 */
export function isDirty(state: DocumentState): boolean {
  const present = state.history.present, baseline = state.baseline;
  return baseline === null || present.results !== baseline.results || settingsText(present) !== baseline.settingsText;
}

function initialState(document: ProjectDocument, projectPath: string | null, saved: boolean, generation: number): DocumentState {
  return { history: createHistory(document), projectPath, baseline: saved ? baselineOf(document) : null, generation };
}

export function createDocumentStore(document: ProjectDocument = newProjectDocument()): DocumentStore {
  const store = createStore(initialState(document, null, true, 0));
  const withHistory = (f: (h: EditHistory<ProjectDocument>) => EditHistory<ProjectDocument>) =>
    store.set((s) => {
      const history = f(s.history);
      return history === s.history ? s : { ...s, history };
    });
  return {
    ...store,
    edit: (label, recipe, coalesceKey) => withHistory((h) => applyEdit(h, recipe(h.present), label, coalesceKey ?? null)),
    closeStep: () => withHistory(closeStep),
    undo: () => withHistory(undo),
    redo: () => withHistory(redo),
    load: (doc, projectPath, saved = true) => store.set((s) => initialState(doc, projectPath, saved, s.generation + 1)),
    markSaved: (projectPath) => store.set((s) => ({ ...s, projectPath, baseline: baselineOf(s.history.present) })),
    amendAll: (recipe) => withHistory((h) => mapHistory(h, recipe)),
  };
}
