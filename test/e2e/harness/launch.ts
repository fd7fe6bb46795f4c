/**
 * The e2e harness: the built renderer (out/renderer) in headless Chromium, with the REAL
 * main-process modules behind `window.setpointCritic` (file store, recovery, recent list, path
 * allow-list, IPC argument validation), served by a local test server in place of Electron. Only
 * the native dialogs are scripted. out/ is built by test/e2e/globalSetup.ts before the tests run.
 *
 * ```ts
 * import { launchApp } from './harness/launch';
 *
 * const app = await launchApp();                        // options: see LaunchOptions
 * const { page, harness } = app;
 * await page.getByRole('heading', { name: 'Setpoint Critic' }).waitFor();
 *
 * harness.dialogs.nextOpenData = '/abs/path/log.csv';   // the next "choose data file" dialog picks this
 * harness.dialogs.nextSave = join(harness.workFolder, 'plant.spcritic');
 * harness.dialogs.nextExport = join(harness.workFolder, 'surface.png');
 * harness.dialogs.nextOpenProject = '/abs/path/plant.spcritic';
 * harness.dialogs.nextConfirm = 'save' | 'discard' | 'cancel';   // "save changes before closing?"
 * harness.dialogs.asked;                                // every dialog shown, with its suggested name and answer
 *
 * await harness.sendMenuCommand(page, 'save-project');  // as the app menu would; returns the listener count
 * await harness.sendMenuCommand(page, 'open-recent-project', { path });
 * await harness.waitForDocumentState((s) => !s.dirty);  // what the page last told setDocumentState
 * await harness.requestClose(page);                     // the real close guard → 'closed' | 'kept-open'
 * harness.apiCalls;                                     // [{ method, ok, message? }] in call order
 * harness.service.recentProjects();                     // the app service itself, for checks
 * await app.screenshot('results-screen');               // → test-artifacts/screens/results-screen.png
 * expect(app.consoleErrors).toEqual([]);                // console errors and uncaught page errors
 * expect(app.blockedRequests).toEqual([]);              // requests to anywhere but the app's origin
 * await app.close();
 * ```
 *
 * Each unscripted dialog answers as a cancel. Every launch is a fresh browser profile and a fresh
 * "run" of the app: pass the previous launch's `harness.stateFolder` as `stateFolder` to start
 * again after a simulated crash (close() does not discard the recovery copy, like a crash; call
 * harness.requestClose(page) first for a clean close). `harness.workFolder` is an empty temporary
 * folder for files the test makes; it and the default state folder are removed by close().
 */
import { mkdir, mkdtemp, rm } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import { dirname, join, resolve } from 'node:path';
import { fileURLToPath } from 'node:url';
import { chromium, type BrowserContext, type Page } from 'playwright-core';
import { inject } from 'vitest';
import type { MenuCommand, MenuCommandDetail, SaveReply } from '../../../src/shared/appApi';
import type { AppService, DocumentState } from '../../../src/main/appService';
import { runCloseSequence, type CloseOutcome } from '../../../src/main/closeGuard';
import type { ScriptedDialogs } from './scriptedDialogs';
import type { HeadlessPrinter } from './headlessPrinter';
import { requireChromium } from '../../support/chromiumPath';
import { startHarnessServer, type ApiCallRecord, type HarnessServer } from './server';
import { UNSTICK } from './unstick';

const root = resolve(dirname(fileURLToPath(import.meta.url)), '../../..');
const rendererFolder = join(root, 'out/renderer');
const screensFolder = join(root, 'test-artifacts/screens');
const browserApiScript = join(dirname(fileURLToPath(import.meta.url)), 'browserApi.js');

export const CHROMIUM_ARGS = [
  '--headless=new', '--no-sandbox', '--disable-gpu', '--disable-background-networking',
  '--disable-component-update', '--disable-sync', '--no-first-run',
];

export interface LaunchOptions {
  /** Reuse an earlier launch's state folder (recent list, recovery copies); default a new temp folder. */
  stateFolder?: string;
  /** Default 1280×840, the app window's size. */
  viewport?: { width: number; height: number };
  colorScheme?: 'light' | 'dark';
  /** 1.25 to check readability at 125 % zoom. Default 1. */
  deviceScaleFactor?: number;
}

export interface Harness {
  /** http://127.0.0.1:<port> — the app's origin in the tests. */
  origin: string;
  dialogs: ScriptedDialogs;
  /** The report printer: real PDFs from this Chromium; `printed` holds what went to the pretend printer. */
  printer: HeadlessPrinter;
  service: AppService;
  stateFolder: string;
  workFolder: string;
  apiCalls: ApiCallRecord[];
  /** Problems the app service reported (e.g. a replaced recent-projects file). */
  reports: string[];
  sendMenuCommand(page: Page, command: MenuCommand, detail?: MenuCommandDetail): Promise<number>;
  documentState(): DocumentState;
  waitForDocumentState(predicate: (state: DocumentState) => boolean, timeoutMs?: number): Promise<DocumentState>;
  requestClose(page: Page): Promise<CloseOutcome>;
}

export interface LaunchedApp {
  page: Page;
  context: BrowserContext;
  harness: Harness;
  consoleErrors: string[];
  blockedRequests: string[];
  screenshot(name: string): Promise<string>;
  close(): Promise<void>;
}

export async function launchApp(options: LaunchOptions = {}): Promise<LaunchedApp> {
  const buildError = inject('rendererBuildError');
  if (buildError) throw new Error(`The renderer could not be built, so the e2e tests cannot run.\n${buildError}`);
  const temporary: string[] = [];
  const makeTemp = async (prefix: string) => {
    const folder = await mkdtemp(join(tmpdir(), prefix));
    temporary.push(folder);
    return folder;
  };
  const stateFolder = options.stateFolder ?? (await makeTemp('spc-state-'));
  const workFolder = await makeTemp('spc-work-');
  const profile = await makeTemp('spc-chromium-');
  const server = await startHarnessServer({ rendererFolder, stateFolder });
  const context = await chromium.launchPersistentContext(profile, {
    executablePath: requireChromium(),
    headless: true,
    args: CHROMIUM_ARGS,
    viewport: options.viewport ?? { width: 1280, height: 840 },
    deviceScaleFactor: options.deviceScaleFactor ?? 1,
    colorScheme: options.colorScheme ?? 'light',
    acceptDownloads: false,
  });
  server.printer.attach(context);
  const blockedRequests = await blockForeignRequests(context, server.origin);
  await context.addInitScript({ path: browserApiScript });
  const page = context.pages()[0] ?? (await context.newPage());
  const consoleErrors = collectErrors(page);
  await page.goto(`${server.origin}/index.html`);
  const harness = makeHarness(server, workFolder);

  return {
    page,
    context,
    harness,
    consoleErrors,
    blockedRequests,
    screenshot: (name) => screenshot(page, name),
    async close() {
      await context.close();
      await server.close();
      await Promise.all(temporary.map((folder) => rm(folder, { recursive: true, force: true })));
    },
  };
}

async function blockForeignRequests(context: BrowserContext, origin: string): Promise<string[]> {
  const blocked: string[] = [];
  await context.route('**/*', (route) => {
    const url = route.request().url();
    if (url.startsWith(`${origin}/`) || url.startsWith('blob:') || url.startsWith('data:')) return route.continue();
    blocked.push(url);
    return route.abort('blockedbyclient');
  });
  return blocked;
}

function collectErrors(page: Page): string[] {
  const errors: string[] = [];
  page.on('console', (message) => {
    if (message.type() === 'error') errors.push(`console: ${message.text()}`);
  });
  page.on('pageerror', (error) => errors.push(`page error: ${error.message}`));
  page.on('crash', () => errors.push('page crashed'));
  return errors;
}

async function screenshot(page: Page, name: string): Promise<string> {
  if (!/^[A-Za-z0-9_-]+$/.test(name)) throw new Error(`screenshot name: expected letters, digits, "-" or "_", found ${JSON.stringify(name)}`);
  await mkdir(screensFolder, { recursive: true });
  const path = join(screensFolder, `${name}.png`);
  // Charts are drawn by a worker: wait (a while, without failing) until every figure reports its drawing.
  await page.waitForFunction(() => [...document.querySelectorAll('figure[data-chart-state]')].every((f) => f.getAttribute('data-chart-state') !== 'waiting'), null, { timeout: 20_000 }).catch(() => undefined);
  await page.screenshot({ path, fullPage: true, style: UNSTICK });
  return path;
}

function makeHarness(server: HarnessServer, workFolder: string): Harness {
  const sendMenuCommand = (page: Page, command: MenuCommand, detail?: MenuCommandDetail) =>
    page.evaluate(([c, d]) => (window as unknown as { __setpointHarness: { dispatchMenuCommand(c: unknown, d: unknown): number } }).__setpointHarness.dispatchMenuCommand(c, d), [command, detail] as const);

  async function waitForDocumentState(predicate: (state: DocumentState) => boolean, timeoutMs = 10_000): Promise<DocumentState> {
    const deadline = Date.now() + timeoutMs;
    for (;;) {
      const state = server.service.documentState();
      if (predicate(state)) return state;
      if (Date.now() > deadline) throw new Error(`waitForDocumentState: still ${JSON.stringify(state)} after ${timeoutMs} ms`);
      await new Promise((r) => setTimeout(r, 50));
    }
  }

  function saveViaMenu(page: Page, timeoutMs = 30_000): Promise<boolean> {
    return new Promise((resolvePromise) => {
      const timer = setTimeout(() => finish(false), timeoutMs);
      const unsubscribe = server.onSaveReply((reply: SaveReply) => finish(reply.saved));
      function finish(saved: boolean) {
        clearTimeout(timer);
        unsubscribe();
        resolvePromise(saved);
      }
      void sendMenuCommand(page, 'save-project');
    });
  }

  return {
    origin: server.origin,
    dialogs: server.dialogs,
    printer: server.printer,
    service: server.service,
    stateFolder: server.stateFolder,
    workFolder,
    apiCalls: server.apiCalls,
    reports: server.reports,
    sendMenuCommand,
    documentState: () => server.service.documentState(),
    waitForDocumentState,
    async requestClose(page) {
      const outcome = await runCloseSequence({
        documentState: () => server.service.documentState(),
        ask: (name) => server.dialogs.confirmUnsavedChanges(name),
        save: () => saveViaMenu(page),
      });
      if (outcome === 'closed') await server.service.discardRecovery();
      return outcome;
    },
  };
}
