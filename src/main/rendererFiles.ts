/**
 * The body of the setpoint-app:// protocol handler: the file rendererResponse() names, read from
 * the built renderer folder, as a Fetch API Response with the app's headers. Node-only (global
 * Response, Node 18+), so it is unit-tested without Electron.
 */
import { readFile } from 'node:fs/promises';
import { join } from 'node:path';
import { APP_ORIGIN, rendererResponse, responseHeaders } from './rendererProtocol';

export async function serveRendererFile(requestUrl: string, rendererFolder: string, origin: string = APP_ORIGIN): Promise<Response> {
  const mapped = rendererResponse(requestUrl, origin);
  if (mapped.kind === 'refused') return new Response(mapped.reason, { status: mapped.status, headers: mapped.headers });
  try {
    const body = await readFile(join(rendererFolder, ...mapped.relativePath.split('/')));
    return new Response(new Uint8Array(body), { status: 200, headers: mapped.headers });
  } catch {
    return new Response(`not found: ${mapped.relativePath}`, { status: 404, headers: responseHeaders('text/plain; charset=utf-8') });
  }
}
