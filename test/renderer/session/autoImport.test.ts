/**
 * Imports follow the document (src/renderer/src/session/autoImport.ts) against a scripted worker
 * client whose answers arrive when the test says. The worker hears a stop message only at the
 * import's next block of records, so the stopped import's "cancelled" answer can arrive after a
 * newer import of the same settings was asked for (the roles made incomplete and then restored, as
 * an undo does): that late answer belongs to the old request and must not decide what the Plant log
 * step shows.
 */
import { readFileSync } from 'node:fs';
import { resolve } from 'node:path';
import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import { parseProjectText } from '../../../src/project/projectFile';
import { createDocumentStore } from '../../../src/renderer/src/document/documentStore';
import { IMPORT_PAUSE_MS, headerLookDue, startAutoImport } from '../../../src/renderer/src/session/autoImport';
import { createSessionStore } from '../../../src/renderer/src/session/sessionStore';
import { CANCELLED, type EvaluationClient } from '../../../src/renderer/src/worker/evaluationClient';
import type { WorkerResult } from '../../../src/shared/workerMessages';

const folder = resolve(__dirname, '../../../sample-projects/tank-levels');
const loaded = parseProjectText(readFileSync(resolve(folder, 'tank-levels.spcritic'), 'utf8'), 'tank-levels.spcritic');
if (!loaded.ok) throw new Error('sample project does not load');
const project = loaded.value.document;

/** A client whose importData answers wait in `answers` (in the order asked) until the test resolves them. */
function scriptedClient(): { client: EvaluationClient; answers: ((r: WorkerResult) => void)[]; calls: string[] } {
  const answers: ((r: WorkerResult) => void)[] = [], calls: string[] = [];
  const client: EvaluationClient = {
    call(call) {
      calls.push(call);
      if (call !== 'importData') return Promise.resolve({ kind: 'result', id: 0, ok: true, value: call === 'inspect' ? {} : null, warnings: [] } as never);
      return new Promise((r) => { answers.push(r as (r: WorkerResult) => void); });
    },
    cancel() {},
    dispose() {},
  };
  return { client, answers, calls };
}

describe('imports that follow the document', () => {
  beforeEach(() => { vi.useFakeTimers(); });
  afterEach(() => { vi.useRealTimers(); });

  it('shows the newer import when the stopped one’s late "cancelled" answer arrives after it was asked for', async () => {
    const documents = createDocumentStore(project), session = createSessionStore(), s = scriptedClient();
    const stop = startAutoImport(documents, session, s.client);
    session.set((x) => ({ ...x, source: { kind: 'sample', fileName: 'tank-levels.csv', bytes: new Uint8Array(1) }, inspection: {} as never }));
    await vi.advanceTimersByTimeAsync(IMPORT_PAUSE_MS);
    expect(s.answers).toHaveLength(1);
    documents.edit('remove actions', (d) => ({ ...d, columns: { ...d.columns, actions: [] } }));
    expect(s.calls).toContain('stopImport');
    expect(session.get().importState.status).toBe('idle');
    documents.undo();
    await vi.advanceTimersByTimeAsync(IMPORT_PAUSE_MS);
    expect(s.answers).toHaveLength(2);
    s.answers[0]({ kind: 'result', id: 1, ok: false, problems: [{ ...CANCELLED }] }); // heard late, at its next block
    await vi.advanceTimersByTimeAsync(0);
    expect(session.get().importState.status).toBe('importing');
    const value = { fingerprint: 'f', episodeReport: [], leftOutLines: { start: 0, count: 0 }, timeWindows: [], runsLeftOut: [] } as never;
    s.answers[1]({ kind: 'result', id: 2, ok: true, value, warnings: [] });
    await vi.advanceTimersByTimeAsync(0);
    const state = session.get().importState;
    expect(state.status).toBe('done');
    if (state.status === 'done') expect(state.result).toBe(value);
    stop();
  });

  // A reason is a note (shared/runKey.ts): no import is asked for, the last one's report takes it.
  it('a reason edited after an import asks for no import and puts the new reason in the last import\'s report; a new `to` imports again', async () => {
    const withRange = { ...project, data: { ...project.data, csv: { ...project.data.csv, excludedRuns: [{ from: '1', to: '15', reason: 'before the retune' }] } } };
    const documents = createDocumentStore(withRange), session = createSessionStore(), s = scriptedClient();
    const stop = startAutoImport(documents, session, s.client);
    session.set((x) => ({ ...x, source: { kind: 'sample', fileName: 'tank-levels.csv', bytes: new Uint8Array(1) }, inspection: {} as never }));
    await vi.advanceTimersByTimeAsync(IMPORT_PAUSE_MS);
    const said = 'Runs left out by label (column run): 15 runs and 7,500 rows in all; 15 runs, "1" to "15", 7,500 rows: before the retune.';
    const value = {
      fingerprint: 'f', episodeReport: ['Delimiter: ",".', said], leftOutLines: { start: 1, count: 1 }, timeWindows: [],
      runsLeftOut: [{ from: '1', to: '15', reason: 'before the retune', runs: 15, rows: 7500 }],
    } as never;
    s.answers[0]({ kind: 'result', id: 1, ok: true, value, warnings: [] });
    await vi.advanceTimersByTimeAsync(0);
    const edit = (range: { from: string; to: string; reason: string }) => documents.edit('edit', (d) => ({ ...d, data: { ...d.data, csv: { ...d.data.csv, excludedRuns: [range] } } }));
    edit({ from: '1', to: '15', reason: 'a valve trim under test' });
    await vi.advanceTimersByTimeAsync(IMPORT_PAUSE_MS);
    expect(s.answers).toHaveLength(1);
    expect(s.calls).not.toContain('inspect'); // nor is the header read again
    const state = session.get().importState;
    expect(state.status).toBe('done');
    if (state.status === 'done') {
      expect(state.result.runsLeftOut[0].reason).toBe('a valve trim under test');
      expect(state.result.episodeReport).toEqual(['Delimiter: ",".', said.replace('before the retune', 'a valve trim under test')]);
    }
    edit({ from: '1', to: '16', reason: 'a valve trim under test' });
    await vi.advanceTimersByTimeAsync(IMPORT_PAUSE_MS);
    expect(s.answers).toHaveLength(2);
    stop();
  });

  it('reads the header again only for new CSV settings on the same bytes (new bytes come with their own first look)', () => {
    const last = { version: 3, csv: '{"delimiter":";"}' };
    expect(headerLookDue(last, { version: 3, csv: '{"delimiter":","}' })).toBe(true);
    expect(headerLookDue(last, { version: 3, csv: last.csv })).toBe(false); // a reason edited: csvAsData blanks it, the same settings
    expect(headerLookDue(last, { version: 4, csv: '{"delimiter":","}' })).toBe(false);
  });
});
