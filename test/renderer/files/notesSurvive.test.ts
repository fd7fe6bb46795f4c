/**
 * The app's open-then-save keeps what the user wrote in the free-form `notes` of a project file,
 * exactly: the document store holds the parsed document, and serialising it writes notes back.
 */
import { readFileSync } from 'node:fs';
import { resolve } from 'node:path';
import { expect, it } from 'vitest';
import type { AppApi } from '../../../src/shared/appApi';
import type { WorkerResult } from '../../../src/shared/workerMessages';
import { createDocumentStore } from '../../../src/renderer/src/document/documentStore';
import { createProjectCommands } from '../../../src/renderer/src/files/projectCommands';
import { createDataLoading } from '../../../src/renderer/src/session/dataLoading';
import { createSessionStore } from '../../../src/renderer/src/session/sessionStore';
import { createQuestionStore } from '../../../src/renderer/src/state/questionStore';
import type { EvaluationClient } from '../../../src/renderer/src/worker/evaluationClient';

const SAMPLE = JSON.parse(readFileSync(resolve(__dirname, '../../../sample-projects/tank-levels/tank-levels.spcritic'), 'utf8'));

it('notes survive opening a project and saving it again', async () => {
  const notes = { reviewedBy: 'A. Operator', comment: 'second tank retune only after the shutdown' };
  const saved: string[] = [];
  const api = {
    host: 'browser',
    openProjectDialog: async () => ({ path: '/p/tanks.spcritic', text: JSON.stringify({ ...SAMPLE, notes }) }),
    readProjectData: async () => { throw new Error('not needed here'); },
    saveProject: async (text: string, path: string | null) => (saved.push(text), { saved: true, path: path ?? '/p/tanks.spcritic' }),
    discardRecovery: async () => undefined,
    recentProjects: async () => [],
  } as unknown as AppApi;
  const client = { call: async () => ({ ok: true, value: {} }) as unknown as WorkerResult, cancel: () => undefined, dispose: () => undefined } as unknown as EvaluationClient;
  const documents = createDocumentStore(), session = createSessionStore();
  const files = createProjectCommands({ api, documents, session, questions: createQuestionStore(), data: createDataLoading(api, documents, session, client) });
  await files.openProject();
  documents.edit('rename', (d) => ({ ...d, name: `${d.name} (reviewed)` }));
  expect(await files.save()).toBe(true);
  expect(JSON.parse(saved.at(-1)!).notes).toEqual(notes);
});
