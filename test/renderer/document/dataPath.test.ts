/**
 * The data path stored in a project, checked against Node's own path module (an independent
 * implementation): path.posix.relative and path.win32.relative, with forward slashes.
 */
import { posix, win32 } from 'node:path';
import { describe, expect, it } from 'vitest';
import { fileNameOf, isAbsolutePath, relativeDataPath } from '../../../src/renderer/src/document/dataPath';

const POSIX_CASES: [string, string][] = [
  ['/home/eng/plant/tanks.spcritic', '/home/eng/plant/tanks.csv'],
  ['/home/eng/plant/tanks.spcritic', '/home/eng/plant/logs/2024/tanks.csv'],
  ['/home/eng/plant/reviews/tanks.spcritic', '/home/eng/plant/tanks.csv'],
  ['/tmp/spc-work-1/a.spcritic', '/work/main/sample-projects/tank-levels/tank-levels.csv'],
  ['/a.spcritic', '/data/x.csv'],
];

const WINDOWS_CASES: [string, string][] = [
  ['C:\\Users\\eng\\plant\\tanks.spcritic', 'C:\\Users\\eng\\plant\\tanks.csv'],
  ['C:\\Users\\eng\\plant\\reviews\\tanks.spcritic', 'C:\\Users\\eng\\logs\\tanks.csv'],
  ['C:\\Users\\Eng\\Plant\\tanks.spcritic', 'c:\\users\\eng\\plant\\data\\tanks.csv'],
];

describe('relativeDataPath', () => {
  it.each(POSIX_CASES)('POSIX %s → %s agrees with path.posix.relative', (project, data) => {
    expect(relativeDataPath(project, data)).toBe(posix.relative(posix.dirname(project), data));
  });

  it.each(WINDOWS_CASES)('Windows %s → %s agrees with path.win32.relative (forward slashes)', (project, data) => {
    const expected = win32.relative(win32.dirname(project), data).replace(/\\/g, '/');
    expect(relativeDataPath(project, data).toLowerCase()).toBe(expected.toLowerCase());
  });

  it('keeps a data file on another drive absolute (no relative path reaches it)', () => {
    expect(relativeDataPath('C:\\p\\x.spcritic', 'D:\\logs\\x.csv')).toBe('D:/logs/x.csv');
  });

  it('names files and tells absolute paths', () => {
    expect(fileNameOf('/a/b/tanks.csv')).toBe('tanks.csv');
    expect(fileNameOf('C:\\a\\tanks.csv')).toBe('tanks.csv');
    expect(isAbsolutePath('/a')).toBe(true);
    expect(isAbsolutePath('C:\\a')).toBe(true);
    expect(isAbsolutePath('logs/a.csv')).toBe(false);
  });
});
