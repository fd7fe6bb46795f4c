/**
 * The allow-list of files the main process may touch on the renderer's behalf (GUIDE §4; Electron
 * security checklist, "do not trust the renderer" — common practice). A path is readable only if
 *   - the user chose it in a dialog (grantFile), or
 *   - it is a project file the user opened, saved or recovered (grantProject; the recent list is
 *     checked by the app service), or
 *   - an open project references it: the project's data path, resolved against the project's
 *     folder. Exactly the file the project names is allowed — whatever `..` it contains is resolved
 *     first, and a different request that merely resolves inside the same folder is refused.
 * Lexical resolution (node:path resolve), case-insensitive on Windows.
 */
import { pathApi, pathKey, type PathFlavour } from './pathIdentity';

export type DataAccess = { allowed: true; path: string } | { allowed: false; path: string; message: string };

export interface PathAccess {
  /** The user chose this file in an open dialog. */
  grantFile(path: string): void;
  /** A project file the user opened, saved or recovered, and the data path it references (if any). */
  grantProject(projectPath: string, referencedDataPath: string | null): void;
  isProject(path: string): boolean;
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
    isProject: (path) => projects.has(key(path)),
    mayRead: (path) => chosenFiles.has(key(path)) || projects.has(key(path)),
    projectData,
  };
}
