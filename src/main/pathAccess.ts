/**
 * The allow-list of files the main process may touch on the renderer's behalf (GUIDE §4; Electron
 * security checklist, "do not trust the renderer" — common practice). Every grant comes from
 * something the user did, never from text the renderer sends. A path is readable only if
 *   - the user chose it in a dialog (grantFile), or
 *   - it is a project file the user opened, saved or recovered (grantProject; the recent list is
 *     checked by the app service), or
 *   - a project the user opened references it: the data path written in the file as it was read
 *     from disk, resolved against the project's folder. Exactly the file the project names is
 *     allowed — whatever `..` it contains is resolved first, and a different request that merely
 *     resolves inside the same folder is refused.
 * A save passes on only what is already allowed (carryData): the project text a renderer saves can
 * never make a new file readable, so a compromised renderer cannot save `"path": "/home/u/.ssh/id_rsa"`
 * and then read it.
 * Lexical resolution (node:path resolve), case-insensitive on Windows.
 */
import { pathApi, pathKey, type PathFlavour } from './pathIdentity';

export type DataAccess = { allowed: true; path: string } | { allowed: false; path: string; message: string };

export interface PathAccess {
  /** The user chose this file in an open dialog. */
  grantFile(path: string): void;
  /** A project file the user opened or recovered, and the data path it references on disk (if any). */
  grantProject(projectPath: string, referencedDataPath: string | null): void;
  /**
   * A project file the user saved: it becomes a project, and the data path its text names is
   * allowed for it only if that file is readable already (chosen, or referenced by a project read
   * from disk). Returns the absolute data path carried, or null.
   */
  carryData(projectPath: string, dataPathInText: string | null): string | null;
  isProject(path: string): boolean;
  /** An absolute data path the user chose or an opened project references. */
  mayReadData(path: string): boolean;
  mayRead(path: string): boolean;
  /** Resolve a project's data path and decide whether it may be read. */
  projectData(projectPath: string, relativePath: string): DataAccess;
}

/** The absolute path a project's data path names: relative to the project's folder. */
export function resolveDataPath(projectPath: string, relativePath: string, flavour: PathFlavour): string {
  const api = pathApi(flavour);
  return api.resolve(api.dirname(projectPath), relativePath);
}

export function createPathAccess(flavour: PathFlavour): PathAccess {
  const chosenFiles = new Set<string>();
  // project key → keys of the data files it has referenced in this session
  const projects = new Map<string, Set<string>>();
  const key = (path: string) => pathKey(path, flavour);

  function grantProject(projectPath: string, referencedDataPath: string | null): void {
    const references = projects.get(key(projectPath)) ?? new Set<string>();
    if (referencedDataPath !== null) references.add(key(resolveDataPath(projectPath, referencedDataPath, flavour)));
    projects.set(key(projectPath), references);
  }

  function mayReadData(path: string): boolean {
    const k = key(path);
    if (chosenFiles.has(k)) return true;
    for (const references of projects.values()) if (references.has(k)) return true;
    return false;
  }

  function carryData(projectPath: string, dataPathInText: string | null): string | null {
    const carried = dataPathInText === null ? null : resolveDataPath(projectPath, dataPathInText, flavour);
    const allowed = carried !== null && mayReadData(carried);
    grantProject(projectPath, allowed ? carried : null);
    return allowed ? carried : null;
  }

  function projectData(projectPath: string, relativePath: string): DataAccess {
    const path = resolveDataPath(projectPath, relativePath, flavour);
    const references = projects.get(key(projectPath));
    if (!references) {
      return { allowed: false, path, message: `"${projectPath}" is not a project opened or saved in this session, so its data is not read.` };
    }
    if (references.has(key(path)) || chosenFiles.has(key(path))) return { allowed: true, path };
    return {
      allowed: false,
      path,
      message: `Setpoint Critic reads only files you chose or that your project names; "${relativePath}" (resolved to "${path}") is neither. Choose the data file again.`,
    };
  }

  return {
    grantFile: (path) => void chosenFiles.add(key(path)),
    grantProject,
    carryData,
    isProject: (path) => projects.has(key(path)),
    mayReadData,
    mayRead: (path) => chosenFiles.has(key(path)) || projects.has(key(path)),
    projectData,
  };
}
