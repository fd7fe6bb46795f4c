/**
 * Getting the data file's bytes into the worker: picked in a dialog, dropped on the window, read
 * from the path an opened project names, or pointed to again after it moved. Each way records in
 * the document where the file is (relative to the project once that has a path) and in the session
 * what the worker made of the first lines.
 */
import type { AppApi } from '../../../shared/appApi';
import type { DocumentStore } from '../document/documentStore';
import type { EvaluationClient } from '../worker/evaluationClient';
import type { DataSource, SessionStore } from './sessionStore';
import { fileNameOf } from '../document/dataPath';

export interface DataLoading {
  chooseDataFile(): Promise<void>;
  dropDataFile(file: File): Promise<void>;
  relocateDataFile(): Promise<void>;
  /** Take a bundled sample's data (the document is already loaded). */
  useSampleData(bytes: Uint8Array, fileName: string): Promise<void>;
  /** Read the data an opened project names; false (and the reason in dataProblems) when it cannot. */
  readProjectData(projectPath: string): Promise<boolean>;
}

export function createDataLoading(api: AppApi, documents: DocumentStore, session: SessionStore, client: EvaluationClient): DataLoading {
  const document = () => documents.get().history.present;

  /** `sha256`: the bytes' SHA-256 where the main process read them (a dropped file or a sample has none). */
  async function accept(bytes: Uint8Array, source: DataSource, fileName: string, sha256?: string): Promise<void> {
    session.set((s) => ({ ...s, source, sourceVersion: s.sourceVersion + 1, inspection: null, dataProblems: [], dataMissing: false, importState: { status: 'idle' }, notice: null }));
    const version = session.get().sourceVersion;
    const result = await client.call('setData', { bytes, fileName, csv: document().data.csv, ...(sha256 ? { sha256 } : {}) });
    if (session.get().sourceVersion !== version) return; // another file arrived meanwhile
    session.set((s) => (result.ok ? { ...s, inspection: result.value } : { ...s, dataProblems: result.problems }));
  }

  function recordPath(label: string, path: string, keepFingerprint: boolean): void {
    documents.edit(label, (doc) => ({
      ...doc,
      data: keepFingerprint ? { ...doc.data, path } : { ...doc.data, path, sha256: undefined, rowCount: undefined },
    }));
  }

  return {
    async chooseDataFile() {
      const reply = await api.chooseDataFile(documents.get().projectPath);
      if (!reply) return;
      recordPath('choose the data file', reply.relativePath, false);
      await accept(reply.bytes, { kind: 'file', absolutePath: reply.path, bytes: reply.bytes }, reply.relativePath, reply.sha256);
    },
    async dropDataFile(file) {
      const bytes = new Uint8Array(await file.arrayBuffer());
      recordPath('drop a data file', file.name, false);
      await accept(bytes, { kind: 'dropped', fileName: file.name, bytes }, file.name);
    },
    async useSampleData(bytes, fileName) {
      await accept(bytes, { kind: 'sample', fileName, bytes }, fileName);
    },
    async relocateDataFile() {
      const projectPath = documents.get().projectPath;
      const reply = projectPath ? await api.relocateDataFile(projectPath) : await api.chooseDataFile(null);
      if (!reply) return;
      // The saved fingerprint stays, so a file that is not the same one is reported as changed.
      recordPath('point to the moved data file', reply.relativePath, true);
      await accept(reply.bytes, { kind: 'file', absolutePath: reply.path, bytes: reply.bytes }, reply.relativePath, reply.sha256);
    },
    async readProjectData(projectPath) {
      const path = document().data.path;
      try {
        const reply = await api.readProjectData(projectPath, path);
        await accept(reply.bytes, { kind: 'file', absolutePath: reply.path, bytes: reply.bytes }, path, reply.sha256);
        return true;
      } catch (e) {
        const problem = {
          where: `${fileNameOf(projectPath)}, data.path`,
          message: `cannot read the data file "${path}" (${(e as Error).message}); it may have moved: point the project to its new location`,
        };
        // Opening a project shows the Plant log step, where this stands with its "Locate" button.
        session.set((s) => ({ ...s, dataProblems: [problem], dataMissing: true }));
        return false;
      }
    },
  };
}
