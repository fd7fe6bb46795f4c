/**
 * When two paths name the same file, for the allow-list and the recent list. Lexical: resolve `.`
 * and `..`, then compare — case-insensitively on Windows, whose file systems ignore case (NTFS,
 * common practice). Pure over node:path's posix/win32 flavours, so both are tested on any host.
 */
import { posix, win32, type PlatformPath } from 'node:path';

export type PathFlavour = 'posix' | 'win32';

export function flavourOf(platform: NodeJS.Platform): PathFlavour {
  return platform === 'win32' ? 'win32' : 'posix';
}

export function pathApi(flavour: PathFlavour): PlatformPath {
  return flavour === 'win32' ? win32 : posix;
}

/** The comparison key of an absolute path. */
export function pathKey(path: string, flavour: PathFlavour): string {
  const resolved = pathApi(flavour).resolve(path);
  return flavour === 'win32' ? resolved.toLowerCase() : resolved;
}

export function samePath(a: string, b: string, flavour: PathFlavour): boolean {
  return pathKey(a, flavour) === pathKey(b, flavour);
}
