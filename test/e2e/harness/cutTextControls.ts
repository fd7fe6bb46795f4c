/**
 * Form controls that cut what they hold (findings 1, 2 and 7 of harness/cutText.ts's rule): a select
 * narrower than its chosen option with its own chrome, a text or number field narrower than its value,
 * a text box under 12 lines high holding more lines than it shows. Runs in the page: self-contained.
 */
import type { CutTools } from './cutTextTools';

/** 1. Selects: the chrome is the auto width of a copy holding one empty option (its border, padding and arrow). */
export function measureSelects(root: Element, t: CutTools): void {
  for (const select of root.querySelectorAll('select')) {
    if (!t.seen(select) || select.selectedIndex < 0) continue;
    const copy = document.createElement('select');
    copy.className = select.className;
    copy.style.cssText = 'position:absolute;visibility:hidden;width:auto;min-width:0;max-width:none;';
    copy.append(new Option(''));
    select.parentElement!.append(copy);
    const chrome = copy.getBoundingClientRect().width;
    copy.remove();
    const text = select.options[select.selectedIndex].text, label = `${t.fold(select.labels?.[0]?.textContent) || select.getAttribute('aria-label') || 'select'}${select.dataset.testid ? ` [${select.dataset.testid}]` : ''}`;
    t.say('select', `${label}: ${text}`, t.textWidth(text, t.style(select)) + chrome - select.getBoundingClientRect().width);
  }
}

/** 2. Text and number fields: the value against the content box. */
export function measureFields(root: Element, t: CutTools): void {
  for (const input of root.querySelectorAll<HTMLInputElement>('input:not([type]), input[type="text"], input[type="number"]')) {
    if (!t.seen(input) || !input.value) continue;
    const s = t.style(input), room = input.clientWidth - parseFloat(s.paddingLeft) - parseFloat(s.paddingRight);
    const label = t.fold(input.labels?.[0]?.textContent) || input.getAttribute('aria-label') || input.id;
    t.say('input', `${label}: ${input.value}`, t.textWidth(input.value, s) - room);
  }
}

/** 7 (in the rule's numbering). Text boxes: more lines than they show, unless 12 lines high or more. */
export function measureTextBoxes(root: Element, t: CutTools): void {
  for (const area of root.querySelectorAll('textarea')) {
    if (!t.seen(area)) continue;
    const s = t.style(area), lineHeight = parseFloat(s.lineHeight) || 1.2 * parseFloat(s.fontSize);
    const label = t.fold(area.labels?.[0]?.textContent) || area.getAttribute('aria-label') || area.id;
    if (area.clientHeight < 12 * lineHeight) t.say('textarea', `${label}: ${area.value}`, area.scrollHeight - area.clientHeight);
  }
}
