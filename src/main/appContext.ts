/**
 * What every window's app service shares: the file system, the file store, the allow-list, the
 * recent list and the recovery store over one state folder. The Electron main process makes one
 * context per run; the e2e server makes one per launch.
 */
import { randomBytes } from 'node:crypto';
import { createFileStore, type FileStore } from './fileStore';
import { createFileVersions, type FileVersions } from './fileVersions';
import { nodeFileSystem, type FileSystem } from './fileSystem';
import { createPathAccess, type PathAccess } from './pathAccess';
import { flavourOf, type PathFlavour } from './pathIdentity';
import { createRecentProjects, type RecentProjects } from './recentProjects';
import { createRecoveryStore, type RecoveryStore } from './recoveryStore';

export interface AppContext {
  fs: FileSystem;
  store: FileStore;
  access: PathAccess;
  recent: RecentProjects;
  recovery: RecoveryStore;
  /** The version of each project file this app last read or wrote (a save asks when it changed). */
  versions: FileVersions;
  flavour: PathFlavour;
  /** Problems the user did not cause and need not act on now (a replaced state file); logged. */
  report: (message: string) => void;
  now: () => Date;
}

export interface AppContextOptions {
  stateFolder: string;
  fs?: FileSystem;
  platform?: NodeJS.Platform;
  runId?: string;
  report?: (message: string) => void;
  /** Told whenever the recent list changes (the menu's Open Recent is rebuilt). */
  onRecentChange?: (list: readonly string[]) => void;
  now?: () => Date;
}

export function createAppContext(options: AppContextOptions): AppContext {
  const fs = options.fs ?? nodeFileSystem;
  const store = createFileStore(fs);
  const flavour = flavourOf(options.platform ?? process.platform);
  const report = options.report ?? ((message: string) => console.warn(message));
  const runId = options.runId ?? `${Date.now().toString(36)}-${randomBytes(4).toString('hex')}`;
  return {
    fs,
    store,
    access: createPathAccess(flavour),
    recent: createRecentProjects({ fs, store, stateFolder: options.stateFolder, flavour, report, onChange: options.onRecentChange }),
    recovery: createRecoveryStore({ fs, store, stateFolder: options.stateFolder, runId, report }),
    versions: createFileVersions(flavour),
    flavour,
    report,
    now: options.now ?? (() => new Date()),
  };
}
