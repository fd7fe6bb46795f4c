/** The Findings folds kept per project: defaults from findingsSections.ts, the reader's choices (a section's, and a group's inside one), and a first save carrying them to the file's key. */
import { describe, expect, it } from 'vitest';
import { FINDINGS_SECTIONS } from '../../../src/renderer/src/screens/findings/findingsSections';
import { carryUnsaved, foldStore, groupFoldId, isGroupOpen, isOpen, projectKey, setOpen } from '../../../src/renderer/src/screens/findings/foldMemory';

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

  it('keeps a group’s choice inside a section apart from the section’s, and the group’s own default until then', () => {
    const d = projectKey('/plant/d.spcritic', 3), group = groupFoldId('coverage', 'candidate:PI');
    expect(isGroupOpen(foldStore.get(), d, group, true)).toBe(true);
    expect(isGroupOpen(foldStore.get(), d, group, false)).toBe(false);
    setOpen(d, [group], false);
    expect(isGroupOpen(foldStore.get(), d, group, true)).toBe(false);
    expect(isOpen(foldStore.get(), d, 'coverage')).toBe(false); // the section keeps its own default
    expect(isGroupOpen(foldStore.get(), projectKey('/plant/e.spcritic', 4), group, true)).toBe(true);
  });
});
