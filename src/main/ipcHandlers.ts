/**
 * The IPC endpoints: one `ipcMain.handle` per AppApi method and one listener for the document
 * state. Each checks the sender (ipcSender.ts) and hands the raw arguments to dispatchApiCall,
 * which validates them with the shared zod schemas before the app service sees them.
 */
import { ipcMain, type IpcMainEvent, type IpcMainInvokeEvent, type WebContents } from 'electron';
import { DOCUMENT_STATE_CHANNEL, INVOKE_METHODS, invokeChannel, validateDocumentState } from '../shared/ipcChannels';
import { dispatchApiCall } from './apiDispatch';
import type { AppService } from './appService';
import { isTrustedSender } from './ipcSender';

export interface IpcHandlerOptions {
  appOrigin: string;
  /** The app service of the window these web contents belong to; null for anything else. */
  serviceFor(contents: WebContents): AppService | null;
}

const REFUSED = 'Refused: this request did not come from a Setpoint Critic window.';

export function registerIpcHandlers(options: IpcHandlerOptions): void {
  const trustedService = (event: IpcMainEvent | IpcMainInvokeEvent): AppService | null => {
    const frame = event.senderFrame;
    const trusted = isTrustedSender(frame ? { url: frame.url, isMainFrame: frame.parent === null } : null, options.appOrigin);
    return trusted ? options.serviceFor(event.sender) : null;
  };

  for (const method of INVOKE_METHODS) {
    ipcMain.handle(invokeChannel(method), (event, ...args: unknown[]) => {
      const service = trustedService(event);
      return service ? dispatchApiCall(service, method, args) : { ok: false, message: REFUSED };
    });
  }

  ipcMain.on(DOCUMENT_STATE_CHANNEL, (event, state: unknown) => {
    const service = trustedService(event);
    if (!service) return;
    try {
      service.setDocumentState(validateDocumentState(state));
    } catch (e) {
      console.warn((e as Error).message);
    }
  });
}
