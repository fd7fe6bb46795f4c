/**
 * Every Playwright action of the end-to-end tests goes through test/e2e/harness/steadyActions.ts: a
 * click, check or hover waits for the element to keep its box over two animation frames, which a
 * loaded CI machine's headless Chromium can stop producing for tens of seconds (a clean CI run failed
 * so on a step tab), and the harness bounds that wait and falls back to the DOM events of the action.
 * Scans the test sources, as e2ePollTimeouts.test.ts does, for a call of an action on a locator or a
 * page outside the harness. The keyboard's and the mouse's own methods (`page.keyboard.press`,
 * `page.mouse.move`) wait for no element and stay allowed, as do focus, blur and dispatchEvent.
 * `.type(` is matched only with an argument (a console message's `type()` has none); `.clear(` is left
 * out, a Set's and a Map's name too — no e2e source calls a locator's clear.
 */
import { readdirSync, readFileSync, statSync } from 'node:fs';
import { join, relative, resolve } from 'node:path';
import { describe, expect, it } from 'vitest';

const ROOTS = [resolve(__dirname, '../e2e'), resolve(__dirname, '../renderer/e2e')];
const HARNESS = resolve(__dirname, '../e2e/harness/steadyActions.ts');

const ACTIONS = ['click', 'dblclick', 'tap', 'check', 'uncheck', 'setChecked', 'hover', 'dragTo', 'fill', 'selectOption', 'selectText', 'press', 'pressSequentially', 'setInputFiles'];
const PLAIN_ACTION = new RegExp(`(?<!\\b(?:keyboard|mouse|touchscreen))\\.(?:${ACTIONS.join('|')}|type(?=\\([^)]))\\(`, 'g');

function sources(folder: string): string[] {
  return readdirSync(folder).flatMap((name) => {
    const path = join(folder, name);
    return statSync(path).isDirectory() ? sources(path) : /\.ts$/.test(name) ? [path] : [];
  });
}

/** The text with its comments blanked (kept line for line): a comment may name `.click()`. */
function withoutComments(text: string): string {
  return text.replace(/\/\*[\s\S]*?\*\//g, (c) => c.replace(/[^\n]/g, ' ')).replace(/(^|[^:'"`\\])\/\/.*$/gm, '$1');
}

/** Line and call of each plain action in a source. */
function plainActions(text: string): string[] {
  const code = withoutComments(text);
  return [...code.matchAll(PLAIN_ACTION)].map((m) => `${code.slice(0, m.index).split('\n').length}: ${m[0]}`);
}

describe('e2e actions', () => {
  it('finds a plain action and passes the harness’s own and the keyboard’s (the scanner itself)', () => {
    expect(plainActions("await page.getByTestId('a').click();\nawait field.fill('1');\nawait select.selectOption('x');")).toEqual(['1: .click(', '2: .fill(', '3: .selectOption(']);
    expect(plainActions("await steadyClick(page.getByTestId('a'));\nawait page.keyboard.press('Control+z');\nawait page.mouse.move(0, 0);\nif (m.type() === 'error') e.push(1);")).toEqual([]);
    expect(plainActions("// a comment may say .click() or .fill('x')\n/* or .check() */ await box.check();")).toEqual(['2: .check(']);
    expect(plainActions("await box.press('Tab');\nawait field.type('12');")).toEqual(['1: .press(', '2: .type(']);
  });

  it('calls every action of the e2e tests through the harness (test/e2e/harness/steadyActions.ts)', () => {
    const plain = ROOTS.flatMap(sources).filter((path) => path !== HARNESS)
      .flatMap((path) => plainActions(readFileSync(path, 'utf8')).map((call) => `${relative(resolve(__dirname, '../..'), path)}:${call}`));
    expect(plain).toEqual([]);
  });
});
