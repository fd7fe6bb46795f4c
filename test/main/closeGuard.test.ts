import { describe, expect, it } from 'vitest';
import {
  UNSAVED_CANCEL_BUTTON, UNSAVED_CHANGES_BUTTONS, UNSAVED_DEFAULT_BUTTON, actionForChoice, choiceForButton, closeAction,
  outcomeAfterSave, quitOutcome, runCloseSequence, unsavedChangesQuestion, type ClosePort,
} from '../../src/main/closeGuard';
import type { UnsavedChangesChoice } from '../../src/main/dialogs';
import { windowTitle } from '../../src/main/windowTitle';

// The issue is the spec: closing with unsaved changes asks first (Save / Don't save / Cancel); the
// title shows the project name and an unsaved-changes marker.
describe('close guard decisions', () => {
  it('closes a clean document at once and asks about a dirty one', () => {
    expect(closeAction({ name: 'x', dirty: false })).toBe('close');
    expect(closeAction({ name: 'x', dirty: true })).toBe('ask');
  });

  it('maps each answer to an action', () => {
    expect(actionForChoice('save')).toBe('save-then-close');
    expect(actionForChoice('discard')).toBe('close-without-saving');
    expect(actionForChoice('cancel')).toBe('keep-open');
    expect(outcomeAfterSave(true)).toBe('closed');
    expect(outcomeAfterSave(false)).toBe('kept-open');
  });

  it('offers Save / Don\'t save / Cancel, Save by default, Escape cancels, anything else keeps the window', () => {
    expect(UNSAVED_CHANGES_BUTTONS.map((b) => b.label)).toEqual(['Save', 'Don’t save', 'Cancel']);
    expect(choiceForButton(UNSAVED_DEFAULT_BUTTON)).toBe('save');
    expect(choiceForButton(1)).toBe('discard');
    expect(choiceForButton(UNSAVED_CANCEL_BUTTON)).toBe('cancel');
    expect(choiceForButton(7)).toBe('cancel');
    expect(unsavedChangesQuestion('Tank levels').message).toBe('Save the changes to “Tank levels” before closing?');
    expect(unsavedChangesQuestion(' ').message).toContain('Untitled project');
  });

  it('quits only when every window closed', () => {
    expect(quitOutcome([])).toBe('quit');
    expect(quitOutcome(['closed', 'closed'])).toBe('quit');
    expect(quitOutcome(['closed', 'kept-open'])).toBe('stay');
  });
});

describe('close sequence', () => {
  const port = (dirty: boolean, choice: UnsavedChangesChoice, saves: boolean) => {
    const log: string[] = [];
    const p: ClosePort = {
      documentState: () => ({ name: 'Tank levels', dirty }),
      ask: async (name) => (log.push(`ask ${name}`), choice),
      save: async () => (log.push('save'), saves),
    };
    return { p, log };
  };

  it.each([
    [false, 'cancel', true, 'closed', []],
    [true, 'cancel', true, 'kept-open', ['ask Tank levels']],
    [true, 'discard', true, 'closed', ['ask Tank levels']],
    [true, 'save', true, 'closed', ['ask Tank levels', 'save']],
    [true, 'save', false, 'kept-open', ['ask Tank levels', 'save']],
  ] as const)('dirty=%s, answer %s, save succeeds=%s → %s', async (dirty, choice, saves, outcome, steps) => {
    const { p, log } = port(dirty, choice, saves);
    expect(await runCloseSequence(p)).toBe(outcome);
    expect(log).toEqual(steps);
  });
});

describe('window title', () => {
  it('shows the name, a marker while edited, and the app name', () => {
    expect(windowTitle({ name: 'Tank levels', dirty: false })).toBe('Tank levels — Setpoint Critic');
    expect(windowTitle({ name: 'Tank levels', dirty: true })).toBe('Tank levels (edited) — Setpoint Critic');
    expect(windowTitle({ name: '  ', dirty: true })).toBe('Untitled project (edited) — Setpoint Critic');
  });
});
