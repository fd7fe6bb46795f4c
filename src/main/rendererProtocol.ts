/**
 * The renderer is served from a privileged scheme of our own, `setpoint-app://app/…`, not file://
 * (Electron security checklist, "Use a custom protocol instead of file://" — common practice), so
 * the page has a real origin, a Content-Security-Policy header and the cross-origin isolation
 * headers that SharedArrayBuffer — and with it TensorFlow.js's threaded wasm backend — requires.
 *
 * Pure: request URL → file under the renderer folder (or a refusal), MIME type and headers. The
 * Electron protocol handler and the e2e test server both use it, so the tests run under the same
 * policy as the app.
 */
import { posix } from 'node:path';

export const APP_SCHEME = 'setpoint-app';
export const APP_HOST = 'app';
export const APP_ORIGIN = `${APP_SCHEME}://${APP_HOST}`;
export const APP_ENTRY_URL = `${APP_ORIGIN}/index.html`;

/**
 * CSP Level 3 (W3C). 'wasm-unsafe-eval' lets WebAssembly compile without allowing JS eval; blob:
 * workers are how TF.js starts its wasm threads; frame-ancestors cannot be set from a <meta> tag.
 */
export const CONTENT_SECURITY_POLICY = [
  "default-src 'self'",
  "script-src 'self' 'wasm-unsafe-eval'",
  "worker-src 'self' blob:",
  "style-src 'self' 'unsafe-inline'",
  "img-src 'self' data: blob:",
  "connect-src 'self'",
  "object-src 'none'",
  "base-uri 'none'",
  "form-action 'none'",
  "frame-ancestors 'none'",
].join('; ');

/**
 * HTML Living Standard §7.1.3 (COOP) and §7.1.4 (COEP): a document is cross-origin isolated — and
 * gets SharedArrayBuffer — only with COOP same-origin and COEP require-corp; Fetch Standard §3.7
 * (CORP) lets our own subresources load under COEP.
 */
export const CROSS_ORIGIN_ISOLATION_HEADERS: Readonly<Record<string, string>> = {
  'Cross-Origin-Opener-Policy': 'same-origin',
  'Cross-Origin-Embedder-Policy': 'require-corp',
  'Cross-Origin-Resource-Policy': 'same-origin',
};

// Media types from the IANA registry (RFC 6838 procedures): text/javascript per RFC 9239,
// application/wasm per the WebAssembly Web API spec, application/json per RFC 8259,
// image/svg+xml per SVG 1.1, font/woff2 per RFC 8081, text/csv per RFC 4180.
const MIME_TYPES: Readonly<Record<string, string>> = {
  '.html': 'text/html; charset=utf-8',
  '.js': 'text/javascript; charset=utf-8',
  '.mjs': 'text/javascript; charset=utf-8',
  '.css': 'text/css; charset=utf-8',
  '.json': 'application/json',
  '.map': 'application/json',
  '.wasm': 'application/wasm',
  '.svg': 'image/svg+xml',
  '.png': 'image/png',
  '.jpg': 'image/jpeg',
  '.ico': 'image/vnd.microsoft.icon',
  '.woff2': 'font/woff2',
  '.woff': 'font/woff',
  '.ttf': 'font/ttf',
  '.csv': 'text/csv; charset=utf-8',
  '.txt': 'text/plain; charset=utf-8',
};

export function mimeTypeFor(fileName: string): string {
  return MIME_TYPES[posix.extname(fileName).toLowerCase()] ?? 'application/octet-stream';
}

/** Headers of every response the renderer gets, file or error. */
export function responseHeaders(mimeType: string): Record<string, string> {
  return {
    'Content-Type': mimeType,
    'Content-Security-Policy': CONTENT_SECURITY_POLICY,
    ...CROSS_ORIGIN_ISOLATION_HEADERS,
    'X-Content-Type-Options': 'nosniff',
    'Referrer-Policy': 'no-referrer',
    'Cache-Control': 'no-store',
  };
}

export type RendererResponse =
  | { kind: 'file'; relativePath: string; headers: Record<string, string> }
  | { kind: 'refused'; status: 400 | 404; reason: string; headers: Record<string, string> };

/**
 * Map `<origin>/<path>` to a file relative to the renderer folder (posix separators). `origin` is
 * APP_ORIGIN in the app and the test server's own origin in the e2e tests. Refuses other origins,
 * any `.`/`..`/empty segment after percent-decoding, backslashes, colons and NUL.
 */
export function rendererResponse(requestUrl: string, origin: string = APP_ORIGIN): RendererResponse {
  const refused = (status: 400 | 404, reason: string): RendererResponse => ({ kind: 'refused', status, reason, headers: responseHeaders('text/plain; charset=utf-8') });
  const path = pathWithinOrigin(requestUrl, origin);
  if (path === null) return refused(404, `not an app URL: ${requestUrl}`);
  let decoded: string;
  try {
    decoded = decodeURIComponent(path === '/' ? '/index.html' : path);
  } catch {
    return refused(400, 'malformed percent-encoding');
  }
  const segments = decoded.slice(1).split('/');
  const badSegment = segments.find((s) => s === '' || s === '.' || s === '..' || /[\\:\u0000]/.test(s));
  if (badSegment !== undefined) return refused(404, `refused path segment ${JSON.stringify(badSegment)}`);
  const relativePath = segments.join('/');
  return { kind: 'file', relativePath, headers: responseHeaders(mimeTypeFor(relativePath)) };
}

/** The raw (still percent-encoded) path of a URL at `origin`, without query or fragment; else null. */
function pathWithinOrigin(requestUrl: string, origin: string): string | null {
  if (!requestUrl.toLowerCase().startsWith(`${origin.toLowerCase()}/`)) return null;
  const rest = requestUrl.slice(origin.length);
  const end = rest.search(/[?#]/);
  return end === -1 ? rest : rest.slice(0, end);
}
