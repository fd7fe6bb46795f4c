/** The Findings folds kept per project: defaults from findingsSections.ts, the reader's choices, and a first save carrying them to the file's key. */
import { describe, expect, it } from 'vitest';
import { FINDINGS_SECTIONS } from '../../../src/renderer/src/screens/findings/findingsSections';
import { carryUnsaved, foldStore, isOpen, projectKey, setOpen } from '../../../src/renderer/src/screens/findings/foldMemory';

describe('Findings folds', () => {
  it('starts from each section’s default and keeps the reader’s choice per project', () => {
    const a = projectKey('/plant/a.spcritic', 1), b = projectKey('/plant/b.spcritic', 2);
    for (const s of FINDINGS_SECTIONS) expect(isOpen(foldStore.get(), a, s.id)).toBe(s.defaultOpen);
    setOpen(a, ['coverage'], true);
    setOpen(a, ['values'], false);
    expect(isOpen(foldStore.get(), a, 'coverage')).toBe(true);
    expect(isOpen(foldStore.get(), a, 'values')).toBe(false);
    expect(isOpen(foldStore.get(), b, 'coverage')).toBe(false);
  });

  it('carries the choices made before the first save to the saved file, and starts a new document afresh', () => {
    const unsaved = projectKey(null, 7);
    setOpen(unsaved, ['surface'], true);
    expect(isOpen(foldStore.get(), projectKey(null, 8), 'surface')).toBe(false);
    carryUnsaved('/plant/c.spcritic', 7);
    expect(isOpen(foldStore.get(), '/plant/c.spcritic', 'surface')).toBe(true);
    expect(foldStore.get()[unsaved]).toBeUndefined();
  });
});
