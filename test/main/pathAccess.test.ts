import { describe, expect, it } from 'vitest';
import { createPathAccess, resolveDataPath } from '../../src/main/pathAccess';
import { pathKey, samePath } from '../../src/main/pathIdentity';

// The rule is the issue's ("file reads only of paths the user chose or the open project
// references"); resolution follows node:path resolve (POSIX.1-2017 pathname resolution for `.`/`..`,
// Win32 path rules for drive letters and backslashes).
describe('path allow-list (POSIX paths)', () => {
  const project = '/home/ana/plants/tank.spcritic';
  const access = () => {
    const a = createPathAccess('posix');
    a.grantProject(project, 'logs/levels.csv');
    return a;
  };

  it('allows exactly the data file the project references, however it is spelled', () => {
    for (const spelling of ['logs/levels.csv', './logs/levels.csv', 'logs/./levels.csv', 'logs/../logs/levels.csv', '/home/ana/plants/logs/levels.csv']) {
      expect(access().projectData(project, spelling)).toEqual({ allowed: true, path: '/home/ana/plants/logs/levels.csv' });
    }
  });

  it('refuses traversal and every other file, naming what was asked', () => {
    const attempts = [
      '../../../etc/passwd',
      'logs/../../../../etc/shadow',
      'logs/levels.csv/../../secret.csv',
      '/etc/passwd',
      'logs/other.csv',
      'logs/levels.csv.bak',
      '%2e%2e/%2e%2e/etc/passwd', // no percent-decoding: a literal (non-existent) name, still not the referenced file
      'LOGS/LEVELS.CSV', // case matters on POSIX file systems
    ];
    for (const attempt of attempts) {
      const decision = access().projectData(project, attempt);
      expect(decision.allowed, attempt).toBe(false);
      if (!decision.allowed) expect(decision.message).toContain(`"${attempt}"`);
    }
  });

  it('allows a data path with .. when the project itself says so — that file and no other', () => {
    const a = createPathAccess('posix');
    a.grantProject(project, '../shared/levels.csv');
    expect(a.projectData(project, '../shared/levels.csv')).toEqual({ allowed: true, path: '/home/ana/shared/levels.csv' });
    expect(a.projectData(project, '../shared/pressures.csv').allowed).toBe(false);
    expect(a.projectData(project, '../shared/../../../etc/passwd').allowed).toBe(false);
  });

  it('refuses the data of a project that was never opened or saved', () => {
    const decision = access().projectData('/home/ana/plants/other.spcritic', 'logs/levels.csv');
    expect(decision.allowed).toBe(false);
    if (!decision.allowed) expect(decision.message).toContain('not a project opened or saved');
  });

  it('allows a file the user chose in a dialog, from any project', () => {
    const a = access();
    expect(a.mayRead('/data/new-log.csv')).toBe(false);
    a.grantFile('/data/new-log.csv');
    expect(a.mayRead('/data/new-log.csv')).toBe(true);
    expect(a.projectData(project, '../../../../data/new-log.csv')).toEqual({ allowed: true, path: '/data/new-log.csv' });
    expect(a.mayRead('/data/new-log.csv.bak')).toBe(false);
  });

  it('keeps every data path a project referenced in the session (after a relocation too)', () => {
    const a = access();
    a.grantProject(project, 'moved/levels.csv');
    expect(a.projectData(project, 'moved/levels.csv').allowed).toBe(true);
    expect(a.projectData(project, 'logs/levels.csv').allowed).toBe(true);
    expect(a.isProject(project)).toBe(true);
  });
});

describe('path allow-list (Windows paths)', () => {
  const project = 'C:\\Users\\Ana\\Plants\\tank.spcritic';

  it('resolves forward and back slashes alike and ignores letter case', () => {
    const a = createPathAccess('win32');
    a.grantProject(project, 'logs/levels.csv');
    expect(a.projectData(project, 'logs\\levels.csv')).toEqual({ allowed: true, path: 'C:\\Users\\Ana\\Plants\\logs\\levels.csv' });
    expect(a.projectData(project, 'LOGS/Levels.CSV').allowed).toBe(true);
    expect(a.projectData('c:\\users\\ana\\plants\\TANK.spcritic', 'logs/levels.csv').allowed).toBe(true);
  });

  it('refuses traversal with either separator, other drives and UNC paths', () => {
    const a = createPathAccess('win32');
    a.grantProject(project, 'logs/levels.csv');
    for (const attempt of ['..\\..\\..\\Windows\\win.ini', 'logs\\..\\..\\..\\secret.csv', '../../../Windows/System32/config/SAM', 'D:\\logs\\levels.csv', '\\\\server\\share\\levels.csv', 'D:logs\\levels.csv']) {
      expect(a.projectData(project, attempt).allowed, attempt).toBe(false);
    }
  });

  it('compares paths case-insensitively only on Windows', () => {
    expect(samePath('C:\\A\\b.csv', 'c:/a/B.CSV', 'win32')).toBe(true);
    expect(samePath('/a/b.csv', '/A/b.csv', 'posix')).toBe(false);
    expect(pathKey('/a/./b/../c.csv', 'posix')).toBe('/a/c.csv');
    expect(resolveDataPath('/p/x.spcritic', '../d.csv', 'posix')).toBe('/d.csv');
  });
});
