/**
 * The Dialogs of the app service, answered by the test instead of a person. Each `next…` answer is
 * used once, then reset: a dialog the test did not script answers as if the user cancelled
 * (null, or 'cancel' for the unsaved-changes question). Every question is recorded in `asked`.
 */
import type { ExportKind } from '../../../src/shared/appApi';
import type { ChangedOnDiskChoice, Dialogs, UnsavedChangesChoice } from '../../../src/main/dialogs';

export type AskedDialog =
  | { dialog: 'openProject'; answer: string | null }
  | { dialog: 'openData'; answer: string | null }
  | { dialog: 'saveProject'; suggestedName: string; answer: string | null }
  | { dialog: 'export'; kind: ExportKind; suggestedName: string; answer: string | null }
  | { dialog: 'confirmUnsavedChanges'; documentName: string; answer: UnsavedChangesChoice }
  | { dialog: 'confirmReplaceChanged'; fileName: string; answer: ChangedOnDiskChoice };

export class ScriptedDialogs implements Dialogs {
  /** Absolute path the next "Open project" dialog returns. */
  nextOpenProject: string | null = null;
  /** Absolute path the next "Choose data file" dialog returns (chooseDataFile and relocateDataFile). */
  nextOpenData: string | null = null;
  /** Absolute path the next "Save project" dialog returns (saveProject with no path, saveProjectAs). */
  nextSave: string | null = null;
  /** Absolute path the next export dialog returns. */
  nextExport: string | null = null;
  /** The answer to the next "save changes before closing?" question. */
  nextConfirm: UnsavedChangesChoice = 'cancel';
  /** The answer to the next "changed by another program: replace?" question. */
  nextReplaceChanged: ChangedOnDiskChoice = 'cancel';
  readonly asked: AskedDialog[] = [];

  async showOpenProject(): Promise<string | null> {
    const answer = this.nextOpenProject;
    this.nextOpenProject = null;
    this.asked.push({ dialog: 'openProject', answer });
    return answer;
  }

  async showOpenData(): Promise<string | null> {
    const answer = this.nextOpenData;
    this.nextOpenData = null;
    this.asked.push({ dialog: 'openData', answer });
    return answer;
  }

  async showSaveProject(suggestedName: string): Promise<string | null> {
    const answer = this.nextSave;
    this.nextSave = null;
    this.asked.push({ dialog: 'saveProject', suggestedName, answer });
    return answer;
  }

  async showExport(kind: ExportKind, suggestedName: string): Promise<string | null> {
    const answer = this.nextExport;
    this.nextExport = null;
    this.asked.push({ dialog: 'export', kind, suggestedName, answer });
    return answer;
  }

  async confirmUnsavedChanges(documentName: string): Promise<UnsavedChangesChoice> {
    const answer = this.nextConfirm;
    this.nextConfirm = 'cancel';
    this.asked.push({ dialog: 'confirmUnsavedChanges', documentName, answer });
    return answer;
  }

  async confirmReplaceChanged(fileName: string): Promise<ChangedOnDiskChoice> {
    const answer = this.nextReplaceChanged;
    this.nextReplaceChanged = 'cancel';
    this.asked.push({ dialog: 'confirmReplaceChanged', fileName, answer });
    return answer;
  }
}
