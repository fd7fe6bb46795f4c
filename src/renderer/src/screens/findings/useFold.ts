/** A Findings section's open or folded state for the open project, and the jump to a section from the index. */
import { useCallback, useEffect } from 'react';
import { useDocumentState } from '../../hooks';
import { useStore } from '../../state/useStore';
import { sectionElementId, type SectionId } from './findingsSections';
import { carryUnsaved, foldStore, groupFoldId, isGroupOpen, isOpen, projectKey, setOpen, type FoldChoices } from './foldMemory';

const all = (c: FoldChoices) => c;

export function useProjectKey(): string {
  const path = useDocumentState((s) => s.projectPath), generation = useDocumentState((s) => s.generation);
  useEffect(() => {
    if (path) carryUnsaved(path, generation);
  }, [path, generation]);
  return projectKey(path, generation);
}

/** [open, set] for one section of the open project. */
export function useFold(id: SectionId): [boolean, (open: boolean) => void] {
  const key = useProjectKey();
  const open = useStore(foldStore, useCallback((c: FoldChoices) => isOpen(c, key, id), [key, id]));
  return [open, useCallback((next: boolean) => setOpen(key, [id], next), [key, id])];
}

/** [open, set] for a group inside a section of the open project (a policy's findings under Coverage); `byDefault` until the reader chooses. */
export function useGroupFold(section: SectionId, group: string, byDefault: boolean): [boolean, (open: boolean) => void] {
  const key = useProjectKey(), id = groupFoldId(section, group);
  const open = useStore(foldStore, useCallback((c: FoldChoices) => isGroupOpen(c, key, id, byDefault), [key, id, byDefault]));
  return [open, useCallback((next: boolean) => setOpen(key, [id], next), [key, id])];
}

export function useFoldChoices(): { key: string; choices: FoldChoices } {
  return { key: useProjectKey(), choices: useStore(foldStore, all) };
}

/** Open a section, bring its heading into view (below the sticky toolbar and index) and put the focus on its toggle. */
export function jumpToSection(key: string, id: SectionId): void {
  setOpen(key, [id], true);
  // After React has committed the opened panel.
  requestAnimationFrame(() => {
    const panel = document.getElementById(sectionElementId(id));
    if (!panel) return;
    panel.scrollIntoView({ block: 'start' });
    panel.querySelector<HTMLButtonElement>('.fold-toggle')?.focus({ preventScroll: true });
  });
}
