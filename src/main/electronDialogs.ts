/**
 * The Dialogs interface over Electron's native dialogs, parented to one window (so they are sheets
 * on macOS and modal elsewhere). Thin: the choices they lead to are the app service's.
 */
import { homedir } from 'node:os';
import { join } from 'node:path';
import { app, dialog, type BrowserWindow, type FileFilter } from 'electron';
import type { ExportKind } from '../shared/appApi';
import { UNSAVED_CANCEL_BUTTON, UNSAVED_CHANGES_BUTTONS, UNSAVED_DEFAULT_BUTTON, choiceForButton, unsavedChangesQuestion } from './closeGuard';
import type { ChangedOnDiskChoice, Dialogs } from './dialogs';

const CHANGED_ON_DISK_BUTTONS: { label: string; choice: ChangedOnDiskChoice }[] = [
  { label: 'Replace', choice: 'replace' }, { label: 'Save As…', choice: 'saveAs' }, { label: 'Cancel', choice: 'cancel' },
];

const PROJECT_FILTERS: FileFilter[] = [{ name: 'Setpoint Critic projects', extensions: ['spcritic'] }];
const DATA_FILTERS: FileFilter[] = [{ name: 'Logged data (CSV)', extensions: ['csv', 'tsv', 'txt'] }, { name: 'All files', extensions: ['*'] }];
const EXPORT_FILTERS: Record<ExportKind, FileFilter[]> = {
  png: [{ name: 'PNG image', extensions: ['png'] }],
  svg: [{ name: 'SVG image', extensions: ['svg'] }],
  csv: [{ name: 'CSV table', extensions: ['csv'] }],
  html: [{ name: 'HTML report', extensions: ['html', 'htm'] }],
  pdf: [{ name: 'PDF document', extensions: ['pdf'] }],
};

function documentsFolder(): string {
  try {
    return app.getPath('documents');
  } catch {
    return homedir();
  }
}

export function createElectronDialogs(window: BrowserWindow): Dialogs {
  async function open(title: string, filters: FileFilter[]): Promise<string | null> {
    const result = await dialog.showOpenDialog(window, { title, filters, properties: ['openFile'] });
    return result.canceled ? null : (result.filePaths[0] ?? null);
  }
  async function save(title: string, suggestedName: string, filters: FileFilter[]): Promise<string | null> {
    const result = await dialog.showSaveDialog(window, {
      title,
      defaultPath: join(documentsFolder(), suggestedName),
      filters,
      properties: ['createDirectory', 'showOverwriteConfirmation'],
    });
    return result.canceled || !result.filePath ? null : result.filePath;
  }
  return {
    showOpenProject: () => open('Open project', PROJECT_FILTERS),
    showOpenData: () => open('Choose the logged data', DATA_FILTERS),
    showSaveProject: (suggestedName) => save('Save project', suggestedName, PROJECT_FILTERS),
    showExport: (kind, suggestedName) => save(`Export ${kind.toUpperCase()}`, suggestedName, EXPORT_FILTERS[kind]),
    async confirmUnsavedChanges(documentName) {
      const question = unsavedChangesQuestion(documentName);
      const { response } = await dialog.showMessageBox(window, {
        type: 'warning',
        buttons: UNSAVED_CHANGES_BUTTONS.map((b) => b.label),
        defaultId: UNSAVED_DEFAULT_BUTTON,
        cancelId: UNSAVED_CANCEL_BUTTON,
        noLink: true,
        ...question,
      });
      return choiceForButton(response);
    },
    async confirmReplaceChanged(fileName) {
      const { response } = await dialog.showMessageBox(window, {
        type: 'warning',
        buttons: CHANGED_ON_DISK_BUTTONS.map((b) => b.label),
        defaultId: 2,
        cancelId: 2,
        noLink: true,
        message: `“${fileName}” was changed by another program since you opened it`,
        detail: 'Replacing it loses those changes (the version on disk is kept as a .bak file). Save As keeps both.',
      });
      return CHANGED_ON_DISK_BUTTONS[response]?.choice ?? 'cancel';
    },
  };
}
