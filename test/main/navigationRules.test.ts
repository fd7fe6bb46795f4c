import { describe, expect, it } from 'vitest';
import { appOriginFor, isAppUrl, originOf } from '../../src/main/appOrigin';
import { isTrustedSender } from '../../src/main/ipcSender';
import { navigationDecision, requestDecision, windowOpenDecision } from '../../src/main/navigationRules';
import { permissionDecision } from '../../src/main/permissionRules';
import { APP_ORIGIN } from '../../src/main/rendererProtocol';

// Electron security checklist: "Disable or limit navigation", "Disable or limit creation of new
// windows", "Handle session permission requests from remote content", "Validate the sender of all
// IPC messages" (common practice). The app's origin rules are the issue's.
describe('origins', () => {
  it('builds the origin of our non-special scheme by hand (WHATWG URL gives "null")', () => {
    expect(new URL('setpoint-app://app/index.html').origin).toBe('null');
    expect(originOf('setpoint-app://app/index.html')).toBe(APP_ORIGIN);
    expect(originOf('http://localhost:5173/src/main.tsx')).toBe('http://localhost:5173');
    expect(originOf('setpoint-app://user:pw@app/')).toBeNull();
    expect(originOf('not a url')).toBeNull();
    expect(originOf('data:text/html,hi')).toBeNull();
  });

  it('uses the dev server origin only when one is given', () => {
    expect(appOriginFor(undefined)).toBe(APP_ORIGIN);
    expect(appOriginFor('http://localhost:5173/')).toBe('http://localhost:5173');
  });

  it('tells app URLs from look-alikes', () => {
    expect(isAppUrl('setpoint-app://app/assets/x.js', APP_ORIGIN)).toBe(true);
    for (const url of ['setpoint-app://app.evil/', 'setpoint-app://apps/', 'https://app/', 'setpoint-app://app:8080/', 'file:///app/index.html']) {
      expect(isAppUrl(url, APP_ORIGIN), url).toBe(false);
    }
  });
});

describe('navigation, new windows, requests', () => {
  it('allows navigation only within the app origin', () => {
    expect(navigationDecision('setpoint-app://app/index.html#results', APP_ORIGIN)).toBe('allow');
    expect(navigationDecision('https://example.com/', APP_ORIGIN)).toBe('deny');
    expect(navigationDecision('file:///etc/passwd', APP_ORIGIN)).toBe('deny');
    expect(navigationDecision('javascript:alert(1)', APP_ORIGIN)).toBe('deny');
  });

  it('denies every new window', () => {
    expect(windowOpenDecision()).toEqual({ action: 'deny' });
  });

  it('lets the renderer load only its own files, blob: and data:', () => {
    expect(requestDecision('setpoint-app://app/assets/tfjs.wasm', APP_ORIGIN)).toBe('allow');
    expect(requestDecision('blob:setpoint-app://app/1234', APP_ORIGIN)).toBe('allow');
    expect(requestDecision('data:image/png;base64,AAAA', APP_ORIGIN)).toBe('allow');
    expect(requestDecision('https://cdn.jsdelivr.net/npm/@tensorflow/tfjs', APP_ORIGIN)).toBe('deny');
    expect(requestDecision('http://127.0.0.1:9000/', APP_ORIGIN)).toBe('deny');
  });

  it('allows the dev server live-reload socket in development only', () => {
    expect(requestDecision('ws://localhost:5173/', 'http://localhost:5173')).toBe('allow');
    expect(requestDecision('ws://localhost:5174/', 'http://localhost:5173')).toBe('deny');
    expect(requestDecision('ws://app/', APP_ORIGIN)).toBe('deny');
  });
});

describe('permissions and IPC senders', () => {
  it('denies every permission', () => {
    for (const permission of ['media', 'geolocation', 'notifications', 'clipboard-read', 'clipboard-sanitized-write', 'fullscreen', 'openExternal', 'unknown']) {
      expect(permissionDecision(permission)).toBe(false);
    }
  });

  it('answers only the main frame of a page at the app origin', () => {
    expect(isTrustedSender({ url: 'setpoint-app://app/index.html', isMainFrame: true }, APP_ORIGIN)).toBe(true);
    expect(isTrustedSender({ url: 'setpoint-app://app/index.html', isMainFrame: false }, APP_ORIGIN)).toBe(false);
    expect(isTrustedSender({ url: 'https://example.com/', isMainFrame: true }, APP_ORIGIN)).toBe(false);
    expect(isTrustedSender({ url: 'file:///work/out/renderer/index.html', isMainFrame: true }, APP_ORIGIN)).toBe(false);
    expect(isTrustedSender(null, APP_ORIGIN)).toBe(false);
  });
});
