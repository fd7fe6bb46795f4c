/**
 * Keyboard shortcuts → commands. In the browser host every shortcut is the page's; under Electron
 * the application menu owns the file and edit accelerators and sends them as menu commands, so
 * only the step shortcuts are the page's there.
 */
import type { MenuCommand } from '../../shared/appApi';
import type { StepId } from './steps';
import { STEPS } from './steps';

export type KeyCommand = { kind: 'menu'; command: MenuCommand } | { kind: 'step'; step: StepId };

export interface KeyPress {
  key: string;
  ctrlKey: boolean;
  metaKey: boolean;
  shiftKey: boolean;
  altKey: boolean;
}

export function keyCommand(e: KeyPress, host: 'electron' | 'browser'): KeyCommand | null {
  const mod = e.ctrlKey || e.metaKey;
  if (host === 'browser' && e.key === 'F5' && !mod && !e.altKey) return { kind: 'menu', command: e.shiftKey ? 'cancel-evaluation' : 'run-evaluation' };
  if (!mod || e.altKey) return null;
  const digit = Number(e.key);
  if (Number.isInteger(digit) && digit >= 1 && digit <= STEPS.length && !e.shiftKey) return { kind: 'step', step: STEPS[digit - 1].id };
  if (host !== 'browser') return null;
  const key = e.key.toLowerCase();
  if (key === 'z') return { kind: 'menu', command: e.shiftKey ? 'redo' : 'undo' };
  if (key === 'y' && !e.shiftKey) return { kind: 'menu', command: 'redo' };
  if (key === 's') return { kind: 'menu', command: e.shiftKey ? 'save-project-as' : 'save-project' };
  if (key === 'o' && !e.shiftKey) return { kind: 'menu', command: 'open-project' };
  if (key === 'n' && !e.shiftKey) return { kind: 'menu', command: 'new-project' };
  if (key === 'w' && !e.shiftKey) return { kind: 'menu', command: 'close-project' };
  if (key === 'd' && e.shiftKey) return { kind: 'menu', command: 'toggle-theme' };
  if (key === 'p') return { kind: 'menu', command: e.shiftKey ? 'save-report-pdf' : 'print-report' };
  return null;
}
