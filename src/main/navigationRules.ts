/**
 * Navigation and new windows (Electron security checklist, "Disable or limit navigation" and
 * "Disable or limit creation of new windows" — common practice): the app is one page at one origin;
 * a navigation elsewhere (a link in a description, a drag-dropped URL) is refused, and no window is
 * ever opened by the page — new windows come from the menu, in the main process.
 */
import { isAppUrl } from './appOrigin';

export type NavigationDecision = 'allow' | 'deny';

export function navigationDecision(targetUrl: string, appOrigin: string): NavigationDecision {
  return isAppUrl(targetUrl, appOrigin) ? 'allow' : 'deny';
}

/** window.open, target=_blank, middle-click: always denied. */
export function windowOpenDecision(): { action: 'deny' } {
  return { action: 'deny' };
}

/**
 * Every request the renderer makes (the app makes no network requests, GUIDE §4): its own origin,
 * blob: and data: URLs, and in development the dev server's live-reload socket. Anything else —
 * an http(s) URL in a project description, a remote font — is cancelled.
 */
export function requestDecision(url: string, appOrigin: string): NavigationDecision {
  if (isAppUrl(url, appOrigin) || url.startsWith('blob:') || url.startsWith('data:')) return 'allow';
  const socketOrigin = appOrigin.replace(/^http:/, 'ws:');
  return socketOrigin !== appOrigin && isAppUrl(url, socketOrigin) ? 'allow' : 'deny';
}
