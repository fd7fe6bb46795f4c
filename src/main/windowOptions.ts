/**
 * The options every application window is created with. Kept pure so the security defaults are
 * unit-tested without Electron: isolated, sandboxed renderer with no Node.js integration.
 */
export interface SecureWindowOptions {
  width: number;
  height: number;
  minWidth: number;
  minHeight: number;
  show: boolean;
  title: string;
  webPreferences: {
    preload: string;
    contextIsolation: true;
    sandbox: true;
    nodeIntegration: false;
    nodeIntegrationInWorker: false;
    webSecurity: true;
    allowRunningInsecureContent: false;
    spellcheck: false;
  };
}

export function secureWindowOptions(preloadPath: string, title: string): SecureWindowOptions {
  return {
    width: 1280,
    height: 840,
    minWidth: 900,
    minHeight: 600,
    show: false,
    title,
    webPreferences: {
      preload: preloadPath,
      contextIsolation: true,
      sandbox: true,
      nodeIntegration: false,
      nodeIntegrationInWorker: false,
      webSecurity: true,
      allowRunningInsecureContent: false,
      spellcheck: false,
    },
  };
}
