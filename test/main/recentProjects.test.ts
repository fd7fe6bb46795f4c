import { mkdtemp, mkdir, readdir, readFile, rm, writeFile } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterEach, beforeEach, describe, expect, it } from 'vitest';
import { createFileStore } from '../../src/main/fileStore';
import { nodeFileSystem } from '../../src/main/fileSystem';
import { RECENT_PROJECTS_FILE, RECENT_PROJECTS_MAX, createRecentProjects, withRecent } from '../../src/main/recentProjects';

// The issue is the spec: most recent first, at most ten, no duplicates; a corrupt state file is
// reported and replaced, never a crash.
describe('recent projects (pure)', () => {
  it('puts the newest first and removes duplicates', () => {
    expect(withRecent(['/a', '/b', '/c'], '/b', 'posix')).toEqual(['/b', '/a', '/c']);
    expect(withRecent(['/a'], '/x/../a', 'posix')).toEqual(['/x/../a']);
    expect(withRecent(['C:\\P\\a.spcritic'], 'c:/p/A.spcritic', 'win32')).toEqual(['c:/p/A.spcritic']);
    expect(withRecent(['/P/a'], '/p/a', 'posix')).toEqual(['/p/a', '/P/a']);
  });

  it('keeps at most ten', () => {
    let list: string[] = [];
    for (let i = 0; i < 15; i++) list = withRecent(list, `/p/${i}.spcritic`, 'posix');
    expect(RECENT_PROJECTS_MAX).toBe(10);
    expect(list).toHaveLength(10);
    expect(list[0]).toBe('/p/14.spcritic');
    expect(list[9]).toBe('/p/5.spcritic');
  });
});

describe('recent projects (persisted)', () => {
  let state: string;
  const reports: string[] = [];
  const open = () => createRecentProjects({ fs: nodeFileSystem, store: createFileStore(nodeFileSystem), stateFolder: state, flavour: 'posix', report: (m) => reports.push(m) });
  beforeEach(async () => {
    state = await mkdtemp(join(tmpdir(), 'spc-recent-'));
    reports.length = 0;
  });
  afterEach(() => rm(state, { recursive: true, force: true }));

  it('starts empty and persists across runs', async () => {
    expect(await open().list()).toEqual([]);
    const recent = open();
    await recent.add('/p/a.spcritic');
    await recent.add('/p/b.spcritic');
    await recent.add('/p/a.spcritic');
    expect(await open().list()).toEqual(['/p/a.spcritic', '/p/b.spcritic']);
    expect(await open().includes('/p/./b.spcritic')).toBe(true);
    expect(reports).toEqual([]);
  });

  it('creates the state folder when it does not exist yet', async () => {
    const nested = createRecentProjects({ fs: nodeFileSystem, store: createFileStore(nodeFileSystem), stateFolder: join(state, 'new', 'folder'), flavour: 'posix', report: () => undefined });
    await nested.add('/p/a.spcritic');
    expect(JSON.parse(await readFile(join(state, 'new', 'folder', RECENT_PROJECTS_FILE), 'utf8'))).toEqual({ recentProjects: ['/p/a.spcritic'] });
  });

  it.each(['{ not json', '{"recentProjects": "oops"}', '[1,2,3]', '{"recentProjects": [42]}', ''])('replaces a corrupt file (%j) with an empty list, keeping it aside', async (text) => {
    await mkdir(state, { recursive: true });
    await writeFile(join(state, RECENT_PROJECTS_FILE), text);
    const recent = open();
    expect(await recent.list()).toEqual([]);
    expect(reports).toHaveLength(1);
    expect(reports[0]).toContain('was not a valid list');
    await recent.add('/p/a.spcritic');
    expect((await readdir(state)).sort()).toEqual([RECENT_PROJECTS_FILE, `${RECENT_PROJECTS_FILE}.unreadable`]);
    expect(await open().list()).toEqual(['/p/a.spcritic']);
  });

  it('tells a listener when the list changes (the menu is rebuilt)', async () => {
    const seen: (readonly string[])[] = [];
    const recent = createRecentProjects({ fs: nodeFileSystem, store: createFileStore(nodeFileSystem), stateFolder: state, flavour: 'posix', report: () => undefined, onChange: (l) => seen.push(l) });
    await recent.add('/p/a.spcritic');
    expect(seen).toEqual([['/p/a.spcritic']]);
  });
});
