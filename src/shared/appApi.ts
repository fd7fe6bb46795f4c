/**
 * The typed API the preload script exposes to the renderer as `window.setpointCritic`, and that
 * the main process implements over IPC. In the end-to-end tests the same interface is implemented
 * by the real main-process modules behind a local test server, so everything but Electron runs.
 *
 * Files only move on the user's say-so: the main process reads a path only if the user chose it in
 * a dialog, or the open project references it, or it is in the recent list.
 */

/** A project file as read by the main process. */
export interface ProjectFileReply {
  /** Absolute path of the project file. */
  path: string;
  text: string;
}

/** A data file the user picked (or that the project references), with its bytes. */
export interface DataFileReply {
  /** Absolute path. */
  path: string;
  /** The path relative to the project's folder (forward slashes) when a project path is known, else the absolute path. */
  relativePath: string;
  bytes: Uint8Array;
  /** SHA-256 of `bytes` (hex), hashed by the main process where it read them (Node's own), so the worker imports them without hashing them again. */
  sha256: string;
}

export type SaveReply = { saved: true; path: string } | { saved: false; reason: 'cancelled' } | { saved: false; reason: 'error'; message: string };

export interface RecoveryOffer {
  /** The project file the recovered text belongs to, or null for a never-saved project. */
  projectPath: string | null;
  text: string;
  /** ISO 8601 time the recovery copy was written. */
  savedAt: string;
}

export type ExportKind = 'png' | 'svg' | 'csv' | 'html' | 'pdf';

/** Commands the application menu sends to the renderer. */
export type MenuCommand =
  | 'new-project' | 'open-project' | 'open-recent-project' | 'save-project' | 'save-project-as' | 'close-project'
  | 'undo' | 'redo' | 'toggle-theme' | 'run-evaluation' | 'cancel-evaluation' | 'print-report' | 'save-report-pdf';

/** Sent with 'open-recent-project': the recent entry the user picked (pass it to openRecentProject). */
export interface MenuCommandDetail {
  path: string;
}

export interface AppApi {
  readonly host: 'electron' | 'browser';

  /** Show the open dialog (project files); null when cancelled. */
  openProjectDialog(): Promise<ProjectFileReply | null>;
  /** Open a project from the recent list. */
  openRecentProject(path: string): Promise<ProjectFileReply>;
  recentProjects(): Promise<string[]>;

  /** Show the open dialog (CSV files); relativePath is relative to projectPath when given. */
  chooseDataFile(projectPath: string | null): Promise<DataFileReply | null>;
  /** Read the data file a project references (relative to the project's folder). */
  readProjectData(projectPath: string, relativePath: string): Promise<DataFileReply>;
  /** Let the user point to a moved data file; returns it relative to the project. */
  relocateDataFile(projectPath: string): Promise<DataFileReply | null>;

  /** Save atomically to path (a path the user chose before), or ask for one when path is null. */
  saveProject(text: string, path: string | null, suggestedName: string): Promise<SaveReply>;
  /** Always ask for a path. */
  saveProjectAs(text: string, suggestedName: string): Promise<SaveReply>;

  /** Write the recovery copy of unsaved work (the renderer calls this every minute while dirty). */
  writeRecovery(text: string, projectPath: string | null): Promise<void>;
  /** A recovery copy left by a session that did not close cleanly, if any. */
  pendingRecovery(): Promise<RecoveryOffer | null>;
  discardRecovery(): Promise<void>;

  /** Ask for a destination and write an exported image or table; null when cancelled. */
  exportFile(kind: ExportKind, suggestedName: string, bytes: Uint8Array): Promise<{ path: string } | null>;
  /** The report (renderReport's HTML) written as PDF where the user says; null when cancelled. */
  saveReportPdf(html: string, suggestedName: string): Promise<{ path: string } | null>;
  /** The report sent to a printer through the system's print dialog; false when cancelled. */
  printReport(html: string): Promise<boolean>;

  /** Tell the window its project name and whether it has unsaved changes (title, close prompt). */
  setDocumentState(state: { name: string; dirty: boolean }): void;
  /** Subscribe to menu commands; returns the unsubscribe function. */
  onMenuCommand(listener: (command: MenuCommand, detail?: MenuCommandDetail) => void): () => void;
}

declare global {
  interface Window {
    setpointCritic?: AppApi;
  }
}
