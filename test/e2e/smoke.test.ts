/**
 * The built renderer starts in Chromium under the app's own headers: strict CSP, cross-origin
 * isolation (COOP same-origin + COEP require-corp make `crossOriginIsolated` true — HTML Living
 * Standard §7.1.3–7.1.4), the bridge API present, the cautions shown, nothing logged as an error,
 * and no request leaves the app's origin.
 */
import { readFile, writeFile } from 'node:fs/promises';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { CAUTIONS } from '../../src/pipeline/cautions';
import { CONTENT_SECURITY_POLICY } from '../../src/main/rendererProtocol';
import { launchApp, type LaunchedApp } from './harness/launch';

describe('app start (e2e)', () => {
  let app: LaunchedApp;
  beforeAll(async () => {
    app = await launchApp();
  });
  afterAll(async () => {
    await app?.close();
  });

  it('serves the page with the strict CSP and cross-origin isolation', async () => {
    const response = await app.page.request.get(`${app.harness.origin}/index.html`);
    expect(response.headers()['content-security-policy']).toBe(CONTENT_SECURITY_POLICY);
    expect(response.headers()['cross-origin-opener-policy']).toBe('same-origin');
    expect(response.headers()['cross-origin-embedder-policy']).toBe('require-corp');
    expect(await app.page.evaluate(() => globalThis.crossOriginIsolated)).toBe(true);
    expect(await app.page.evaluate(() => typeof SharedArrayBuffer)).toBe('function');
  });

  it('shows the name and the cautions, with the browser API bridged in', async () => {
    const { page } = app;
    await page.getByText('Setpoint Critic', { exact: true }).first().waitFor();
    await app.screenshot('start');
    const text = await page.locator('body').innerText();
    // Each caution's opening words (the full text lives once, in src/pipeline/cautions.ts); the
    // start page must show them before any number is shown.
    for (const caution of CAUTIONS) expect(text, 'the cautions on the start page').toContain(caution.slice(0, 40));
    expect(await page.evaluate(() => window.setpointCritic?.host)).toBe('browser');
    expect(await page.evaluate(() => window.setpointCritic?.recentProjects())).toEqual([]);
  });

  it('refuses an inline script (the CSP is enforced, not just sent)', async () => {
    const ran = await app.page.evaluate(() => new Promise<boolean>((resolve) => {
      document.addEventListener('securitypolicyviolation', () => resolve(false), { once: true });
      const script = document.createElement('script');
      script.textContent = 'window.__inlineRan = true';
      document.head.append(script);
      setTimeout(() => resolve((window as unknown as { __inlineRan?: boolean }).__inlineRan === true), 500);
    }));
    expect(ran).toBe(false);
    // The violation is reported on the console; it is ours, so clear it from the error list.
    app.consoleErrors.splice(0, app.consoleErrors.length, ...app.consoleErrors.filter((e) => !e.includes('Content Security Policy')));
  });

  it('carries bytes both ways through the real app service, and scripted dialogs', async () => {
    const { page, harness } = app;
    const csv = join(harness.workFolder, 'levels.csv');
    await writeFile(csv, 'time_s,level_m\n0,1.2\n');
    harness.dialogs.nextOpenData = csv;
    const chosen = await page.evaluate(async () => {
      const reply = await window.setpointCritic!.chooseDataFile(null);
      return reply && { isBytes: reply.bytes instanceof Uint8Array, text: new TextDecoder().decode(reply.bytes), relativePath: reply.relativePath };
    });
    expect(chosen).toEqual({ isBytes: true, text: 'time_s,level_m\n0,1.2\n', relativePath: csv });

    const target = join(harness.workFolder, 'surface');
    harness.dialogs.nextExport = target;
    const exported = await page.evaluate(() => window.setpointCritic!.exportFile('png', 'Value surface', new Uint8Array([137, 80, 78, 71, 0, 255])));
    expect(exported).toEqual({ path: `${target}.png` });
    expect([...(await readFile(`${target}.png`))]).toEqual([137, 80, 78, 71, 0, 255]);
    expect(harness.dialogs.asked.map((a) => a.dialog)).toEqual(['openData', 'export']);
  });

  it('rejects bad arguments and unchosen files with a readable message', async () => {
    const messages = await app.page.evaluate(async () => {
      const api = window.setpointCritic!;
      const reason = (p: Promise<unknown>) => p.then(() => 'resolved', (e: Error) => e.message);
      return [
        await reason(api.readProjectData('/etc/x.spcritic', 5 as unknown as string)),
        await reason(api.readProjectData('/etc/x.spcritic', 'passwd')),
        await reason(api.openRecentProject('/etc/passwd')),
      ];
    });
    expect(messages).toEqual([
      'readProjectData: argument "relativePath": expected a path (text)',
      '"/etc/x.spcritic" is not a project opened or saved in this session, so its data is not read.',
      '"/etc/passwd" is not in the recent-projects list.',
    ]);
  });

  it('answers API calls only from its own origin', async () => {
    const response = await app.page.request.post(`${app.harness.origin}/__api/recentProjects`, { data: { args: [] }, headers: { Origin: 'http://evil.example' } });
    expect(response.status()).toBe(403);
  });

  it('delivers menu commands to the page and runs the close guard', async () => {
    const { page, harness } = app;
    await page.evaluate(() => {
      const seen: unknown[] = [];
      (window as unknown as { __seen: unknown[] }).__seen = seen;
      window.setpointCritic!.onMenuCommand((command, detail) => seen.push([command, detail ?? null]));
    });
    expect(await harness.sendMenuCommand(page, 'open-recent-project', { path: '/nowhere.spcritic' })).toBeGreaterThanOrEqual(1);
    expect(await page.evaluate(() => (window as unknown as { __seen: unknown[] }).__seen)).toEqual([['open-recent-project', { path: '/nowhere.spcritic' }]]);

    harness.service.setDocumentState({ name: 'Smoke', dirty: true });
    harness.dialogs.nextConfirm = 'cancel';
    expect(await harness.requestClose(page)).toBe('kept-open');
    harness.dialogs.nextConfirm = 'discard';
    expect(await harness.requestClose(page)).toBe('closed');
    expect(harness.dialogs.asked.filter((a) => a.dialog === 'confirmUnsavedChanges')).toHaveLength(2);
    // The page reports its own state over the bridge, in order.
    await page.evaluate(() => {
      window.setpointCritic!.setDocumentState({ name: 'Bridge', dirty: true });
      window.setpointCritic!.setDocumentState({ name: 'Bridge', dirty: false });
    });
    expect(await harness.waitForDocumentState((s) => s.name === 'Bridge' && !s.dirty)).toEqual({ name: 'Bridge', dirty: false });
  });

  it('logs no console errors and makes no request beyond its own origin', () => {
    expect(app.consoleErrors).toEqual([]);
    expect(app.blockedRequests).toEqual([]);
  });
});
