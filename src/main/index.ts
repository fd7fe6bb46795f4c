/**
 * Electron main process: owns files, nothing else. Wiring only — every rule lives in a pure or
 * Node-only module beside this one (window options, renderer protocol and headers, navigation,
 * permissions, IPC sender and argument checks, file store, recovery, recent list, menu, close
 * guard) and is unit-tested without Electron.
 *
 * Autosave: the renderer drives it — it calls writeRecovery every minute while the project has
 * unsaved changes (it alone knows when the document changed); main writes the copy atomically and
 * discards it on a clean save or close. One instance per user: a second launch opens a window in
 * the first, so two processes never share a recovery folder.
 */
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { app, BrowserWindow, protocol, session, type Session } from 'electron';
import { createAppContext } from './appContext';
import { appOriginFor } from './appOrigin';
import { registerIpcHandlers } from './ipcHandlers';
import { installApplicationMenu } from './menu';
import type { MenuAction } from './menuTemplate';
import { requestDecision } from './navigationRules';
import { permissionDecision } from './permissionRules';
import { serveRendererFile } from './rendererFiles';
import { APP_ENTRY_URL, APP_SCHEME, CROSS_ORIGIN_ISOLATION_HEADERS } from './rendererProtocol';
import { createWindowManager, type WindowManager } from './windows';

const here = dirname(fileURLToPath(import.meta.url));

// Before app ready (Electron protocol docs): a standard, secure scheme gets an origin, a secure
// context (needed for crossOriginIsolated) and fetch/CORS like https.
protocol.registerSchemesAsPrivileged([
  { scheme: APP_SCHEME, privileges: { standard: true, secure: true, supportFetchAPI: true, corsEnabled: true, stream: true } },
]);

function lockDownSession(target: Session, appOrigin: string, development: boolean): void {
  target.setPermissionRequestHandler((_contents, permission, callback) => callback(permissionDecision(permission)));
  target.setPermissionCheckHandler((_contents, permission) => permissionDecision(permission));
  target.setDevicePermissionHandler(() => false);
  target.webRequest.onBeforeRequest((details, callback) => {
    const allowed = requestDecision(details.url, appOrigin) === 'allow' || details.url.startsWith('devtools:');
    callback({ cancel: !allowed });
  });
  // The dev server sends no isolation headers; add them so development matches the packaged app.
  if (development) {
    target.webRequest.onHeadersReceived({ urls: [`${appOrigin}/*`] }, (details, callback) => {
      callback({ responseHeaders: { ...details.responseHeaders, ...Object.fromEntries(Object.entries(CROSS_ORIGIN_ISOLATION_HEADERS).map(([k, v]) => [k, [v]])) } });
    });
  }
}

function runMenuAction(windows: WindowManager, action: MenuAction, focused: BrowserWindow | null): void {
  if (action.kind === 'quit') return app.quit();
  if (action.kind === 'new-window') return void windows.openWindow();
  if (!focused) return;
  if (action.kind === 'close-window') return focused.close();
  windows.sendCommand(focused, action.command, action.detail);
}

async function start(): Promise<void> {
  const devServer = app.isPackaged ? undefined : process.env.ELECTRON_RENDERER_URL;
  const appOrigin = appOriginFor(devServer);
  protocol.handle(APP_SCHEME, (request) => serveRendererFile(request.url, join(here, '../renderer')));
  lockDownSession(session.defaultSession, appOrigin, devServer !== undefined);

  let windows: WindowManager | null = null;
  const refreshMenu = (recentProjects: readonly string[]) => installApplicationMenu(
    { platform: process.platform, recentProjects, development: devServer !== undefined },
    { run: (action) => windows && runMenuAction(windows, action, BrowserWindow.getFocusedWindow()) },
  );
  const context = createAppContext({ stateFolder: app.getPath('userData'), onRecentChange: refreshMenu });
  windows = createWindowManager({ context, appOrigin, entryUrl: devServer ?? APP_ENTRY_URL, preloadPath: join(here, '../preload/index.cjs') });
  const manager = windows;
  registerIpcHandlers({ appOrigin, serviceFor: (contents) => manager.serviceFor(contents) });
  refreshMenu(await context.recent.list());

  // One window per recovery copy an earlier run left, so each can be offered; at least one.
  const leftovers = await context.recovery.leftoverCount().catch(() => 0);
  for (let i = 0; i < Math.max(1, leftovers); i++) manager.openWindow();
  app.on('second-instance', () => manager.openWindow());
  app.on('activate', () => {
    if (manager.windowCount() === 0) manager.openWindow();
  });
}

if (!app.requestSingleInstanceLock()) {
  app.quit();
} else {
  app.whenReady().then(start).catch((e: unknown) => {
    console.error(e);
    app.quit();
  });
  app.on('window-all-closed', () => {
    if (process.platform !== 'darwin') app.quit();
  });
}
