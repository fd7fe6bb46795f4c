/** What each step says it still needs, and the keyboard shortcuts to reach it. */
import { describe, expect, it } from 'vitest';
import { keyCommand } from '../../../src/renderer/src/commandKeys';
import { newProjectDocument } from '../../../src/renderer/src/document/newProject';
import { projectProblems } from '../../../src/renderer/src/document/projectProblems';
import { runBlockers } from '../../../src/renderer/src/session/evaluationRunner';
import { emptySession } from '../../../src/renderer/src/session/sessionStore';
import { stepStatuses } from '../../../src/renderer/src/steps';

const press = (key: string, mods: Partial<{ ctrlKey: boolean; shiftKey: boolean; metaKey: boolean; altKey: boolean }> = {}) =>
  ({ key, ctrlKey: false, shiftKey: false, metaKey: false, altKey: false, ...mods });

describe('workflow steps', () => {
  it('tells a new user to start with the data', () => {
    const doc = newProjectDocument();
    const s = stepStatuses(doc, emptySession(), projectProblems(doc), false);
    expect(s['plant-log']).toEqual({ done: false, status: 'Needs a data file (CSV)' });
    expect(s.candidates.status).toBe('Needs at least one candidate');
    expect(s.estimator.done).toBe(true); // the defaults are valid
    expect(s.run.status).toBe('Needs the steps above');
    expect(runBlockers(emptySession(), projectProblems(doc), '')?.[0].message).toBe('choose a data file (CSV) first');
  });

  it('says when the data file could not be read', () => {
    const doc = newProjectDocument();
    const session = { ...emptySession(), dataProblems: [{ where: 'p, data.path', message: 'cannot read' }] };
    expect(stepStatuses(doc, session, [], false)['plant-log'].status).toBe('The data file could not be read');
  });
});

describe('keyboard shortcuts', () => {
  it('jumps to steps with Ctrl+1…5 in either host', () => {
    expect(keyCommand(press('3', { ctrlKey: true }), 'electron')).toEqual({ kind: 'step', step: 'estimator' });
    expect(keyCommand(press('6', { ctrlKey: true }), 'browser')).toBeNull();
    expect(keyCommand(press('3'), 'browser')).toBeNull();
  });

  it('leaves undo and save to the Electron menu, and takes them in the browser host', () => {
    expect(keyCommand(press('z', { ctrlKey: true }), 'electron')).toBeNull();
    expect(keyCommand(press('z', { ctrlKey: true }), 'browser')).toEqual({ kind: 'menu', command: 'undo' });
    expect(keyCommand(press('Z', { ctrlKey: true, shiftKey: true }), 'browser')).toEqual({ kind: 'menu', command: 'redo' });
    expect(keyCommand(press('S', { ctrlKey: true, shiftKey: true }), 'browser')).toEqual({ kind: 'menu', command: 'save-project-as' });
    expect(keyCommand(press('F5'), 'browser')).toEqual({ kind: 'menu', command: 'run-evaluation' });
    expect(keyCommand(press('p', { ctrlKey: true }), 'browser')).toEqual({ kind: 'menu', command: 'print-report' });
    expect(keyCommand(press('P', { ctrlKey: true, shiftKey: true }), 'browser')).toEqual({ kind: 'menu', command: 'save-report-pdf' });
    expect(keyCommand(press('p', { ctrlKey: true }), 'electron')).toBeNull(); // the menu's accelerator there
  });
});
