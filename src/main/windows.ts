/**
 * The app's windows, one per open project: each with its own app service (recovery slot, dialogs
 * parented to it, document state shown in its title) and the close guard on close and on quit.
 * Web contents are hardened here: no new windows, no navigation away, no webviews.
 */
import { app, BrowserWindow, type WebContents } from 'electron';
import type { MenuCommand, MenuCommandDetail } from '../shared/appApi';
import { MENU_COMMAND_CHANNEL } from '../shared/ipcChannels';
import type { AppContext } from './appContext';
import { createAppService, type AppService } from './appService';
import { createElectronPrinter } from './electronPrinter';
import { quitOutcome, runCloseSequence, type CloseOutcome } from './closeGuard';
import type { Dialogs } from './dialogs';
import { createElectronDialogs } from './electronDialogs';
import { navigationDecision, windowOpenDecision } from './navigationRules';
import { secureWindowOptions } from './windowOptions';
import { windowTitle } from './windowTitle';

/** How long a close waits for the renderer to finish the save it was asked for. */
const SAVE_WAIT_MS = 10 * 60 * 1000;

interface WindowRecord {
  window: BrowserWindow;
  dialogs: Dialogs;
  service: AppService;
  closeApproved: boolean;
  guarding: Promise<CloseOutcome> | null;
  saveWaiters: Set<(saved: boolean) => void>;
}

export interface WindowManagerOptions {
  context: AppContext;
  appOrigin: string;
  entryUrl: string;
  preloadPath: string;
}

export function hardenWebContents(contents: WebContents, appOrigin: string): void {
  contents.setWindowOpenHandler(windowOpenDecision);
  const guard = (event: { preventDefault(): void }, url: string) => {
    if (navigationDecision(url, appOrigin) === 'deny') event.preventDefault();
  };
  contents.on('will-navigate', guard);
  contents.on('will-redirect', guard);
  contents.on('will-attach-webview', (event) => event.preventDefault());
}

export function createWindowManager(options: WindowManagerOptions) {
  const records = new Map<number, WindowRecord>();
  let quitApproved = false;

  function sendCommand(window: BrowserWindow, command: MenuCommand, detail?: MenuCommandDetail): void {
    window.webContents.send(MENU_COMMAND_CHANNEL, command, detail);
  }

  function saveThroughRenderer(record: WindowRecord): Promise<boolean> {
    return new Promise((resolve) => {
      const done = (saved: boolean) => {
        clearTimeout(timer);
        record.saveWaiters.delete(done);
        resolve(saved);
      };
      const timer = setTimeout(() => done(false), SAVE_WAIT_MS);
      record.saveWaiters.add(done);
      sendCommand(record.window, 'save-project');
    });
  }

  /** The close guard for one window; concurrent requests share one question. */
  function guard(record: WindowRecord): Promise<CloseOutcome> {
    if (record.closeApproved) return Promise.resolve('closed');
    record.guarding ??= runCloseSequence({
      documentState: () => record.service.documentState(),
      ask: (name) => record.dialogs.confirmUnsavedChanges(name),
      save: () => saveThroughRenderer(record),
    }).then((outcome) => {
      record.guarding = null;
      record.closeApproved = outcome === 'closed';
      return outcome;
    });
    return record.guarding;
  }

  function openWindow(): BrowserWindow {
    const window = new BrowserWindow(secureWindowOptions(options.preloadPath, windowTitle({ name: '', dirty: false })));
    const slot = `w${window.id}`;
    const dialogs = createElectronDialogs(window);
    const saveWaiters = new Set<(saved: boolean) => void>();
    const service = createAppService(options.context, {
      slot,
      dialogs,
      onDocumentState(state) {
        window.setTitle(windowTitle(state));
        if (process.platform === 'darwin') window.setDocumentEdited(state.dirty);
      },
      onSaveReply: (reply) => [...saveWaiters].forEach((waiter) => waiter(reply.saved)),
      printer: createElectronPrinter(),
    });
    const record: WindowRecord = { window, dialogs, service, closeApproved: false, guarding: null, saveWaiters };
    const contentsId = window.webContents.id;
    records.set(contentsId, record);
    hardenWebContents(window.webContents, options.appOrigin);
    window.on('page-title-updated', (event) => event.preventDefault());
    window.on('close', (event) => {
      if (record.closeApproved) return;
      event.preventDefault();
      void guard(record).then((outcome) => outcome === 'closed' && window.close());
    });
    window.on('closed', () => {
      records.delete(contentsId);
      // A clean close: the user saved, had nothing unsaved, or chose not to save.
      void options.context.recovery.discard(slot).catch((e: unknown) => options.context.report(String(e)));
    });
    window.once('ready-to-show', () => window.show());
    void window.loadURL(options.entryUrl);
    return window;
  }

  /** Quit only after every window's close guard agreed; the first "Cancel" stops the quit. */
  async function approveQuit(): Promise<boolean> {
    const outcomes: CloseOutcome[] = [];
    for (const record of records.values()) {
      const outcome = await guard(record);
      outcomes.push(outcome);
      if (outcome === 'kept-open') break;
    }
    return quitOutcome(outcomes) === 'quit';
  }

  app.on('before-quit', (event) => {
    if (quitApproved) return;
    event.preventDefault();
    void approveQuit().then((approved) => {
      if (!approved) return;
      quitApproved = true;
      app.quit();
    });
  });

  return {
    openWindow,
    sendCommand,
    serviceFor: (contents: WebContents) => records.get(contents.id)?.service ?? null,
    windowCount: () => records.size,
  };
}

export type WindowManager = ReturnType<typeof createWindowManager>;
