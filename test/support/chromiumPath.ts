/**
 * Where the end-to-end tests find a Chromium or Chrome to drive with playwright-core (no browser
 * can be downloaded on these machines). Order: the SETPOINT_CHROMIUM environment variable, then
 * CHROME_PATH (a name several tools use), then the usual install paths on Linux, macOS and Windows.
 * When none is found the tests fail with what to install, instead of a bare "executable not found".
 */
import { existsSync } from 'node:fs';

const USUAL_PATHS = [
  '/usr/bin/chromium', '/usr/bin/chromium-browser', '/snap/bin/chromium',
  '/usr/bin/google-chrome', '/usr/bin/google-chrome-stable', '/opt/google/chrome/chrome',
  '/Applications/Chromium.app/Contents/MacOS/Chromium',
  '/Applications/Google Chrome.app/Contents/MacOS/Google Chrome',
  'C:\\Program Files\\Google\\Chrome\\Application\\chrome.exe',
  'C:\\Program Files (x86)\\Google\\Chrome\\Application\\chrome.exe',
];

export const CHROMIUM_MISSING_ADVICE =
  'No Chromium or Chrome was found for the end-to-end tests. Install one (Debian/Ubuntu: ' +
  '`sudo apt-get install chromium`; macOS: install Google Chrome or Chromium), or point ' +
  'SETPOINT_CHROMIUM at its executable, e.g. SETPOINT_CHROMIUM=/path/to/chrome npm test. Looked in: ';

/** The browser executable, or null when none of the candidates exists. */
export function findChromium(env: NodeJS.ProcessEnv = process.env, exists: (path: string) => boolean = existsSync): string | null {
  for (const name of ['SETPOINT_CHROMIUM', 'CHROME_PATH'] as const) {
    const given = env[name];
    if (given && exists(given)) return given;
  }
  return USUAL_PATHS.find((p) => exists(p)) ?? null;
}

/** The browser executable; throws with what to install when there is none. */
export function requireChromium(): string {
  const found = findChromium();
  if (found) return found;
  const given = ['SETPOINT_CHROMIUM', 'CHROME_PATH'].filter((n) => process.env[n]).map((n) => `${n}=${process.env[n]} (not found)`);
  throw new Error(CHROMIUM_MISSING_ADVICE + [...given, ...USUAL_PATHS].join(', '));
}
