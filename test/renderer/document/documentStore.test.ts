/** "Unsaved changes" means "differs from the file": undoing back to the saved state clears it. */
import { describe, expect, it } from 'vitest';
import { serializeProject } from '../../../src/project/projectFile';
import { createDocumentStore, isDirty, serializedDocument } from '../../../src/renderer/src/document/documentStore';

describe('document store', () => {
  it('is clean when new, dirty after an edit, clean again after undo or save', () => {
    const store = createDocumentStore();
    expect(isDirty(store.get())).toBe(false);
    store.edit('rename', (d) => ({ ...d, name: 'Tanks' }));
    expect(isDirty(store.get())).toBe(true);
    store.undo();
    expect(isDirty(store.get())).toBe(false);
    store.redo();
    store.markSaved('/p/tanks.spcritic');
    expect(isDirty(store.get())).toBe(false);
    expect(store.get().projectPath).toBe('/p/tanks.spcritic');
  });

  it('is dirty when kept results change, and clean again once saved; an undo keeps the results', () => {
    const store = createDocumentStore();
    const results = { format: 1 as const, fingerprint: 'a'.repeat(64), savedAt: '2025-01-15T10:00:00.000Z', evaluation: { policies: [] } };
    store.edit('rename', (d) => ({ ...d, name: 'Tanks' }));
    store.markSaved('/p/tanks.spcritic');
    store.amendAll((d) => ({ ...d, results }));
    expect(isDirty(store.get())).toBe(true);
    store.markSaved('/p/tanks.spcritic');
    expect(isDirty(store.get())).toBe(false);
    store.undo();
    expect(store.get().history.present.results).toBe(results);
    expect(isDirty(store.get())).toBe(true); // the name is back to its old value
  });

  it('writes serializeProject’s exact text, with the results spliced in', () => {
    const store = createDocumentStore();
    const results = { format: 1 as const, fingerprint: 'b'.repeat(64), savedAt: '2025-01-15T10:00:00.000Z', evaluation: { policies: [{ name: 'a', surface: { x: [1, 2.5], values: [null, -3] } }] }, assessment: { notes: ['x\ny'] } };
    store.amendAll((d) => ({ ...d, results }));
    const doc = store.get().history.present;
    expect(serializedDocument(doc)).toBe(serializeProject(doc));
    const without = { ...doc, results: undefined };
    expect(serializedDocument(without)).toBe(serializeProject(without));
  });

  it('starts a new generation, and forgets the history, when another document is loaded', () => {
    const store = createDocumentStore();
    store.edit('rename', (d) => ({ ...d, name: 'A' }));
    const before = store.get().generation;
    store.load(store.get().history.present, '/p/a.spcritic', false);
    expect(store.get().generation).toBe(before + 1);
    expect(store.get().history.past).toHaveLength(0);
    expect(isDirty(store.get())).toBe(true); // no baseline: restored, unsaved work
  });
});
