/**
 * The window title: the project's name, a marker while there are unsaved changes, and the app's
 * name — "Tank levels (edited) — Setpoint Critic". A project without a name yet is "Untitled project".
 */
import type { DocumentState } from './appService';

export const APP_NAME = 'Setpoint Critic';
export const UNTITLED_PROJECT = 'Untitled project';
export const EDITED_MARKER = '(edited)';

export function windowTitle(state: DocumentState): string {
  const name = state.name.trim() || UNTITLED_PROJECT;
  return `${name}${state.dirty ? ` ${EDITED_MARKER}` : ''} — ${APP_NAME}`;
}
