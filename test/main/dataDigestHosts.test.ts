/**
 * One data file, one fingerprint, whichever host reads it (issue 11: the fingerprint takes no read
 * of its own). The outside reference is Node's crypto SHA-256 (OpenSSL) of the file read whole here.
 *   - the command line: the file (over STREAMED_FILE_BYTES) left open and read in pieces, hashed as
 *     the import reads it (cli/evaluateProjectFile.ts dataFile, pipeline/dataFingerprint.ts hashedWhileRead);
 *   - the app: the main process hashes the bytes it read (main/appService.ts, DataFileReply.sha256)
 *     and the worker imports them without hashing again; a file dropped on the window (no main-process
 *     hash) is hashed by the worker's portable SHA-256, once for the file (kept beside the bytes).
 * The log is the tank-levels sample written over and over (run labels made distinct per copy).
 */
import { createHash } from 'node:crypto';
import { mkdtemp, readFile, rm, writeFile } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { dataFile } from '../../src/cli/evaluateProjectFile';
import { nativeSha256 } from '../../src/cli/nativeSha256';
import { STREAMED_FILE_BYTES } from '../../src/core/limits';
import { createAppContext } from '../../src/main/appContext';
import { createAppService } from '../../src/main/appService';
import { openProject } from '../../src/pipeline/openProject';
import { parseProjectText } from '../../src/project/projectFile';
import { createWorkerMemory } from '../../src/renderer/src/worker/workerMemory';
import { ScriptedDialogs } from '../e2e/harness/scriptedDialogs';

const sample = join(__dirname, '..', '..', 'sample-projects', 'tank-levels');
let root: string, csvPath: string, projectText: string, reference: string;

beforeAll(async () => {
  const [header, ...rows] = (await readFile(join(sample, 'tank-levels.csv'), 'utf8')).trimEnd().split('\n');
  const copies = Math.ceil((STREAMED_FILE_BYTES + 1) / (rows.join('\n').length + 1)) + 1;
  const text = `${header}\n${Array.from({ length: copies }, (_, k) => rows.map((row) => `${k}-${row}`).join('\n')).join('\n')}\n`;
  root = await mkdtemp(join(tmpdir(), 'spc-digest-'));
  csvPath = join(root, 'long-log.csv');
  await writeFile(csvPath, text);
  const document = JSON.parse(await readFile(join(sample, 'tank-levels.spcritic'), 'utf8'));
  projectText = JSON.stringify({ ...document, data: { ...document.data, path: 'long-log.csv', sha256: undefined, rowCount: undefined } });
  await writeFile(join(root, 'long-log.spcritic'), projectText);
  reference = createHash('sha256').update(await readFile(csvPath)).digest('hex');
});
afterAll(() => rm(root, { recursive: true, force: true }));

describe('the data file’s fingerprint across hosts', () => {
  it('the command line, reading the file in pieces, gives the SHA-256 of the file', async () => {
    const source = await dataFile(csvPath);
    expect(source).not.toBeInstanceOf(Uint8Array); // the route in pieces, where the hash rides on the import's reads
    if ('close' in source) await source.close();
    const opened = await openProject(projectText, 'long-log.spcritic', (p) => dataFile(join(root, p)), { sha256: nativeSha256 });
    if (!opened.ok) throw new Error(JSON.stringify(opened.problems));
    expect(opened.value.fingerprint).toBe(reference);
  });

  it('the app: the main process’s hash of the bytes it read is the same, and the worker’s import carries it', async () => {
    const dialogs = new ScriptedDialogs();
    const context = createAppContext({ stateFolder: join(root, 'state'), runId: 'digest', report: () => undefined, now: () => new Date('2025-03-01T10:00:00Z') });
    const service = createAppService(context, { slot: 'w1', dialogs });
    dialogs.nextOpenData = csvPath;
    const reply = await service.chooseDataFile(join(root, 'long-log.spcritic'));
    if (!reply) throw new Error('the dialog should give the file');
    expect(reply.sha256).toBe(reference);
    const project = parseProjectText(projectText, 'long-log.spcritic');
    if (!project.ok) throw new Error('the project should parse');
    const memory = createWorkerMemory(async () => undefined);
    memory.setData(reply.bytes, reply.relativePath, reply.sha256);
    const opened = await memory.open(project.value.document);
    expect(opened.ok && opened.value.fingerprint).toBe(reference);
  });

  it('a file dropped on the window (no main-process hash): the worker hashes it once, to the same digest', async () => {
    const project = parseProjectText(projectText, 'long-log.spcritic');
    if (!project.ok) throw new Error('the project should parse');
    const memory = createWorkerMemory(async () => undefined);
    memory.setData(new Uint8Array(await readFile(csvPath)), 'long-log.csv');
    const first = await memory.open(project.value.document);
    expect(first.ok && first.value.fingerprint).toBe(reference);
    expect((memory.data() as { sha256?: string }).sha256).toBe(reference); // kept for the next import of these bytes
    const doc = project.value.document;
    const again = await memory.open({ ...doc, data: { ...doc.data, csv: { ...doc.data.csv, badRows: 'exclude' } } }); // another import of the same bytes
    expect(again.ok && again.value.fingerprint).toBe(reference);
  });
});
