/**
 * The data file's path as the project stores it: relative to the project file's folder, with
 * forward slashes, so a project folder can be moved or shared as a whole. Windows paths (drive
 * letters, backslashes, case-insensitive names) and POSIX paths are both handled; a data file on
 * another drive cannot be reached relatively and keeps its absolute path.
 */
const WINDOWS_PATH = /^(?:[a-zA-Z]:[\\/]|\\\\)/;

function parts(path: string): string[] {
  return path.replace(/\\/g, '/').split('/').filter((part) => part !== '' && part !== '.');
}

function folderParts(filePath: string): string[] {
  return parts(filePath).slice(0, -1);
}

export function isAbsolutePath(path: string): boolean {
  return path.startsWith('/') || WINDOWS_PATH.test(path);
}

/** dataFile relative to the folder of projectFile (both absolute). */
export function relativeDataPath(projectFile: string, dataFile: string): string {
  const windows = WINDOWS_PATH.test(projectFile);
  const same = (a: string, b: string): boolean => (windows ? a.toLowerCase() === b.toLowerCase() : a === b);
  const from = folderParts(projectFile), to = parts(dataFile);
  if (windows && !same(from[0] ?? '', to[0] ?? '')) return dataFile.replace(/\\/g, '/');
  let common = 0;
  while (common < from.length && common < to.length - 1 && same(from[common], to[common])) common++;
  return [...from.slice(common).map(() => '..'), ...to.slice(common)].join('/');
}

/** The last part of a path (the file's name). */
export function fileNameOf(path: string): string {
  return parts(path).pop() ?? path;
}
