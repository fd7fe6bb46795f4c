import { mkdtemp, readdir, readFile, rm, writeFile, mkdir } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterEach, beforeEach, describe, expect, it } from 'vitest';
import { createFileStore } from '../../src/main/fileStore';
import { nodeFileSystem } from '../../src/main/fileSystem';
import { createRecoveryStore } from '../../src/main/recoveryStore';

// The issue is the spec: an autosave to a recovery file while there are unsaved changes; after a
// crash the next start offers to restore it; a clean save or close discards it.
describe('recovery store', () => {
  let state: string;
  const reports: string[] = [];
  const storeFor = (runId: string) =>
    createRecoveryStore({ fs: nodeFileSystem, store: createFileStore(nodeFileSystem), stateFolder: state, runId, report: (m) => reports.push(m) });
  beforeEach(async () => {
    state = await mkdtemp(join(tmpdir(), 'spc-recovery-'));
    reports.length = 0;
  });
  afterEach(() => rm(state, { recursive: true, force: true }));

  it('offers a copy written by an earlier run (a crash) to the next run, once', async () => {
    const crashed = storeFor('run1');
    await crashed.write('w1', '{"name":"Tank levels"}', '/p/tank.spcritic', new Date('2025-03-01T10:00:00Z'));
    expect(await crashed.claimLeftover('w2')).toBeNull(); // this run's own copies are not leftovers

    const next = storeFor('run2');
    expect(await next.leftoverCount()).toBe(1);
    expect(await next.claimLeftover('w1')).toEqual({ projectPath: '/p/tank.spcritic', text: '{"name":"Tank levels"}', savedAt: '2025-03-01T10:00:00.000Z' });
    expect(await next.leftoverCount()).toBe(0);
    expect(await next.claimLeftover('w2')).toBeNull();
  });

  it('discards the claimed copy when the user declines it (or saves)', async () => {
    await storeFor('run1').write('w1', 'text', null, new Date('2025-03-01T10:00:00Z'));
    const next = storeFor('run2');
    await next.claimLeftover('w1');
    await next.discard('w1');
    expect(await readdir(join(state, 'recovery'))).toEqual([]);
    expect(await storeFor('run3').claimLeftover('w1')).toBeNull();
    await next.discard('w1'); // discarding twice is harmless
  });

  it('keeps a claimed copy through another crash until it is discarded', async () => {
    await storeFor('run1').write('w1', 'unsaved work', null, new Date('2025-03-01T10:00:00Z'));
    await storeFor('run2').claimLeftover('w7');
    expect((await storeFor('run3').claimLeftover('w1'))?.text).toBe('unsaved work');
  });

  it('gives each window its own copy, newest offered first', async () => {
    const crashed = storeFor('run1');
    await crashed.write('w1', 'older', null, new Date('2025-03-01T10:00:00Z'));
    await crashed.write('w2', 'newer', '/p/b.spcritic', new Date('2025-03-01T11:00:00Z'));
    const next = storeFor('run2');
    expect(await next.leftoverCount()).toBe(2);
    expect((await next.claimLeftover('w1'))?.text).toBe('newer');
    expect((await next.claimLeftover('w2'))?.text).toBe('older');
  });

  it('replaces the copy atomically on each write (one file per window)', async () => {
    const store = storeFor('run1');
    await store.write('w1', 'first', null, new Date('2025-03-01T10:00:00Z'));
    await store.write('w1', 'second', null, new Date('2025-03-01T10:01:00Z'));
    expect(await readdir(join(state, 'recovery'))).toEqual(['run1.w1.json']);
    expect(JSON.parse(await readFile(join(state, 'recovery', 'run1.w1.json'), 'utf8')).text).toBe('second');
  });

  it('does not claim a leftover into a window that already has a copy of its own', async () => {
    await storeFor('run1').write('w1', 'leftover', null, new Date('2025-03-01T10:00:00Z'));
    const next = storeFor('run2');
    await next.write('w1', 'mine', null, new Date('2025-03-01T12:00:00Z'));
    expect(await next.claimLeftover('w1')).toBeNull();
    expect((await next.claimLeftover('w2'))?.text).toBe('leftover');
  });

  it('sets an unreadable copy aside, reports it, and never deletes it', async () => {
    await mkdir(join(state, 'recovery'), { recursive: true });
    await writeFile(join(state, 'recovery', 'run0.w1.json'), '{ truncated');
    expect(await storeFor('run2').claimLeftover('w1')).toBeNull();
    expect(await readdir(join(state, 'recovery'))).toEqual(['run0.w1.json.unreadable']);
    expect(reports).toHaveLength(1);
    expect(reports[0]).toContain('could not be read');
  });

  it('refuses slot names that are not plain file names', async () => {
    await expect(storeFor('run1').write('../escape', 'x', null, new Date())).rejects.toThrow('recovery slot: expected 1–64 letters');
    expect(() => storeFor('run/1')).toThrow('recovery run id');
  });
});
