/**
 * The one API the renderer sees, exposed through contextBridge as `window.setpointCritic`. Every
 * method is a thin `ipcRenderer.invoke` on the channel declared in src/shared/ipcChannels.ts; the
 * main process validates the arguments and checks the sender. Uint8Array travels over IPC as is
 * (structured clone). A failed call rejects with an Error whose message names the file and what
 * went wrong — never a stack trace.
 *
 * Built as one CommonJS file (sandboxed preloads cannot load ES modules or node_modules), so it
 * imports only the channel names — no zod, no Node.
 */
import { contextBridge, ipcRenderer, type IpcRendererEvent } from 'electron';
import type { AppApi, MenuCommand, MenuCommandDetail } from '../shared/appApi';
import { DOCUMENT_STATE_CHANNEL, MENU_COMMAND_CHANNEL, invokeChannel, type ApiReply, type InvokeMethod } from '../shared/ipcChannels';

async function call<T>(method: InvokeMethod, ...args: unknown[]): Promise<T> {
  const reply = (await ipcRenderer.invoke(invokeChannel(method), ...args)) as ApiReply<T>;
  if (!reply.ok) throw new Error(reply.message);
  return reply.value;
}

const api: AppApi = {
  host: 'electron',
  openProjectDialog: () => call('openProjectDialog'),
  openRecentProject: (path) => call('openRecentProject', path),
  recentProjects: () => call('recentProjects'),
  chooseDataFile: (projectPath) => call('chooseDataFile', projectPath),
  readProjectData: (projectPath, relativePath) => call('readProjectData', projectPath, relativePath),
  relocateDataFile: (projectPath) => call('relocateDataFile', projectPath),
  saveProject: (text, path, suggestedName) => call('saveProject', text, path, suggestedName),
  saveProjectAs: (text, suggestedName) => call('saveProjectAs', text, suggestedName),
  writeRecovery: (text, projectPath) => call('writeRecovery', text, projectPath),
  pendingRecovery: () => call('pendingRecovery'),
  discardRecovery: () => call('discardRecovery'),
  exportFile: (kind, suggestedName, bytes) => call('exportFile', kind, suggestedName, bytes),
  saveReportPdf: (html, suggestedName) => call('saveReportPdf', html, suggestedName),
  printReport: (html) => call('printReport', html),
  setDocumentState: (state) => ipcRenderer.send(DOCUMENT_STATE_CHANNEL, { name: state.name, dirty: state.dirty }),
  onMenuCommand(listener) {
    // Wrap so the renderer never receives the IpcRendererEvent (it exposes ipcRenderer itself).
    const handler = (_event: IpcRendererEvent, command: MenuCommand, detail?: MenuCommandDetail) => listener(command, detail);
    ipcRenderer.on(MENU_COMMAND_CHANNEL, handler);
    return () => {
      ipcRenderer.removeListener(MENU_COMMAND_CHANNEL, handler);
    };
  },
};

contextBridge.exposeInMainWorld('setpointCritic', api);
