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
