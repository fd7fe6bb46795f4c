/**
 * One call from the renderer, whatever carried it (Electron IPC or the e2e test server): validate
 * the arguments with the shared schemas, run the app service method, and wrap the outcome in an
 * ApiReply. Expected failures keep their message (it names the file and what went wrong);
 * anything else becomes a one-line message — the stack goes to the log, never to the user.
 */
import { IpcArgumentError, isInvokeMethod, validateArguments, type ApiReply, type InvokeMethod } from '../shared/ipcChannels';
import { AccessDeniedError, type AppService } from './appService';
import { FileAccessError } from './fileErrors';
import { ReportPrintError } from './reportPrinting';

export async function dispatchApiCall(service: AppService, method: string, args: unknown, log: (error: unknown) => void = console.error): Promise<ApiReply<unknown>> {
  if (!isInvokeMethod(method)) return { ok: false, message: `There is no API method "${method}".` };
  try {
    const valid = validateArguments(method, args);
    const value = await (service[method] as (...a: unknown[]) => Promise<unknown>)(...valid);
    return { ok: true, value };
  } catch (e) {
    return { ok: false, message: messageFor(method, e, log) };
  }
}

function messageFor(method: InvokeMethod, error: unknown, log: (error: unknown) => void): string {
  if (error instanceof IpcArgumentError || error instanceof FileAccessError || error instanceof AccessDeniedError || error instanceof ReportPrintError) return error.message;
  log(error);
  const text = error instanceof Error ? error.message.split('\n')[0] : String(error);
  return `Unexpected problem in ${method}: ${text}`;
}
