/**
 * menuTemplate.ts's plain entries turned into Electron's application menu: each action runs
 * against the focused window (a MenuCommand goes to its renderer).
 */
import { Menu, type BaseWindow, type MenuItemConstructorOptions } from 'electron';
import { buildMenuTemplate, type MenuAction, type MenuEntry, type MenuOptions } from './menuTemplate';

export interface MenuHandlers {
  run(action: MenuAction, focused: BaseWindow | undefined): void;
}

function toElectron(entry: MenuEntry, handlers: MenuHandlers): MenuItemConstructorOptions {
  const item: MenuItemConstructorOptions = {};
  if (entry.type) item.type = entry.type;
  if (entry.label) item.label = entry.label;
  if (entry.role) item.role = entry.role;
  if (entry.accelerator) item.accelerator = entry.accelerator;
  if (entry.enabled === false) item.enabled = false;
  if (entry.visible === false) {
    item.visible = false;
    item.acceleratorWorksWhenHidden = true;
  }
  if (entry.submenu) item.submenu = entry.submenu.map((e) => toElectron(e, handlers));
  const action = entry.action;
  if (action) item.click = (_item, focused) => handlers.run(action, focused);
  return item;
}

export function installApplicationMenu(options: MenuOptions, handlers: MenuHandlers): void {
  Menu.setApplicationMenu(Menu.buildFromTemplate(buildMenuTemplate(options).map((e) => toElectron(e, handlers))));
}
