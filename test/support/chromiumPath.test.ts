import { describe, expect, it } from 'vitest';
import { CHROMIUM_MISSING_ADVICE, findChromium } from './chromiumPath';

describe('findChromium', () => {
  it('prefers SETPOINT_CHROMIUM, then CHROME_PATH, then the usual paths', () => {
    const all = () => true;
    expect(findChromium({ SETPOINT_CHROMIUM: '/opt/a', CHROME_PATH: '/opt/b' }, all)).toBe('/opt/a');
    expect(findChromium({ CHROME_PATH: '/opt/b' }, all)).toBe('/opt/b');
    expect(findChromium({}, (p) => p === '/usr/bin/google-chrome')).toBe('/usr/bin/google-chrome');
  });
  it('skips a variable naming a missing file and returns null when nothing exists', () => {
    expect(findChromium({ SETPOINT_CHROMIUM: '/missing' }, (p) => p === '/usr/bin/chromium')).toBe('/usr/bin/chromium');
    expect(findChromium({}, () => false)).toBeNull();
    expect(CHROMIUM_MISSING_ADVICE).toContain('apt-get install chromium');
  });
});
