/**
 * The helper test page (test/e2e/helper-page) built with Vite into a temporary folder, served on
 * 127.0.0.1 with the app's own headers (rendererResponse: CSP, cross-origin isolation) and opened in
 * headless Chromium. `extraFiles` are served beside it (the app bench hands a large CSV this way
 * instead of through the page's arguments). Used by test/e2e/helperWorker.test.ts and
 * bench/appThreadBench.ts.
 */
import { mkdtemp, readFile, rm } from 'node:fs/promises';
import { createServer } from 'node:http';
import { tmpdir } from 'node:os';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { chromium, type Page } from 'playwright-core';
import { build } from 'vite';
import { rendererResponse } from '../../../src/main/rendererProtocol';
import { requireChromium } from '../../support/chromiumPath';
import { CHROMIUM_ARGS } from './launch';

export interface HelperPage {
  page: Page;
  /** Console errors and uncaught errors of the page and its workers. */
  errors: string[];
  close(): Promise<void>;
}

const pageRoot = join(dirname(fileURLToPath(import.meta.url)), '..', 'helper-page');

export async function openHelperPage(extraFiles: Record<string, string> = {}): Promise<HelperPage> {
  const outDir = await mkdtemp(join(tmpdir(), 'spc-helper-page-'));
  await build({
    root: pageRoot, configFile: false, logLevel: 'warn', base: './',
    build: { outDir, emptyOutDir: true, minify: false, chunkSizeWarningLimit: 8000 }, worker: { format: 'es' },
  });
  let origin = '';
  const server = createServer(async (request, response) => {
    const mapped = rendererResponse(`${origin}${request.url ?? '/'}`, origin);
    if (mapped.kind === 'refused') return void response.writeHead(mapped.status, mapped.headers).end(mapped.reason);
    try {
      const body = await readFile(extraFiles[mapped.relativePath] ?? join(outDir, mapped.relativePath));
      response.writeHead(200, mapped.headers).end(body);
    } catch {
      response.writeHead(404).end();
    }
  });
  await new Promise<void>((done) => server.listen(0, '127.0.0.1', done));
  const address = server.address();
  origin = `http://127.0.0.1:${typeof address === 'object' && address ? address.port : 0}`;
  const profile = await mkdtemp(join(tmpdir(), 'spc-helper-chromium-'));
  const context = await chromium.launchPersistentContext(profile, { executablePath: requireChromium(), headless: true, args: CHROMIUM_ARGS });
  const page = context.pages()[0] ?? (await context.newPage());
  const errors: string[] = [];
  page.on('console', (m) => { if (m.type() === 'error') errors.push(m.text()); });
  page.on('pageerror', (e) => errors.push(e.message));
  await page.goto(`${origin}/index.html`);
  await page.waitForFunction(() => window.helperReady === true);
  return {
    page, errors,
    async close() {
      await context.close();
      await new Promise((done) => server.close(done));
      await Promise.all([outDir, profile].map((d) => rm(d, { recursive: true, force: true })));
    },
  };
}
