import { describe, expect, it } from 'vitest';
import { secureWindowOptions } from '../../src/main/windowOptions';

// Electron's security checklist (electronjs.org, "Security", recommendations 2–4: no Node.js
// integration for remote or local content, context isolation, process sandboxing) — common practice.
describe('window options', () => {
  it('isolate and sandbox the renderer with no Node.js integration', () => {
    const { webPreferences } = secureWindowOptions('/app/preload/index.cjs', 'Setpoint Critic');
    expect(webPreferences).toMatchObject({
      contextIsolation: true,
      sandbox: true,
      nodeIntegration: false,
      nodeIntegrationInWorker: false,
      webSecurity: true,
      allowRunningInsecureContent: false,
    });
    expect(webPreferences.preload.endsWith('.cjs')).toBe(true);
  });
});
