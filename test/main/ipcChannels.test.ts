import { describe, expect, it } from 'vitest';
import {
  API_ARGUMENTS, DOCUMENT_STATE_CHANNEL, INVOKE_METHODS, IpcArgumentError, MENU_COMMAND_CHANNEL, invokeChannel,
  validateArguments, validateDocumentState,
} from '../../src/shared/ipcChannels';

// Electron security checklist, "Validate the sender of all IPC messages" and the issue's "validate
// every argument with the shared zod schemas": a bad argument is refused with a message naming the
// method and the argument.
describe('IPC argument validation', () => {
  it('has one distinct channel per AppApi method', () => {
    const channels = INVOKE_METHODS.map(invokeChannel);
    expect(new Set([...channels, DOCUMENT_STATE_CHANNEL, MENU_COMMAND_CHANNEL]).size).toBe(channels.length + 2);
    expect(INVOKE_METHODS.sort()).toEqual([
      'chooseDataFile', 'discardRecovery', 'exportFile', 'openProjectDialog', 'openRecentProject', 'pendingRecovery', 'printReport',
      'readProjectData', 'recentProjects', 'relocateDataFile', 'saveProject', 'saveProjectAs', 'saveReportPdf', 'writeRecovery',
    ]);
  });

  it('accepts well-formed arguments unchanged', () => {
    const bytes = new Uint8Array([1, 2, 3]);
    expect(validateArguments('saveProject', ['{"a":1}', '/p/x.spcritic', 'Tank levels'])).toEqual(['{"a":1}', '/p/x.spcritic', 'Tank levels']);
    expect(validateArguments('saveProject', ['{}', null, 'x'])).toEqual(['{}', null, 'x']);
    expect(validateArguments('exportFile', ['png', 'surface.png', bytes])[2]).toBe(bytes);
    expect(validateArguments('readProjectData', ['C:\\plants\\x.spcritic', '../logs/a.csv'])).toEqual(['C:\\plants\\x.spcritic', '../logs/a.csv']);
    expect(validateArguments('openProjectDialog', [])).toEqual([]);
  });

  const refusals: [string, unknown[], string][] = [
    ['openRecentProject', [42], 'openRecentProject: argument "path": expected a path (text)'],
    ['openRecentProject', ['relative/x.spcritic'], 'openRecentProject: argument "path": expected an absolute path'],
    ['openRecentProject', ['/x\u0000.spcritic'], 'openRecentProject: argument "path": a path may not contain a NUL character'],
    ['readProjectData', ['/p/x.spcritic', ''], 'readProjectData: argument "relativePath": expected a path, found an empty text'],
    ['saveProject', [{}, null, 'x'], 'saveProject: argument "text": expected the project text'],
    ['saveProject', ['{}', null, '../../etc/passwd'], 'saveProject: argument "suggestedName": expected a file name without folders (no / or \\)'],
    ['saveProject', ['{}', undefined, 'x'], 'saveProject: argument "path": expected a path (text)'],
    ['exportFile', ['gif', 'x.gif', new Uint8Array(1)], 'exportFile: argument "kind": expected "png", "svg", "csv", "html" or "pdf"'],
    ['exportFile', ['png', 'x.png', [1, 2, 3]], 'exportFile: argument "bytes": expected the file contents as a Uint8Array'],
    ['writeRecovery', ['{}', 7], 'writeRecovery: argument "projectPath": expected a path (text)'],
    ['saveProjectAs', ['{}'], 'saveProjectAs: expected 2 (text, suggestedName), received 1'],
    ['pendingRecovery', ['extra'], 'pendingRecovery: expected no arguments, received 1'],
  ];
  it.each(refusals)('%s refuses %j', (method, args, message) => {
    expect(() => validateArguments(method as (typeof INVOKE_METHODS)[number], args)).toThrow(new IpcArgumentError(message));
  });

  it('refuses arguments that are not a list', () => {
    expect(() => validateArguments('recentProjects', 'all' as unknown)).toThrow('recentProjects: expected a list of arguments');
  });

  it('refuses an oversized project text', () => {
    expect(() => validateArguments('writeRecovery', ['x'.repeat(64 * 1024 * 1024 + 1), null])).toThrow('writeRecovery: argument "text": expected at most 67108864 characters of project text');
  });

  it('names every argument of every method', () => {
    for (const method of INVOKE_METHODS) expect(API_ARGUMENTS[method].names.length).toBe(API_ARGUMENTS[method].schema.def.items.length);
  });

  it('validates the document state, naming the field', () => {
    expect(validateDocumentState({ name: 'Tank levels', dirty: true })).toEqual({ name: 'Tank levels', dirty: true });
    expect(() => validateDocumentState({ name: 'x', dirty: 'yes' })).toThrow('setDocumentState: argument "state.dirty": expected true or false');
    expect(() => validateDocumentState({ name: 'x', dirty: false, extra: 1 })).toThrow(/setDocumentState: argument "state"/);
    expect(() => validateDocumentState(null)).toThrow('setDocumentState: argument "state": expected { name, dirty }');
  });
});
