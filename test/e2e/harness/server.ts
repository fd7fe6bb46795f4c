/**
 * The e2e stand-in for Electron: a Node http server on 127.0.0.1 (random port) that
 *   - serves out/renderer through the app's own rendererResponse() — the same file mapping, CSP and
 *     cross-origin isolation headers as the setpoint-app:// protocol handler — and
 *   - answers POST /__api/<method> with the real app service (file store, recovery, recent list,
 *     allow-list) through the same dispatchApiCall() the IPC handlers use, so argument validation
 *     runs too. Bodies are `{ "args": [...] }`, replies an ApiReply; bytes travel as base64.
 * The "sender check" here is the Origin header: only the server's own origin is answered.
 */
import { readFile } from 'node:fs/promises';
import { createServer, type IncomingMessage, type ServerResponse } from 'node:http';
import type { AddressInfo } from 'node:net';
import { join } from 'node:path';
import type { SaveReply } from '../../../src/shared/appApi';
import { validateDocumentState } from '../../../src/shared/ipcChannels';
import { dispatchApiCall } from '../../../src/main/apiDispatch';
import { createAppContext } from '../../../src/main/appContext';
import { isAppUrl } from '../../../src/main/appOrigin';
import { createAppService, type AppService } from '../../../src/main/appService';
import { createHeadlessPrinter, type HeadlessPrinter } from './headlessPrinter';
import { rendererResponse } from '../../../src/main/rendererProtocol';
import { ScriptedDialogs } from './scriptedDialogs';
import { fromWire, toWire } from './wireCodec';

export interface ApiCallRecord {
  method: string;
  ok: boolean;
  /** The error message when ok is false. */
  message?: string;
}

export interface HarnessServer {
  origin: string;
  dialogs: ScriptedDialogs;
  /** Writes PDFs with the test's Chromium and records what was printed. */
  printer: HeadlessPrinter;
  service: AppService;
  stateFolder: string;
  /** Every API call the page made, in order. */
  apiCalls: ApiCallRecord[];
  /** Problems the app service reported (replaced state files and the like). */
  reports: string[];
  /** Subscribe to save outcomes (used by the close sequence); returns the unsubscribe function. */
  onSaveReply(listener: (reply: SaveReply) => void): () => void;
  close(): Promise<void>;
}

const MAX_BODY_BYTES = 768 * 1024 * 1024;

export async function startHarnessServer(options: { rendererFolder: string; stateFolder: string }): Promise<HarnessServer> {
  const dialogs = new ScriptedDialogs();
  const reports: string[] = [];
  const apiCalls: ApiCallRecord[] = [];
  const saveListeners = new Set<(reply: SaveReply) => void>();
  const context = createAppContext({ stateFolder: options.stateFolder, report: (m) => reports.push(m) });
  const printer = createHeadlessPrinter();
  const service = createAppService(context, { slot: 'browser', dialogs, printer, onSaveReply: (reply) => saveListeners.forEach((l) => l(reply)) });
  let origin = '';

  const server = createServer((request, response) => {
    handle(request, response).catch((e: unknown) => {
      if (!response.headersSent) response.writeHead(500, { 'Content-Type': 'text/plain' });
      response.end(`harness server: ${String(e)}`);
    });
  });

  async function handle(request: IncomingMessage, response: ServerResponse): Promise<void> {
    const url = request.url ?? '/';
    if (request.method === 'POST' && url.startsWith('/__api/')) return answerApi(request, response, decodeURIComponent(url.slice('/__api/'.length)));
    if (request.method !== 'GET' && request.method !== 'HEAD') return void response.writeHead(405).end();
    const mapped = rendererResponse(`${origin}${url}`, origin);
    if (mapped.kind === 'refused') return void response.writeHead(mapped.status, mapped.headers).end(mapped.reason);
    let body: Buffer;
    try {
      body = await readFile(join(options.rendererFolder, ...mapped.relativePath.split('/')));
    } catch {
      return void response.writeHead(404, rendererResponse(`${origin}/missing.txt`, origin).headers).end(`not found: ${mapped.relativePath}`);
    }
    response.writeHead(200, mapped.headers).end(request.method === 'HEAD' ? undefined : body);
  }

  async function answerApi(request: IncomingMessage, response: ServerResponse, method: string): Promise<void> {
    if (!isAppUrl(`${request.headers.origin ?? ''}/`, origin)) return void response.writeHead(403).end('refused: not the app origin');
    const body = fromWire(JSON.parse(await readBody(request))) as { args?: unknown };
    let reply: unknown;
    if (method === 'setDocumentState') {
      try {
        service.setDocumentState(validateDocumentState((body.args as unknown[] | undefined)?.[0]));
        reply = { ok: true, value: null };
      } catch (e) {
        reply = { ok: false, message: (e as Error).message };
      }
    } else {
      reply = await dispatchApiCall(service, method, body.args, (e) => reports.push(`unexpected: ${String(e)}`));
    }
    const { ok, message } = reply as { ok: boolean; message?: string };
    apiCalls.push(ok ? { method, ok } : { method, ok, message });
    response.writeHead(200, { 'Content-Type': 'application/json' }).end(JSON.stringify(toWire(reply)));
  }

  await new Promise<void>((resolve) => server.listen(0, '127.0.0.1', resolve));
  origin = `http://127.0.0.1:${(server.address() as AddressInfo).port}`;

  return {
    origin,
    dialogs,
    printer,
    service,
    stateFolder: options.stateFolder,
    apiCalls,
    reports,
    onSaveReply(listener) {
      saveListeners.add(listener);
      return () => saveListeners.delete(listener);
    },
    close: () => new Promise<void>((resolve) => {
      server.closeAllConnections();
      server.close(() => resolve());
    }),
  };
}

function readBody(request: IncomingMessage): Promise<string> {
  return new Promise((resolve, reject) => {
    const chunks: Buffer[] = [];
    let size = 0;
    request.on('data', (chunk: Buffer) => {
      size += chunk.length;
      if (size > MAX_BODY_BYTES) request.destroy(new Error('request body too large'));
      else chunks.push(chunk);
    });
    request.on('end', () => resolve(Buffer.concat(chunks).toString('utf8')));
    request.on('error', reject);
  });
}
