/**
 * New, open, open recent, save, save as and close, from the menu or from buttons. A file that is
 * not a readable project (corrupt, or from a newer version) is reported and left alone: it never
 * becomes the current project, so nothing can overwrite it. Unsaved changes are asked about first.
 */
import type { Problem } from '../../../core/result';
import { parseProjectText } from '../../../project/projectFile';
import type { ProjectDocument } from '../../../project/schema';
import type { AppApi, ProjectFileReply, SaveReply } from '../../../shared/appApi';
import { fileNameOf } from '../document/dataPath';
import { isDirty, serializedDocument, type DocumentStore } from '../document/documentStore';
import { newProjectDocument } from '../document/newProject';
import { projectProblems } from '../document/projectProblems';
import type { DataLoading } from '../session/dataLoading';
import { asProblems } from '../session/evaluationRunner';
import { emptySession, type Notice, type SessionStore } from '../session/sessionStore';
import type { QuestionStore } from '../state/questionStore';
import { documentAt, documentToWrite, suggestedFileName } from './saveDocument';
import { SAMPLE_PROJECTS } from '../help/sampleProjects';

export interface ProjectCommands {
  newProject(): Promise<void>;
  openProject(): Promise<void>;
  openRecent(path: string): Promise<void>;
  save(): Promise<boolean>;
  saveAs(): Promise<boolean>;
  close(): Promise<void>;
  /** Ask about unsaved changes; true when it is fine to go on. */
  confirmDiscard(): Promise<boolean>;
  refreshRecent(): Promise<void>;
  /** Open a bundled sample project as a new, unsaved project. */
  openSample(id: string): Promise<void>;
}

interface Deps {
  api: AppApi;
  documents: DocumentStore;
  session: SessionStore;
  questions: QuestionStore;
  data: DataLoading;
}

export function createProjectCommands({ api, documents, session, questions, data }: Deps): ProjectCommands {
  const notify = (notice: Notice): void => session.set((s) => ({ ...s, notice }));

  async function refreshRecent(): Promise<void> {
    const recentProjects = await api.recentProjects().catch(() => session.get().recentProjects);
    session.set((s) => ({ ...s, recentProjects }));
  }

  function reset(): void {
    documents.load(newProjectDocument(), null);
    session.set((s) => emptySession(s.recentProjects, s.sourceVersion));
  }

  async function openReply(reply: ProjectFileReply): Promise<void> {
    const loaded = parseProjectText(reply.text, fileNameOf(reply.path));
    if (!loaded.ok) {
      notify({ tone: 'error', title: `${fileNameOf(reply.path)} could not be opened; the file has not been changed`, problems: loaded.problems });
      return;
    }
    const { document, fromVersion } = loaded.value;
    const migrated = fromVersion < document.version;
    // A migrated document differs from its file until saved in the current format.
    documents.load(document, reply.path, !migrated);
    session.set((s) => emptySession(s.recentProjects, s.sourceVersion));
    if (migrated) notify({ tone: 'info', title: `Opened a project of format version ${fromVersion}; saving writes version ${document.version}`, problems: [] });
    void refreshRecent();
    await data.readProjectData(reply.path);
  }

  /** A sample's data lives inside the app: before the project is saved, write a copy where the user says. */
  async function placeSampleData(): Promise<boolean> {
    const source = session.get().source;
    if (source.kind !== 'sample') return true;
    const written = await api.exportFile('csv', source.fileName, source.bytes);
    if (!written) return false;
    session.set((s) => ({ ...s, source: { kind: 'file', absolutePath: written.path, bytes: source.bytes } }));
    documents.amendAll((d) => ({ ...d, data: { ...d.data, path: written.path } }));
    return true;
  }

  async function write(save: (text: string) => Promise<SaveReply>, pathKnown: boolean): Promise<boolean> {
    if (!(await placeSampleData())) return false;
    const doc = documents.get().history.present;
    const state = session.get();
    const problems = [...(state.source.kind === 'dropped' ? [DROPPED_FILE] : []), ...asProblems(projectProblems(doc))];
    if (problems.length > 0) {
      notify({ tone: 'error', title: 'The project cannot be saved yet', problems });
      return false;
    }
    const first = documentToWrite(doc, state, pathKnown);
    const reply = await save(serializedDocument(first));
    if (!reply.saved) {
      if (reply.reason === 'error') notify({ tone: 'error', title: 'The project was not saved', problems: [{ where: 'saving', message: reply.message }] });
      return false;
    }
    return settle(doc, first, reply.path);
  }

  /** After the first write: make the data path relative to where the file went, and record the save. */
  async function settle(edited: ProjectDocument, written: ProjectDocument, path: string): Promise<boolean> {
    let final = written;
    const relative = documentAt(written, session.get(), path);
    if (relative.data.path !== written.data.path) {
      const again = await api.saveProject(serializedDocument(relative), path, suggestedFileName(relative));
      if (again.saved) final = relative;
    }
    const oldPath = edited.data.path;
    documents.amendAll((d) => (d.data.path === oldPath ? { ...d, data: { ...d.data, path: final.data.path, sha256: final.data.sha256, rowCount: final.data.rowCount } } : d));
    documents.markSaved(path);
    session.set((s) => ({ ...s, notice: null }));
    await api.discardRecovery().catch(() => undefined);
    void refreshRecent();
    return true;
  }

  async function confirmDiscard(): Promise<boolean> {
    const state = documents.get();
    if (!isDirty(state)) return true;
    const answer = await questions.ask({
      title: 'Unsaved changes',
      body: `“${state.history.present.name}” has changes that are not saved. Save them first?`,
      choices: [{ id: 'save', label: 'Save', primary: true }, { id: 'discard', label: 'Don’t save' }, { id: 'cancel', label: 'Cancel' }],
      dismiss: 'cancel',
    });
    if (answer === 'cancel') return false;
    return answer === 'discard' ? true : commands.save();
  }

  const commands: ProjectCommands = {
    async newProject() {
      if (await confirmDiscard()) reset();
    },
    async openProject() {
      if (!(await confirmDiscard())) return;
      const reply = await api.openProjectDialog();
      if (reply) await openReply(reply);
    },
    async openRecent(path) {
      if (!(await confirmDiscard())) return;
      try {
        await openReply(await api.openRecentProject(path));
      } catch (e) {
        notify({ tone: 'error', title: `${fileNameOf(path)} could not be opened`, problems: [{ where: path, message: (e as Error).message }] });
        void refreshRecent();
      }
    },
    save() {
      const { projectPath } = documents.get();
      return write((text) => api.saveProject(text, projectPath, suggestedFileName(documents.get().history.present)), projectPath !== null);
    },
    saveAs() {
      return write((text) => api.saveProjectAs(text, suggestedFileName(documents.get().history.present)), false);
    },
    async close() {
      if (await confirmDiscard()) reset();
    },
    confirmDiscard,
    refreshRecent,
    async openSample(id) {
      const sample = SAMPLE_PROJECTS.find((s) => s.id === id);
      if (!sample || !(await confirmDiscard())) return;
      const loaded = parseProjectText(sample.projectText, sample.projectFile);
      if (!loaded.ok) {
        notify({ tone: 'error', title: `The sample ${sample.title} could not be opened`, problems: loaded.problems });
        return;
      }
      documents.load(loaded.value.document, null, false);
      session.set((s) => emptySession(s.recentProjects, s.sourceVersion));
      const bytes = new Uint8Array(await (await fetch(sample.csvUrl)).arrayBuffer());
      await data.useSampleData(bytes, sample.csvFile);
    },
  };
  return commands;
}

const DROPPED_FILE: Problem = {
  where: 'data',
  message: 'the data file was dropped onto the window, so the project does not know where it lives; choose it with “Choose CSV file…” on the Plant log step, then save',
};
