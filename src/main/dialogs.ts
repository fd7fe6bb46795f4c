/**
 * The native dialogs the app service needs, as an interface: Electron's dialog module implements it
 * in the app (electronDialogs.ts), the e2e harness scripts it. Each returns the chosen absolute
 * path, or null when the user cancelled.
 */
import type { ExportKind } from '../shared/appApi';

/** The answer to "save changes before closing?". */
export type UnsavedChangesChoice = 'save' | 'discard' | 'cancel';

/** The answer to "another program changed this project since you opened it: replace it?". */
export type ChangedOnDiskChoice = 'replace' | 'saveAs' | 'cancel';

export interface Dialogs {
  showOpenProject(): Promise<string | null>;
  showOpenData(): Promise<string | null>;
  showSaveProject(suggestedName: string): Promise<string | null>;
  showExport(kind: ExportKind, suggestedName: string): Promise<string | null>;
  /** Closing or quitting with unsaved changes: Save / Don't save / Cancel. */
  confirmUnsavedChanges(documentName: string): Promise<UnsavedChangesChoice>;
  /** Saving over a project file that another program changed since this app read or wrote it: Replace / Save As… / Cancel. */
  confirmReplaceChanged(fileName: string): Promise<ChangedOnDiskChoice>;
}
