/**
 * The application menu as plain data: File (New, New Window, Open…, Open Recent, Save, Save As…,
 * Print Report…, Save Report as PDF…, Close, Quit), Edit (Undo/Redo and the clipboard), View (zoom, dark/light theme, full screen),
 * Evaluation (Run, Cancel run), and on macOS the app and Window menus. Pure, so every accelerator
 * and command is unit-tested; menu.ts turns it into Electron's Menu with click handlers.
 *
 * Accelerators follow the platforms' usual shortcuts (Apple Human Interface Guidelines, "Menus";
 * Microsoft "Keyboard shortcuts" guidance — common practice), written in Electron's accelerator
 * syntax (CmdOrCtrl = ⌘ on macOS, Ctrl elsewhere).
 *
 * File ▸ Close sends 'close-project' to the renderer; closing the window itself (title bar,
 * Close Window, Quit) goes through the main process's close guard.
 */
import type { MenuCommand, MenuCommandDetail } from '../shared/appApi';
import { APP_NAME } from './windowTitle';

export type MenuAction =
  | { kind: 'command'; command: MenuCommand; detail?: MenuCommandDetail }
  | { kind: 'new-window' }
  | { kind: 'close-window' }
  | { kind: 'quit' };

/** Electron menu roles this menu uses (built-in behaviour: zoom, clipboard, window management). */
export type MenuRole =
  | 'about' | 'hide' | 'hideOthers' | 'unhide' | 'services'
  | 'cut' | 'copy' | 'paste' | 'selectAll'
  | 'zoomIn' | 'zoomOut' | 'resetZoom' | 'togglefullscreen' | 'toggleDevTools'
  | 'minimize' | 'zoom' | 'front';

export interface MenuEntry {
  label?: string;
  accelerator?: string;
  action?: MenuAction;
  role?: MenuRole;
  submenu?: MenuEntry[];
  type?: 'separator';
  enabled?: boolean;
  /** Hidden items still answer their accelerator (a second shortcut for a command). */
  visible?: boolean;
}

export interface MenuOptions {
  platform: NodeJS.Platform;
  /** Most recent first. */
  recentProjects: readonly string[];
  /** Show the developer tools item (development builds only). */
  development: boolean;
}

const separator: MenuEntry = { type: 'separator' };
const command = (label: string, accelerator: string | undefined, name: MenuCommand): MenuEntry =>
  (accelerator ? { label, accelerator, action: { kind: 'command', command: name } } : { label, action: { kind: 'command', command: name } });

/** "tank-levels.spcritic — /home/ana/plants" so two projects of one name stay apart. */
export function recentLabel(path: string): string {
  const cut = Math.max(path.lastIndexOf('/'), path.lastIndexOf('\\'));
  return cut < 0 ? path : `${path.slice(cut + 1)} — ${path.slice(0, cut) || path.slice(0, 1)}`;
}

function recentSubmenu(recent: readonly string[]): MenuEntry[] {
  if (recent.length === 0) return [{ label: 'No recent projects', enabled: false }];
  return recent.map((path) => ({ label: recentLabel(path), action: { kind: 'command', command: 'open-recent-project', detail: { path } } }));
}

function fileMenu(options: MenuOptions): MenuEntry {
  const mac = options.platform === 'darwin';
  return {
    label: 'File',
    submenu: [
      command('New Project', 'CmdOrCtrl+N', 'new-project'),
      { label: 'New Window', accelerator: 'CmdOrCtrl+Shift+N', action: { kind: 'new-window' } },
      command('Open…', 'CmdOrCtrl+O', 'open-project'),
      { label: 'Open Recent', submenu: recentSubmenu(options.recentProjects) },
      separator,
      command('Save', 'CmdOrCtrl+S', 'save-project'),
      command('Save As…', 'CmdOrCtrl+Shift+S', 'save-project-as'),
      separator,
      command('Print Report…', 'CmdOrCtrl+P', 'print-report'),
      command('Save Report as PDF…', 'CmdOrCtrl+Shift+P', 'save-report-pdf'),
      separator,
      command('Close Project', 'CmdOrCtrl+W', 'close-project'),
      { label: 'Close Window', accelerator: 'CmdOrCtrl+Shift+W', action: { kind: 'close-window' } },
      ...(mac ? [] : [separator, { label: 'Quit', accelerator: 'CmdOrCtrl+Q', action: { kind: 'quit' } } satisfies MenuEntry]),
    ],
  };
}

function editMenu(): MenuEntry {
  return {
    label: 'Edit',
    submenu: [
      command('Undo', 'CmdOrCtrl+Z', 'undo'),
      command('Redo', 'CmdOrCtrl+Shift+Z', 'redo'),
      // Ctrl+Y is redo on Windows and in most Linux apps (common practice): a second, hidden item carries it.
      { ...command('Redo', 'CmdOrCtrl+Y', 'redo'), visible: false },
      separator,
      { role: 'cut', accelerator: 'CmdOrCtrl+X' },
      { role: 'copy', accelerator: 'CmdOrCtrl+C' },
      { role: 'paste', accelerator: 'CmdOrCtrl+V' },
      { role: 'selectAll', accelerator: 'CmdOrCtrl+A' },
    ],
  };
}

function viewMenu(options: MenuOptions): MenuEntry {
  return {
    label: 'View',
    submenu: [
      { role: 'zoomIn', label: 'Zoom In', accelerator: 'CmdOrCtrl+=' },
      { role: 'zoomOut', label: 'Zoom Out', accelerator: 'CmdOrCtrl+-' },
      { role: 'resetZoom', label: 'Actual Size', accelerator: 'CmdOrCtrl+0' },
      separator,
      command('Toggle Dark/Light Theme', 'CmdOrCtrl+Shift+D', 'toggle-theme'),
      { role: 'togglefullscreen', accelerator: options.platform === 'darwin' ? 'Ctrl+Cmd+F' : 'F11' },
      ...(options.development ? [separator, { role: 'toggleDevTools', accelerator: 'CmdOrCtrl+Alt+I' } satisfies MenuEntry] : []),
    ],
  };
}

function evaluationMenu(): MenuEntry {
  return {
    label: 'Evaluation',
    submenu: [command('Run Evaluation', 'F5', 'run-evaluation'), command('Cancel Run', 'Shift+F5', 'cancel-evaluation')],
  };
}

function macAppMenu(): MenuEntry {
  return {
    label: APP_NAME,
    submenu: [
      { role: 'about' }, separator, { role: 'services' }, separator,
      { role: 'hide', accelerator: 'Cmd+H' }, { role: 'hideOthers', accelerator: 'Cmd+Alt+H' }, { role: 'unhide' }, separator,
      { label: `Quit ${APP_NAME}`, accelerator: 'CmdOrCtrl+Q', action: { kind: 'quit' } },
    ],
  };
}

export function buildMenuTemplate(options: MenuOptions): MenuEntry[] {
  const mac = options.platform === 'darwin';
  const windowMenu: MenuEntry = { label: 'Window', submenu: [{ role: 'minimize', accelerator: 'CmdOrCtrl+M' }, { role: 'zoom' }, separator, { role: 'front' }] };
  return [...(mac ? [macAppMenu()] : []), fileMenu(options), editMenu(), viewMenu(options), evaluationMenu(), ...(mac ? [windowMenu] : [])];
}

/** Every entry with an accelerator or action, flattened (for tests and for the Electron adapter). */
export function menuItems(entries: readonly MenuEntry[]): MenuEntry[] {
  return entries.flatMap((entry) => [entry, ...menuItems(entry.submenu ?? [])]);
}
