/**
 * Saving and opening through a scripted host API: a first save writes the data path absolute
 * (until the project's folder is known), then rewrites it relative to where the file went, with the
 * data file's fingerprint; a project file the program cannot read is reported and never becomes
 * the open project, so no later save can overwrite it.
 */
import { readFileSync } from 'node:fs';
import { resolve } from 'node:path';
import { describe, expect, it } from 'vitest';
import type { AppApi, SaveReply } from '../../../src/shared/appApi';
import type { WorkerResult } from '../../../src/shared/workerMessages';
import { createDocumentStore, isDirty } from '../../../src/renderer/src/document/documentStore';
import { assignRole } from '../../../src/renderer/src/document/columnRoles';
import { createProjectCommands } from '../../../src/renderer/src/files/projectCommands';
import { createDataLoading } from '../../../src/renderer/src/session/dataLoading';
import { importKey } from '../../../src/shared/runKey';
import { createSessionStore } from '../../../src/renderer/src/session/sessionStore';
import { createQuestionStore } from '../../../src/renderer/src/state/questionStore';
import type { EvaluationClient } from '../../../src/renderer/src/worker/evaluationClient';

const SAMPLE = readFileSync(resolve(__dirname, '../../../sample-projects/tank-levels/tank-levels.spcritic'), 'utf8');

function scriptedApi(saves: { text: string; path: string | null }[]): AppApi {
  const reply = (path: string): SaveReply => ({ saved: true, path });
  return {
    host: 'browser',
    chooseDataFile: async () => ({ path: '/data/plant/tanks.csv', relativePath: '/data/plant/tanks.csv', bytes: new Uint8Array([1]) }),
    saveProject: async (text: string, path: string | null) => (saves.push({ text, path }), reply(path ?? '/data/plant/reviews/tanks.spcritic')),
    saveProjectAs: async (text: string) => (saves.push({ text, path: null }), reply('/data/plant/reviews/tanks.spcritic')),
    discardRecovery: async () => undefined,
    recentProjects: async () => [],
    openProjectDialog: async () => ({ path: '/p/future.spcritic', text: JSON.stringify({ ...JSON.parse(SAMPLE), version: 99 }) }),
  } as unknown as AppApi;
}

const client = {
  call: async (call: string) => ({ kind: 'result', id: 1, ok: true, value: call === 'setData' ? { header: [], previewRows: [] } : {}, warnings: [] }) as unknown as WorkerResult,
  cancel: () => undefined,
  dispose: () => undefined,
} as unknown as EvaluationClient;

async function preparedWorkspace(saves: { text: string; path: string | null }[]) {
  const api = scriptedApi(saves);
  const documents = createDocumentStore();
  const session = createSessionStore();
  const data = createDataLoading(api, documents, session, client);
  const files = createProjectCommands({ api, documents, session, questions: createQuestionStore(), data });
  await data.chooseDataFile();
  const header = ['level_upper_m', 'level_lower_m', 'inflow_valve_pct', 'cost'];
  documents.edit('map', (d) => {
    let next = assignRole(assignRole(assignRole(assignRole(d, header, 'level_upper_m', 'state'), header, 'level_lower_m', 'state'), header, 'inflow_valve_pct', 'action'), header, 'cost', 'cost');
    next = { ...next, candidates: [{ name: 'A', description: '', form: { kind: 'affine', offset: [189], gain: [[-60, -90]] }, dither: [1.5] }] };
    return next;
  });
  const fingerprint = 'b'.repeat(64);
  session.set((s) => ({ ...s, importState: { status: 'done', key: importKey(documents.get().history.present, s.sourceVersion), result: { fingerprint, rowCount: 20_000 } as never, warnings: [] } }));
  return { documents, session, files, fingerprint };
}

describe('project commands', () => {
  it('writes the data path absolute first, then relative to the saved file, with the fingerprint', async () => {
    const saves: { text: string; path: string | null }[] = [];
    const { documents, files, fingerprint } = await preparedWorkspace(saves);
    await expect(files.save()).resolves.toBe(true);
    expect(saves.map((s) => JSON.parse(s.text).data.path)).toEqual(['/data/plant/tanks.csv', '../tanks.csv']);
    expect(saves[1].path).toBe('/data/plant/reviews/tanks.spcritic');
    expect(JSON.parse(saves[1].text).data).toMatchObject({ sha256: fingerprint, rowCount: 20_000 });
    expect(documents.get().history.present.data.path).toBe('../tanks.csv');
    expect(isDirty(documents.get())).toBe(false);
    documents.undo(); // the path fact holds in the history too: undoing the mapping keeps the relative path
    expect(documents.get().history.present.data.path).toBe('../tanks.csv');
  });

  it('refuses to save a document the schema does not accept, saying why', async () => {
    const saves: { text: string; path: string | null }[] = [];
    const { documents, session, files } = await preparedWorkspace(saves);
    documents.edit('bad dither', (d) => ({ ...d, candidates: [{ ...d.candidates[0], dither: [0] }] }));
    await expect(files.save()).resolves.toBe(false);
    expect(saves).toHaveLength(0);
    expect(session.get().notice?.problems[0].where).toBe('candidates.0.dither.0');
  });

  it('reports a project from a newer version and keeps the current project open', async () => {
    const saves: { text: string; path: string | null }[] = [];
    const { documents, session, files } = await preparedWorkspace(saves);
    await files.save();
    await files.openProject();
    expect(session.get().notice?.title).toContain('could not be opened');
    expect(session.get().notice?.problems[0].message).toContain('newer Setpoint Critic');
    expect(documents.get().projectPath).toBe('/data/plant/reviews/tanks.spcritic');
  });
});
