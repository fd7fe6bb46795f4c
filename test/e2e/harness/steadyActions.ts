/**
 * Actions that survive headless Chromium's stalled frames. Playwright clicks only once the element
 * has kept one bounding box for two animation frames; under heavy load `--headless=new` can stop
 * producing frames for tens of seconds (no frame is needed to draw nothing on screen), and the
 * click then waits out its whole timeout on an element that is plainly there — the one failure of a
 * clean CI run ("waiting for element to be visible, enabled and stable" on a step tab). Check, hover
 * and double-click wait the same way (they are clicks and pointer moves). Fill and selectOption wait
 * for visible, enabled (and editable), with no frame in the check as Playwright 1.65 writes them, and
 * a locator's press only focuses the element first; they are wrapped all the same, so one stalled
 * renderer never costs a whole test its timeout, whatever the next Playwright checks.
 *
 * So each action here is the ordinary Playwright action first, with a shorter wait; if that wait runs
 * out, the element gets the DOM events a person's action would have sent it (the same handlers run) and
 * the fallback is counted in `stalledActions`:
 * - click: the element's own click event;
 * - check: a click on the box, if it is not checked yet (React's onChange for a checkbox reads the click);
 * - fill: the value written through the native value setter of HTMLInputElement/HTMLTextAreaElement,
 *   then `input` and `change`. React keeps a tracker of the value it last set on the node's own `value`
 *   property; a plain `el.value = …` updates that tracker too, so React would see no change and drop
 *   the event. The prototype's setter bypasses it, as typing does (React's own tests do the same);
 * - selectOption: the option chosen by value or label through HTMLSelectElement's value setter, then
 *   `input` and `change` (React's onChange for a select reads `change`);
 * - press: the element focused from the page, then the keyboard press, which waits on no frame;
 * - hover: `pointerover`, `pointermove`, `mouseover` and `mousemove` at the same point of the element.
 * A click, a check or a hover falls back only on an element a person could reach: enabled (a click or
 * a check; or enabled within APPEAR_WAIT_MS, a button enabled once a run ends) and on top at its centre
 * (a hover: at its point) once scrolled into view
 * (`document.elementFromPoint`, which reads the layout and needs no frame; its own label counts, as
 * Playwright's hit test takes it). An element under a dialog, a sheet or a toast fails as the ordinary
 * action would, so the fallback never does what a person could not.
 * The caller still checks the action's effect — a step selected, a field's value kept, a tooltip
 * shown — so an action that does nothing still fails. test/support/e2eSteadyActions.test.ts fails when
 * an e2e source calls one of these actions outside this file.
 */
import type { Locator } from 'playwright-core';

/** Each fallback taken in this test process, as "<action> <locator>" (printed by test/e2e/engineer.test.ts). */
export const stalledActions: string[] = [];

/** How long the ordinary action may wait before its fallback; how long the element may take to appear. */
const ORDINARY_WAIT_MS = 10_000;
const APPEAR_WAIT_MS = 30_000;

async function steady(
  action: string, locator: Locator, waitMs: number, ordinary: (timeout: number) => Promise<unknown>, fallback: () => Promise<void>, position?: { x: number; y: number },
): Promise<void> {
  await locator.waitFor({ state: 'visible', timeout: APPEAR_WAIT_MS });
  try {
    await ordinary(waitMs);
  } catch (error) {
    if (!(error instanceof Error) || error.name !== 'TimeoutError') throw error;
    if (action !== 'hover' && !(await enabledWithin(locator, APPEAR_WAIT_MS))) throw error;
    if (action === 'click' || action === 'check' || action === 'hover') {
      const cover = await coveredBy(locator, position);
      if (cover) throw new Error(`${action}: ${String(locator)} is covered by ${cover} ${position ? 'at the point given' : 'at its centre'}; a person could not ${action} it (${error.message.split('\n')[0]})`);
    }
    stalledActions.push(`${action} ${String(locator)}`);
    await fallback();
  }
}

/** Whether the element is enabled, or becomes so within `waitMs` (a button enabled once a run ends). */
async function enabledWithin(locator: Locator, waitMs: number): Promise<boolean> {
  const deadline = Date.now() + waitMs;
  for (;;) {
    if (await locator.isEnabled()) return true;
    if (Date.now() > deadline) return false;
    await new Promise((r) => setTimeout(r, 100));
  }
}

/**
 * What lies on top at the element's centre (or at `position` within it) once it is scrolled into view,
 * when that is neither the element, nor inside it, nor a label of it; null when a pointer there would reach the element.
 */
export function coveredBy(locator: Locator, position?: { x: number; y: number }): Promise<string | null> {
  return locator.evaluate((element, at) => {
    element.scrollIntoView({ block: 'center', inline: 'center' });
    const box = element.getBoundingClientRect();
    const top = document.elementFromPoint(box.left + (at ? at.x : box.width / 2), box.top + (at ? at.y : box.height / 2));
    if (!top || element.contains(top)) return top ? null : 'nothing (the centre is outside the window)';
    const label = top.closest('label');
    if (label && (label.control === element || label.contains(element))) return null;
    const name = (e: Element) => `<${e.tagName.toLowerCase()}${e.id ? `#${e.id}` : ''}${typeof e.className === 'string' && e.className ? `.${e.className.trim().split(/\s+/).join('.')}` : ''}>`;
    return name(top);
  }, position ?? null);
}

export function steadyClick(locator: Locator, waitMs = ORDINARY_WAIT_MS): Promise<void> {
  return steady('click', locator, waitMs, (timeout) => locator.click({ timeout }), () => locator.dispatchEvent('click'));
}

export function steadyCheck(locator: Locator, waitMs = ORDINARY_WAIT_MS): Promise<void> {
  return steady('check', locator, waitMs, (timeout) => locator.check({ timeout }), () => checkAsClicked(locator));
}

export function steadyFill(locator: Locator, value: string, waitMs = ORDINARY_WAIT_MS): Promise<void> {
  return steady('fill', locator, waitMs, (timeout) => locator.fill(value, { timeout }), () => fillAsTyped(locator, value));
}

export function steadySelect(locator: Locator, value: string, waitMs = ORDINARY_WAIT_MS): Promise<void> {
  return steady('selectOption', locator, waitMs, (timeout) => locator.selectOption(value, { timeout }), () => selectAsChosen(locator, value));
}

export function steadyPress(locator: Locator, key: string, waitMs = ORDINARY_WAIT_MS): Promise<void> {
  return steady('press', locator, waitMs, (timeout) => locator.press(key, { timeout }), () => pressAfterFocus(locator, key));
}

/** A hover at `position` (pixels from the element's top-left corner; default its centre). */
export function steadyHover(locator: Locator, position?: { x: number; y: number }, waitMs = ORDINARY_WAIT_MS): Promise<void> {
  return steady('hover', locator, waitMs, (timeout) => locator.hover({ timeout, position }), () => moveAsPointer(locator, position), position);
}

/** The fallback of steadyCheck: a click on a box not yet checked; the box must be checked after it. */
export async function checkAsClicked(locator: Locator): Promise<void> {
  const checked = await locator.evaluate((element) => {
    const box = element as HTMLInputElement;
    if (!box.checked) box.click();
    return box.checked;
  });
  if (!checked) throw new Error(`check: ${String(locator)} is still not checked after a click on it`);
}

/** The fallback of steadyFill: the value through the native setter, then `input` and `change`, as typing sends them. */
export async function fillAsTyped(locator: Locator, value: string): Promise<void> {
  const problem = await locator.evaluate((element, text) => {
    const field = element as HTMLInputElement | HTMLTextAreaElement;
    const prototype = field instanceof HTMLTextAreaElement ? HTMLTextAreaElement.prototype : field instanceof HTMLInputElement ? HTMLInputElement.prototype : null;
    if (!prototype) return `is a <${element.tagName.toLowerCase()}>, not a text field`;
    if (field.disabled || field.readOnly) return 'is disabled or read-only';
    field.focus();
    Object.getOwnPropertyDescriptor(prototype, 'value')!.set!.call(field, text);
    field.dispatchEvent(new Event('input', { bubbles: true }));
    field.dispatchEvent(new Event('change', { bubbles: true }));
    return null;
  }, value);
  if (problem) throw new Error(`fill: ${String(locator)} ${problem}`);
}

/** The fallback of steadySelect: the option whose value (or else whose label) is `value`, then `input` and `change`. */
export async function selectAsChosen(locator: Locator, value: string): Promise<void> {
  const problem = await locator.evaluate((element, wanted) => {
    if (!(element instanceof HTMLSelectElement)) return `is a <${element.tagName.toLowerCase()}>, not a select`;
    const options = [...element.options];
    const option = options.find((o) => o.value === wanted) ?? options.find((o) => o.label.trim() === wanted);
    if (!option) return `has no option "${wanted}" (it has ${options.map((o) => `"${o.value}"`).join(', ')})`;
    if (option.disabled) return `has the option "${wanted}" disabled`;
    Object.getOwnPropertyDescriptor(HTMLSelectElement.prototype, 'value')!.set!.call(element, option.value);
    element.dispatchEvent(new Event('input', { bubbles: true }));
    element.dispatchEvent(new Event('change', { bubbles: true }));
    return null;
  }, value);
  if (problem) throw new Error(`selectOption: ${String(locator)} ${problem}`);
}

/** The fallback of steadyPress: focus the element from the page, then press the key on the keyboard. */
export async function pressAfterFocus(locator: Locator, key: string): Promise<void> {
  await locator.evaluate((element) => (element as HTMLElement).focus());
  await locator.page().keyboard.press(key);
}

/** The fallback of steadyHover: the pointer and mouse events of a move onto `position` within the element. */
export async function moveAsPointer(locator: Locator, position?: { x: number; y: number }): Promise<void> {
  await locator.evaluate((element, at) => {
    const box = element.getBoundingClientRect();
    const init = { bubbles: true, cancelable: true, composed: true, view: window, clientX: box.left + (at ? at.x : box.width / 2), clientY: box.top + (at ? at.y : box.height / 2) };
    element.dispatchEvent(new PointerEvent('pointerover', init));
    element.dispatchEvent(new PointerEvent('pointermove', init));
    element.dispatchEvent(new MouseEvent('mouseover', init));
    element.dispatchEvent(new MouseEvent('mousemove', init));
  }, position ?? null);
}
