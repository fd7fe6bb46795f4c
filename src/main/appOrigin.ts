/**
 * Which origin the renderer lives at, and whether a URL belongs to it. Node's URL gives `"null"` as
 * the origin of non-special schemes such as ours (WHATWG URL Standard §4.7), so the origin is built
 * from scheme, host and port here.
 */
import { APP_ORIGIN } from './rendererProtocol';

/** The app's origin: the dev server's in development (ELECTRON_RENDERER_URL), else setpoint-app://app. */
export function appOriginFor(devServerUrl: string | undefined): string {
  return devServerUrl ? (originOf(devServerUrl) ?? APP_ORIGIN) : APP_ORIGIN;
}

/** `scheme://host[:port]` of an absolute URL with a host, or null. */
export function originOf(url: string): string | null {
  let parsed: URL;
  try {
    parsed = new URL(url);
  } catch {
    return null;
  }
  if (parsed.host === '' || parsed.username !== '' || parsed.password !== '') return null;
  return `${parsed.protocol}//${parsed.host}`;
}

export function isAppUrl(url: string, appOrigin: string): boolean {
  return originOf(url) === appOrigin;
}
