/**
 * Which Findings sections the reader opened or folded, remembered per project for the session
 * (this window's session storage, so a reload keeps it and a new window starts from the defaults).
 * Only the reader's own choices are kept; a section never touched follows findingsSections.ts.
 */
import { createStore, type Store } from '../../state/store';
import { FINDINGS_SECTIONS, type SectionId } from './findingsSections';

const STORAGE_KEY = 'setpoint-critic.findings-folds';

/** project key → section (or a group inside one, groupFoldId) → open. */
export type FoldChoices = Readonly<Record<string, Readonly<Partial<Record<string, boolean>>>>>;

function readSaved(): FoldChoices {
  try {
    const text = globalThis.sessionStorage?.getItem(STORAGE_KEY);
    const parsed: unknown = text ? JSON.parse(text) : {};
    return parsed && typeof parsed === 'object' && !Array.isArray(parsed) ? (parsed as FoldChoices) : {};
  } catch {
    return {}; // unreadable or unavailable storage: start from the defaults
  }
}

export const foldStore: Store<FoldChoices> = createStore<FoldChoices>(readSaved());

foldStore.subscribe(() => {
  try {
    globalThis.sessionStorage?.setItem(STORAGE_KEY, JSON.stringify(foldStore.get()));
  } catch {
    // storage full or disabled: the choice still holds in this page
  }
});

/** The key a project's choices are kept under: its file, or, not yet saved, the document's generation (a new document starts afresh). */
export const projectKey = (projectPath: string | null, generation: number): string => projectPath ?? `(unsaved #${generation})`;

/** On a first save the choices made while the project had no file go with it (they are the same project). */
export function carryUnsaved(projectPath: string, generation: number): void {
  const from = projectKey(null, generation);
  foldStore.set((all) => {
    if (!all[from] || all[projectPath]) return all;
    const { [from]: moved, ...rest } = all;
    return { ...rest, [projectPath]: moved };
  });
}

export function isOpen(choices: FoldChoices, key: string, id: SectionId): boolean {
  return choices[key]?.[id] ?? FINDINGS_SECTIONS.find((s) => s.id === id)?.defaultOpen ?? true;
}

/** A group folded inside a section (a policy's findings under Coverage), kept beside the sections as "section/group". */
export const groupFoldId = (section: SectionId, group: string): string => `${section}/${group}`;

/** A group's open state as the reader left it, or the group's own default where it was never touched. */
export function isGroupOpen(choices: FoldChoices, key: string, id: string, byDefault: boolean): boolean {
  return choices[key]?.[id] ?? byDefault;
}

export function setOpen(key: string, ids: readonly string[], open: boolean): void {
  foldStore.set((all) => {
    const mine = { ...all[key] };
    for (const id of ids) mine[id] = open;
    return { ...all, [key]: mine };
  });
}
