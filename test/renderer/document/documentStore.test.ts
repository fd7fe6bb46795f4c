/** "Unsaved changes" means "differs from the file": undoing back to the saved state clears it. */
import { describe, expect, it } from 'vitest';
import { serializeProject } from '../../../src/project/projectFile';
import { createDocumentStore, isDirty } from '../../../src/renderer/src/document/documentStore';

describe('document store', () => {
  it('is clean when new, dirty after an edit, clean again after undo or save', () => {
    const store = createDocumentStore();
    expect(isDirty(store.get())).toBe(false);
    store.edit('rename', (d) => ({ ...d, name: 'Tanks' }));
    expect(isDirty(store.get())).toBe(true);
    store.undo();
    expect(isDirty(store.get())).toBe(false);
    store.redo();
    store.markSaved('/p/tanks.spcritic', serializeProject(store.get().history.present));
    expect(isDirty(store.get())).toBe(false);
    expect(store.get().projectPath).toBe('/p/tanks.spcritic');
  });

  it('starts a new generation, and forgets the history, when another document is loaded', () => {
    const store = createDocumentStore();
    store.edit('rename', (d) => ({ ...d, name: 'A' }));
    const before = store.get().generation;
    store.load(store.get().history.present, '/p/a.spcritic', '');
    expect(store.get().generation).toBe(before + 1);
    expect(store.get().history.past).toHaveLength(0);
    expect(isDirty(store.get())).toBe(true); // an empty baseline: restored, unsaved work
  });
});
