import { describe, expect, it } from 'vitest';
import { MENU_COMMANDS } from '../../src/shared/ipcChannels';
import { buildMenuTemplate, menuItems, recentLabel, type MenuEntry } from '../../src/main/menuTemplate';

// Accelerators: the platforms' usual shortcuts (Apple Human Interface Guidelines, "Menus";
// Microsoft Windows keyboard shortcut guidance — common practice); the item list is the issue's.
const template = (platform: NodeJS.Platform, recentProjects: string[] = []) => buildMenuTemplate({ platform, recentProjects, development: false });
const byLabel = (entries: MenuEntry[], label: string) => menuItems(entries).find((e) => e.label === label);

describe('application menu template', () => {
  it.each(['linux', 'win32', 'darwin'] as const)('has every accelerator of the issue on %s', (platform) => {
    const accelerators = new Map(menuItems(template(platform)).filter((e) => e.accelerator).map((e) => [e.accelerator!, e.label ?? e.role]));
    const expected: Record<string, string> = {
      'CmdOrCtrl+N': 'New Project', 'CmdOrCtrl+O': 'Open…', 'CmdOrCtrl+S': 'Save', 'CmdOrCtrl+Shift+S': 'Save As…',
      'CmdOrCtrl+P': 'Print Report…', 'CmdOrCtrl+Shift+P': 'Save Report as PDF…',
      'CmdOrCtrl+W': 'Close Project', 'CmdOrCtrl+Z': 'Undo', 'CmdOrCtrl+Shift+Z': 'Redo',
      'CmdOrCtrl+=': 'Zoom In', 'CmdOrCtrl+-': 'Zoom Out', 'CmdOrCtrl+0': 'Actual Size',
      'CmdOrCtrl+Shift+D': 'Toggle Dark/Light Theme', F5: 'Run Evaluation', 'Shift+F5': 'Cancel Run',
      'CmdOrCtrl+C': 'copy', 'CmdOrCtrl+V': 'paste', 'CmdOrCtrl+X': 'cut',
    };
    for (const [accelerator, label] of Object.entries(expected)) expect(accelerators.get(accelerator), accelerator).toBe(label);
    expect(accelerators.get('CmdOrCtrl+Q')).toMatch(/^Quit/);
  });

  it('uses each accelerator once', () => {
    for (const platform of ['linux', 'darwin'] as const) {
      const accelerators = menuItems(template(platform)).flatMap((e) => (e.accelerator ? [e.accelerator] : []));
      expect(new Set(accelerators).size).toBe(accelerators.length);
    }
  });

  it('maps items to the MenuCommands the renderer handles', () => {
    const entries = template('linux', ['/p/a.spcritic']);
    const commands = new Set(menuItems(entries).flatMap((e) => (e.action?.kind === 'command' ? [e.action.command] : [])));
    expect([...commands].sort()).toEqual([...MENU_COMMANDS].sort());
    expect(byLabel(entries, 'Save')?.action).toEqual({ kind: 'command', command: 'save-project' });
    expect(byLabel(entries, 'Run Evaluation')?.action).toEqual({ kind: 'command', command: 'run-evaluation' });
    expect(byLabel(entries, 'New Window')?.action).toEqual({ kind: 'new-window' });
    expect(byLabel(entries, 'Quit')?.action).toEqual({ kind: 'quit' });
    expect(byLabel(entries, 'Zoom In')?.role).toBe('zoomIn');
  });

  it('lists recent projects, most recent first, each opening its own path', () => {
    const recent = byLabel(template('linux', ['/home/ana/b.spcritic', '/home/ana/a.spcritic']), 'Open Recent')!.submenu!;
    expect(recent.map((e) => e.label)).toEqual(['b.spcritic — /home/ana', 'a.spcritic — /home/ana']);
    expect(recent[0].action).toEqual({ kind: 'command', command: 'open-recent-project', detail: { path: '/home/ana/b.spcritic' } });
    expect(byLabel(template('linux'), 'Open Recent')!.submenu).toEqual([{ label: 'No recent projects', enabled: false }]);
    expect(recentLabel('C:\\Plants\\tank.spcritic')).toBe('tank.spcritic — C:\\Plants');
    expect(recentLabel('/tank.spcritic')).toBe('tank.spcritic — /');
  });

  it('puts Quit in the app menu on macOS and in File elsewhere', () => {
    const mac = template('darwin');
    expect(mac[0].label).toBe('Setpoint Critic');
    expect(mac[0].submenu!.some((e) => e.action?.kind === 'quit')).toBe(true);
    expect(byLabel(mac, 'File')!.submenu!.some((e) => e.action?.kind === 'quit')).toBe(false);
    expect(byLabel(template('win32'), 'File')!.submenu!.at(-1)).toMatchObject({ label: 'Quit', accelerator: 'CmdOrCtrl+Q' });
  });

  it('offers the developer tools only in development', () => {
    const roles = (development: boolean) => menuItems(buildMenuTemplate({ platform: 'linux', recentProjects: [], development })).map((e) => e.role);
    expect(roles(false)).not.toContain('toggleDevTools');
    expect(roles(true)).toContain('toggleDevTools');
  });
});
