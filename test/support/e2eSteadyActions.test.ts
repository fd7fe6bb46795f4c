/**
 * Every Playwright action of the end-to-end tests goes through test/e2e/harness/steadyActions.ts: a
 * click, check or hover waits for the element to keep its box over two animation frames, which a
 * loaded CI machine's headless Chromium can stop producing for tens of seconds (a clean CI run failed
 * so on a step tab), and the harness bounds that wait and falls back to the DOM events of the action.
 * Reads the test sources' syntax trees (TypeScript's own parser) for a call of an action on a locator or a
 * page outside the harness. The keyboard's and the mouse's own methods (`page.keyboard.press`,
 * `page.mouse.move`) wait for no element and stay allowed, as do focus, blur and dispatchEvent.
 * `.type(` is matched only with an argument (a console message's `type()` has none); `.clear(` is left
 * out, a Set's and a Map's name too — no e2e source calls a locator's clear.
 */
import { readdirSync, readFileSync, statSync } from 'node:fs';
import { join, relative, resolve } from 'node:path';
import ts from 'typescript';
import { describe, expect, it } from 'vitest';

const ROOTS = [resolve(__dirname, '../e2e'), resolve(__dirname, '../renderer/e2e')];
const HARNESS = resolve(__dirname, '../e2e/harness/steadyActions.ts');

const ACTIONS = ['click', 'dblclick', 'tap', 'check', 'uncheck', 'setChecked', 'hover', 'dragTo', 'fill', 'selectOption', 'selectText', 'press', 'pressSequentially', 'setInputFiles'];

function sources(folder: string): string[] {
  return readdirSync(folder).flatMap((name) => {
    const path = join(folder, name);
    return statSync(path).isDirectory() ? sources(path) : /\.ts$/.test(name) ? [path] : [];
  });
}

/**
 * Line and call of each plain action in a source, read from TypeScript's syntax tree: a call whose callee
 * is a property named as an action (`x.click(`, `x?.click(`, `x['click'](`) on anything but the keyboard,
 * the mouse or the touchscreen. Comments and strings are not code, so a comment naming `.click()` or a
 * string holding "//" cannot hide or invent a call, as the regular expression before could.
 */
function plainActions(text: string): string[] {
  const source = ts.createSourceFile('scan.ts', text, ts.ScriptTarget.Latest, true);
  const found: string[] = [];
  const visit = (node: ts.Node): void => {
    if (ts.isCallExpression(node)) {
      const callee = node.expression;
      const name = ts.isPropertyAccessExpression(callee) ? callee.name.text
        : ts.isElementAccessExpression(callee) && ts.isStringLiteralLike(callee.argumentExpression) ? callee.argumentExpression.text : null;
      const owner = ts.isPropertyAccessExpression(callee) || ts.isElementAccessExpression(callee) ? callee.expression : null;
      const device = owner && ts.isPropertyAccessExpression(owner) && ['keyboard', 'mouse', 'touchscreen'].includes(owner.name.text);
      // `.type(` only with an argument: a console message's `type()` has none.
      const action = name !== null && (ACTIONS.includes(name) || (name === 'type' && node.arguments.length > 0));
      if (action && !device) found.push(`${source.getLineAndCharacterOfPosition(node.getStart()).line + 1}: .${name}(`);
    }
    ts.forEachChild(node, visit);
  };
  visit(source);
  return found;
}

describe('e2e actions', () => {
  it('finds a plain action and passes the harness’s own and the keyboard’s (the scanner itself)', () => {
    expect(plainActions("await page.getByTestId('a').click();\nawait field.fill('1');\nawait select.selectOption('x');")).toEqual(['1: .click(', '2: .fill(', '3: .selectOption(']);
    expect(plainActions("await steadyClick(page.getByTestId('a'));\nawait page.keyboard.press('Control+z');\nawait page.mouse.move(0, 0);\nif (m.type() === 'error') e.push(1);")).toEqual([]);
    expect(plainActions("// a comment may say .click() or .fill('x')\n/* or .check() */ await box.check();")).toEqual(['2: .check(']);
    expect(plainActions("await box.press('Tab');\nawait field.type('12');")).toEqual(['1: .press(', '2: .type(']);
    // What the line scan missed or took wrongly: a string with "//" before a call, optional and bracketed calls.
    expect(plainActions("await page.goto('file:///x'); await box.click();")).toEqual(['1: .click(']);
    expect(plainActions("await box?.click();\nawait box['check']();\nconst s = 'do not .click( here';")).toEqual(['1: .click(', '2: .check(']);
  });

  it('calls every action of the e2e tests through the harness (test/e2e/harness/steadyActions.ts)', () => {
    const plain = ROOTS.flatMap(sources).filter((path) => path !== HARNESS)
      .flatMap((path) => plainActions(readFileSync(path, 'utf8')).map((call) => `${relative(resolve(__dirname, '../..'), path)}:${call}`));
    expect(plain).toEqual([]);
  });
});
