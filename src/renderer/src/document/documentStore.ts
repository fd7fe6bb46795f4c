/**
 * The one store for the open project document: its edit history, where it lives on disk, and the
 * text it had when last opened or saved (so "unsaved changes" means "differs from the file", and
 * undoing back to the saved state clears the marker).
 */
import { serializeProject } from '../../../project/projectFile';
import type { ProjectDocument } from '../../../project/schema';
import { createStore, type Store } from '../state/store';
import { applyEdit, closeStep, createHistory, mapHistory, redo, undo, type EditHistory } from './editHistory';
import { newProjectDocument } from './newProject';

export interface DocumentState {
  readonly history: EditHistory<ProjectDocument>;
  /** Absolute path of the project file; null until first saved. */
  readonly projectPath: string | null;
  /** Serialised document as last opened or saved (or as created). */
  readonly baselineText: string;
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
  /** Replace the document and forget its history (new, open, restore). */
  load(document: ProjectDocument, projectPath: string | null, baselineText?: string): void;
  /** The document was written to projectPath as text. */
  markSaved(projectPath: string, text: string): void;
  /** A fact that is not an edit (e.g. the data fingerprint), applied to every snapshot. */
  amendAll(recipe: DocumentRecipe): void;
}

export function currentDocument(state: DocumentState): ProjectDocument {
  return state.history.present;
}

// Serialising a document with kept results is not free: once per document object is enough.
const serialized = new WeakMap<ProjectDocument, string>();

/** The document as its file would hold it, computed once per document object. */
export function serializedDocument(document: ProjectDocument): string {
  let text = serialized.get(document);
  if (text === undefined) {
    text = serializeProject(document);
    serialized.set(document, text);
  }
  return text;
}

export function isDirty(state: DocumentState): boolean {
  return serializedDocument(state.history.present) !== state.baselineText;
}

function initialState(document: ProjectDocument, projectPath: string | null, baselineText: string, generation: number): DocumentState {
  return { history: createHistory(document), projectPath, baselineText, generation };
}

export function createDocumentStore(document: ProjectDocument = newProjectDocument()): DocumentStore {
  const store = createStore(initialState(document, null, serializeProject(document), 0));
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
    load: (doc, projectPath, baselineText = serializeProject(doc)) =>
      store.set((s) => initialState(doc, projectPath, baselineText, s.generation + 1)),
    markSaved: (projectPath, text) => store.set((s) => ({ ...s, projectPath, baselineText: text })),
    amendAll: (recipe) => withHistory((h) => mapHistory(h, recipe)),
  };
}
