/**
 * Which senders an IPC handler answers (Electron security checklist, "Validate the sender of all
 * IPC messages" — common practice): the main frame of one of our windows, showing a page at the
 * app's origin. A subframe or a page that navigated elsewhere gets nothing.
 */
import { isAppUrl } from './appOrigin';

export interface SenderFrame {
  url: string;
  /** True when the frame is its window's top-level frame. */
  isMainFrame: boolean;
}

export function isTrustedSender(frame: SenderFrame | null | undefined, appOrigin: string): boolean {
  return !!frame && frame.isMainFrame && isAppUrl(frame.url, appOrigin);
}
