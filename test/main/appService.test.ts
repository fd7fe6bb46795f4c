import { mkdtemp, mkdir, readdir, readFile, rm, writeFile } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterEach, beforeEach, describe, expect, it } from 'vitest';
import { dispatchApiCall } from '../../src/main/apiDispatch';
import { createAppContext } from '../../src/main/appContext';
import { createAppService, type AppService } from '../../src/main/appService';
import { ScriptedDialogs } from '../e2e/harness/scriptedDialogs';

// The AppApi semantics (src/shared/appApi.ts and the issue) over real files in a temp folder: the
// same service the IPC handlers and the e2e server call.
const SAMPLE = join(__dirname, '../../sample-projects/tank-levels/tank-levels.spcritic');

describe('app service', () => {
  let root: string;
  let projectText: string;
  let dialogs: ScriptedDialogs;
  let service: AppService;
  const start = (runId: string) => {
    dialogs = new ScriptedDialogs();
    const context = createAppContext({ stateFolder: join(root, 'state'), runId, report: () => undefined, now: () => new Date('2025-03-01T10:00:00Z') });
    service = createAppService(context, { slot: 'w1', dialogs });
    return service;
  };

  beforeEach(async () => {
    root = await mkdtemp(join(tmpdir(), 'spc-service-'));
    await mkdir(join(root, 'plant'));
    projectText = await readFile(SAMPLE, 'utf8');
    await writeFile(join(root, 'plant', 'tank.spcritic'), projectText);
    await writeFile(join(root, 'plant', 'tank-levels.csv'), 't,x\n0,1\n');
    await writeFile(join(root, 'secret.txt'), 'not yours');
    start('run1');
  });
  afterEach(() => rm(root, { recursive: true, force: true }));

  it('opens a project the user chose, then reads the data it references and nothing else', async () => {
    const projectPath = join(root, 'plant', 'tank.spcritic');
    dialogs.nextOpenProject = projectPath;
    expect(await service.openProjectDialog()).toEqual({ path: projectPath, text: projectText });
    const data = await service.readProjectData(projectPath, 'tank-levels.csv');
    expect(data).toMatchObject({ path: join(root, 'plant', 'tank-levels.csv'), relativePath: 'tank-levels.csv' });
    expect(new TextDecoder().decode(data.bytes)).toBe('t,x\n0,1\n');
    await expect(service.readProjectData(projectPath, '../secret.txt')).rejects.toThrow('reads only files you chose or that your project names');
    expect(await service.recentProjects()).toEqual([projectPath]);
  });

  it('answers a cancelled dialog with null and reads nothing', async () => {
    expect(await service.openProjectDialog()).toBeNull();
    expect(await service.chooseDataFile(null)).toBeNull();
    expect(await service.exportFile('png', 'x', new Uint8Array(1))).toBeNull();
    expect(await service.saveProjectAs('{}', 'x')).toEqual({ saved: false, reason: 'cancelled' });
  });

  it('gives a chosen data file relative to the project folder, or absolute without a project', async () => {
    dialogs.nextOpenData = join(root, 'plant', 'tank-levels.csv');
    expect((await service.chooseDataFile(null))?.relativePath).toBe(join(root, 'plant', 'tank-levels.csv'));
    dialogs.nextOpenData = join(root, 'secret.txt');
    expect((await service.relocateDataFile(join(root, 'plant', 'tank.spcritic')))?.relativePath).toBe('../secret.txt');
  });

  it('saves a new project where the user says, adds the extension, and lists it as recent', async () => {
    dialogs.nextOpenData = join(root, 'plant', 'tank-levels.csv'); // the user chose the data of the new project
    await service.chooseDataFile(null);
    dialogs.nextSave = join(root, 'plant', 'retuned');
    const reply = await service.saveProject(projectText, null, 'Tank levels: retuned');
    expect(reply).toEqual({ saved: true, path: join(root, 'plant', 'retuned.spcritic') });
    expect(dialogs.asked.at(-1)).toMatchObject({ dialog: 'saveProject', suggestedName: 'Tank levels- retuned.spcritic' });
    expect(await readFile(join(root, 'plant', 'retuned.spcritic'), 'utf8')).toBe(projectText);
    expect((await service.recentProjects())[0]).toBe(join(root, 'plant', 'retuned.spcritic'));
    // The saved project's data is now readable through it.
    expect((await service.readProjectData(join(root, 'plant', 'retuned.spcritic'), 'tank-levels.csv')).bytes.length).toBe(8);
  });

  it('saves over an opened project atomically, keeping the previous version as .bak', async () => {
    const projectPath = join(root, 'plant', 'tank.spcritic');
    dialogs.nextOpenProject = projectPath;
    await service.openProjectDialog();
    const edited = projectText.replace('"seed": ', '"seed":  ');
    expect(await service.saveProject(edited, projectPath, 'x')).toEqual({ saved: true, path: projectPath });
    expect(await readFile(projectPath, 'utf8')).toBe(edited);
    expect(await readFile(`${projectPath}.bak`, 'utf8')).toBe(projectText);
  });

  it('never writes to a path the user did not choose', async () => {
    const reply = await service.saveProject(projectText, join(root, 'secret.txt'), 'x');
    expect(reply).toMatchObject({ saved: false, reason: 'error' });
    expect(await readFile(join(root, 'secret.txt'), 'utf8')).toBe('not yours');
    await expect(service.openRecentProject(join(root, 'secret.txt'))).rejects.toThrow('is not in the recent-projects list');
  });

  it('never overwrites a project from a newer format version (or a corrupt one) with a plain Save', async () => {
    const newer = join(root, 'plant', 'newer.spcritic');
    const newerText = projectText.replace('"version": 1', '"version": 99');
    await writeFile(newer, newerText);
    dialogs.nextOpenProject = newer;
    await service.openProjectDialog();
    const reply = await service.saveProject(projectText, newer, 'x');
    expect(reply.saved).toBe(false);
    if (!reply.saved && reply.reason === 'error') expect(reply.message).toMatch(/left unchanged.*newer Setpoint Critic.*Use Save As/s);
    expect(await readFile(newer, 'utf8')).toBe(newerText);
  });

  it('reports a missing recent project by name and cause, without a stack', async () => {
    const projectPath = join(root, 'plant', 'tank.spcritic');
    dialogs.nextOpenProject = projectPath;
    await service.openProjectDialog();
    await rm(projectPath);
    const reply = await dispatchApiCall(start('run2'), 'openRecentProject', [projectPath]);
    expect(reply).toEqual({ ok: false, message: `Could not read "${projectPath}": the file or its folder does not exist (ENOENT)` });
  });

  it('offers unsaved work after a crash, and discards it after a save', async () => {
    await service.writeRecovery('{"unsaved":true}', null);
    const next = start('run2'); // the first run never closed cleanly
    const offer = await next.pendingRecovery();
    expect(offer).toEqual({ projectPath: null, text: '{"unsaved":true}', savedAt: '2025-03-01T10:00:00.000Z' });
    expect(await next.pendingRecovery()).toEqual(offer); // asking twice (React StrictMode) offers the same copy
    dialogs.nextSave = join(root, 'plant', 'restored.spcritic');
    await next.saveProject(projectText, null, 'restored');
    expect(await readdir(join(root, 'state', 'recovery'))).toEqual([]);
    expect(await start('run3').pendingRecovery()).toBeNull();
  });

  it('keeps the words of a save that failed in the recovery copy', async () => {
    dialogs.nextSave = join(root, 'no-such-folder', 'x.spcritic');
    const reply = await service.saveProject('{"precious":1}', null, 'x');
    expect(reply).toMatchObject({ saved: false, reason: 'error' });
    if (!reply.saved && reply.reason === 'error') expect(reply.message).toContain('(ENOENT)');
    expect((await start('run2').pendingRecovery())?.text).toBe('{"precious":1}');
  });

  it('lets a restored project save back to its own file', async () => {
    const projectPath = join(root, 'plant', 'tank.spcritic');
    dialogs.nextOpenProject = projectPath;
    await service.openProjectDialog();
    await service.writeRecovery(projectText, projectPath);
    const next = start('run2');
    expect((await next.pendingRecovery())?.projectPath).toBe(projectPath);
    expect(await next.saveProject(projectText, projectPath, 'x')).toEqual({ saved: true, path: projectPath });
    expect((await next.readProjectData(projectPath, 'tank-levels.csv')).relativePath).toBe('tank-levels.csv');
  });

  it('exports bytes to the chosen file with the kind\'s extension', async () => {
    dialogs.nextExport = join(root, 'surface');
    expect(await service.exportFile('png', 'Value surface', new Uint8Array([137, 80, 78, 71]))).toEqual({ path: join(root, 'surface.png') });
    expect([...(await readFile(join(root, 'surface.png')))]).toEqual([137, 80, 78, 71]);
    expect(dialogs.asked.at(-1)).toMatchObject({ dialog: 'export', kind: 'png', suggestedName: 'Value surface.png' });
  });

  it('records the document state and reports saves to a listener', async () => {
    const saves: boolean[] = [];
    const context = createAppContext({ stateFolder: join(root, 'state'), runId: 'run9', report: () => undefined });
    const watched = createAppService(context, { slot: 'w2', dialogs, onSaveReply: (r) => saves.push(r.saved) });
    watched.setDocumentState({ name: 'Tank levels', dirty: true });
    expect(watched.documentState()).toEqual({ name: 'Tank levels', dirty: true });
    await watched.saveProjectAs('{}', 'x');
    expect(saves).toEqual([false]);
  });
});

describe('API dispatch', () => {
  const service = {} as AppService;
  it('refuses unknown methods and bad arguments with a message naming them', async () => {
    expect(await dispatchApiCall(service, 'deleteEverything', [])).toEqual({ ok: false, message: 'There is no API method "deleteEverything".' });
    expect(await dispatchApiCall(service, 'readProjectData', ['/p/x.spcritic', 5])).toEqual({ ok: false, message: 'readProjectData: argument "relativePath": expected a path (text)' });
  });

  it('turns an unexpected error into one line and logs the rest', async () => {
    const logged: unknown[] = [];
    const broken = { recentProjects: async () => { throw new TypeError('x is undefined\n    at f (file.ts:1:1)'); } } as unknown as AppService;
    expect(await dispatchApiCall(broken, 'recentProjects', [], (e) => logged.push(e))).toEqual({ ok: false, message: 'Unexpected problem in recentProjects: x is undefined' });
    expect(logged).toHaveLength(1);
  });
});
