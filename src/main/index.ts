/**
 * Electron main process: creates the window and nothing more yet. The security rules live in pure
 * modules beside this one (windowOptions.ts) so they are tested without Electron.
 */
import { join } from 'node:path';
import { app, BrowserWindow, session } from 'electron';
import { secureWindowOptions } from './windowOptions';

function createWindow(): void {
  const window = new BrowserWindow(secureWindowOptions(join(__dirname, '../preload/index.cjs'), 'Setpoint Critic'));
  window.once('ready-to-show', () => window.show());
  // No navigation away from the app and no new windows: all content is local.
  window.webContents.on('will-navigate', (event) => event.preventDefault());
  window.webContents.setWindowOpenHandler(() => ({ action: 'deny' }));
  const devServer = process.env.ELECTRON_RENDERER_URL;
  if (!app.isPackaged && devServer) void window.loadURL(devServer);
  else void window.loadFile(join(__dirname, '../renderer/index.html'));
}

app.whenReady().then(() => {
  session.defaultSession.setPermissionRequestHandler((_wc, _permission, callback) => callback(false));
  createWindow();
  app.on('activate', () => {
    if (BrowserWindow.getAllWindows().length === 0) createWindow();
  });
});

app.on('window-all-closed', () => {
  if (process.platform !== 'darwin') app.quit();
});
