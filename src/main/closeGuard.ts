/**
 * Closing a window (or quitting) with unsaved changes asks first: Save / Don't save / Cancel. The
 * decisions are pure; runCloseSequence strings them together over a small port that the Electron
 * window wiring and the e2e harness each implement, so the same sequence runs in both.
 */
import type { DocumentState } from './appService';
import type { UnsavedChangesChoice } from './dialogs';

export type CloseAction = 'close' | 'ask';
export type ChoiceAction = 'save-then-close' | 'close-without-saving' | 'keep-open';
export type CloseOutcome = 'closed' | 'kept-open';

/** The buttons of the unsaved-changes question, in order; Save is the default, Cancel the Escape answer. */
export const UNSAVED_CHANGES_BUTTONS: readonly { label: string; choice: UnsavedChangesChoice }[] = [
  { label: 'Save', choice: 'save' },
  { label: "Don’t save", choice: 'discard' },
  { label: 'Cancel', choice: 'cancel' },
];
export const UNSAVED_DEFAULT_BUTTON = 0;
export const UNSAVED_CANCEL_BUTTON = 2;

/** The answer a message box's button index stands for; anything unexpected keeps the window open. */
export function choiceForButton(index: number): UnsavedChangesChoice {
  return UNSAVED_CHANGES_BUTTONS[index]?.choice ?? 'cancel';
}

export function unsavedChangesQuestion(documentName: string): { message: string; detail: string } {
  return {
    message: `Save the changes to “${documentName.trim() || 'Untitled project'}” before closing?`,
    detail: 'Changes you do not save are lost.',
  };
}

/** A clean document closes at once; a dirty one asks. */
export function closeAction(state: DocumentState): CloseAction {
  return state.dirty ? 'ask' : 'close';
}

export function actionForChoice(choice: UnsavedChangesChoice): ChoiceAction {
  switch (choice) {
    case 'save': return 'save-then-close';
    case 'discard': return 'close-without-saving';
    case 'cancel': return 'keep-open';
  }
}

/** After the save the user asked for: close only if it saved (a cancelled or failed save keeps the window). */
export function outcomeAfterSave(saved: boolean): CloseOutcome {
  return saved ? 'closed' : 'kept-open';
}

/** Quitting closes every window in turn and stops at the first one the user keeps open. */
export function quitOutcome(outcomes: readonly CloseOutcome[]): 'quit' | 'stay' {
  return outcomes.every((o) => o === 'closed') ? 'quit' : 'stay';
}

export interface ClosePort {
  documentState(): DocumentState;
  ask(documentName: string): Promise<UnsavedChangesChoice>;
  /** Ask the renderer to save; resolves true once it saved, false if it was cancelled or failed. */
  save(): Promise<boolean>;
}

export async function runCloseSequence(port: ClosePort): Promise<CloseOutcome> {
  const state = port.documentState();
  if (closeAction(state) === 'close') return 'closed';
  const action = actionForChoice(await port.ask(state.name));
  if (action === 'keep-open') return 'kept-open';
  if (action === 'close-without-saving') return 'closed';
  return outcomeAfterSave(await port.save());
}
