import { mkdtemp, mkdir, rm, writeFile } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import {
  APP_ENTRY_URL, APP_ORIGIN, CONTENT_SECURITY_POLICY, mimeTypeFor, rendererResponse, responseHeaders,
} from '../../src/main/rendererProtocol';
import { serveRendererFile } from '../../src/main/rendererFiles';

describe('renderer protocol: URL → file', () => {
  it('serves the app entry and its assets from a custom scheme, not file://', () => {
    // Electron security checklist, "Use a custom protocol instead of file://" (common practice).
    expect(APP_ORIGIN).toBe('setpoint-app://app');
    expect(rendererResponse(APP_ENTRY_URL)).toMatchObject({ kind: 'file', relativePath: 'index.html' });
    expect(rendererResponse(`${APP_ORIGIN}/`)).toMatchObject({ kind: 'file', relativePath: 'index.html' });
    expect(rendererResponse(`${APP_ORIGIN}/assets/index-abc.js?v=1#x`)).toMatchObject({ kind: 'file', relativePath: 'assets/index-abc.js' });
    expect(rendererResponse(`${APP_ORIGIN}/assets/a%20b.wasm`)).toMatchObject({ kind: 'file', relativePath: 'assets/a b.wasm' });
  });

  it.each([
    `${APP_ORIGIN}/../secrets.txt`,
    `${APP_ORIGIN}/assets/../../main/index.js`,
    `${APP_ORIGIN}/%2e%2e/%2e%2e/etc/passwd`,
    `${APP_ORIGIN}/assets%2F..%2F..%2Fpackage.json`,
    `${APP_ORIGIN}/assets/..%5C..%5Cpackage.json`,
    `${APP_ORIGIN}/C:/Windows/win.ini`,
    `${APP_ORIGIN}//etc/passwd`,
    `${APP_ORIGIN}/assets/x.js%00.png`,
    'setpoint-app://app.example/index.html',
    'setpoint-app://user@app/index.html',
    'https://app/index.html',
    'file:///etc/passwd',
  ])('refuses %s', (url) => {
    const response = rendererResponse(url);
    expect(response.kind).toBe('refused');
  });

  it('refuses malformed percent-encoding with 400', () => {
    expect(rendererResponse(`${APP_ORIGIN}/%E0%A4%A`)).toMatchObject({ kind: 'refused', status: 400 });
  });
});

describe('renderer protocol: headers', () => {
  const headers = responseHeaders('text/html; charset=utf-8');

  it('sends the strict Content-Security-Policy of the issue', () => {
    // CSP Level 3 (W3C) directive syntax; the directive list is the issue's.
    const directives = Object.fromEntries(CONTENT_SECURITY_POLICY.split('; ').map((d) => [d.split(' ')[0], d.split(' ').slice(1).join(' ')]));
    expect(directives).toEqual({
      'default-src': "'self'",
      'script-src': "'self' 'wasm-unsafe-eval'",
      'worker-src': "'self' blob:",
      'style-src': "'self' 'unsafe-inline'",
      'img-src': "'self' data: blob:",
      'connect-src': "'self'",
      'object-src': "'none'",
      'base-uri': "'none'",
      'form-action': "'none'",
      'frame-ancestors': "'none'",
    });
    expect(CONTENT_SECURITY_POLICY).not.toMatch(/'unsafe-eval'|\*|https?:/);
    expect(headers['Content-Security-Policy']).toBe(CONTENT_SECURITY_POLICY);
  });

  it('sends the cross-origin isolation headers SharedArrayBuffer needs', () => {
    // HTML Living Standard §7.1.3 (COOP "same-origin") and §7.1.4 (COEP "require-corp") make a
    // document cross-origin isolated; Fetch Standard §3.7 (CORP "same-origin") for our own resources.
    expect(headers['Cross-Origin-Opener-Policy']).toBe('same-origin');
    expect(headers['Cross-Origin-Embedder-Policy']).toBe('require-corp');
    expect(headers['Cross-Origin-Resource-Policy']).toBe('same-origin');
    expect(headers['X-Content-Type-Options']).toBe('nosniff'); // Fetch Standard §3.5
  });

  it('sends the same headers on refusals', () => {
    const refused = rendererResponse(`${APP_ORIGIN}/../x`);
    expect(refused.headers['Content-Security-Policy']).toBe(CONTENT_SECURITY_POLICY);
    expect(refused.headers['Cross-Origin-Embedder-Policy']).toBe('require-corp');
  });

  it('gives registered media types (IANA registry; RFC 9239 for JavaScript, RFC 8081 for fonts)', () => {
    expect(mimeTypeFor('index.html')).toBe('text/html; charset=utf-8');
    expect(mimeTypeFor('assets/index-x.js')).toBe('text/javascript; charset=utf-8');
    expect(mimeTypeFor('assets/tfjs-backend-wasm-threaded-simd.wasm')).toBe('application/wasm');
    expect(mimeTypeFor('assets/a.CSS')).toBe('text/css; charset=utf-8');
    expect(mimeTypeFor('icon.svg')).toBe('image/svg+xml');
    expect(mimeTypeFor('font.woff2')).toBe('font/woff2');
    expect(mimeTypeFor('README')).toBe('application/octet-stream');
  });
});

describe('renderer protocol handler (Response over a folder)', () => {
  let folder: string;
  beforeAll(async () => {
    folder = await mkdtemp(join(tmpdir(), 'spc-renderer-'));
    await mkdir(join(folder, 'assets'));
    await writeFile(join(folder, 'index.html'), '<!doctype html><title>t</title>');
    await writeFile(join(folder, 'assets', 'app.js'), 'export {}');
  });
  afterAll(() => rm(folder, { recursive: true, force: true }));

  it('answers a file with 200, its type and the app headers', async () => {
    const response = await serveRendererFile(`${APP_ORIGIN}/assets/app.js`, folder);
    expect(response.status).toBe(200);
    expect(await response.text()).toBe('export {}');
    expect(response.headers.get('content-type')).toBe('text/javascript; charset=utf-8');
    expect(response.headers.get('cross-origin-embedder-policy')).toBe('require-corp');
  });

  it('answers a missing file with 404 and a traversal with a refusal, never a file outside the folder', async () => {
    expect((await serveRendererFile(`${APP_ORIGIN}/assets/none.js`, folder)).status).toBe(404);
    expect((await serveRendererFile(`${APP_ORIGIN}/assets/%2e%2e/%2e%2e/etc/passwd`, join(folder, 'assets'))).status).toBe(404);
  });
});
