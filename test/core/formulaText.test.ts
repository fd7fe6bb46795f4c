/**
 * A formula in running text is held on one line (core/formulaText.ts): its spaces are no-break spaces,
 * every sentence that writes the effective horizon 1/(1 − γ) (common practice) takes the one constant,
 * and the terminal writes it with plain spaces. Whether Chromium then keeps it whole is measured in the
 * app by the screen review (test/e2e/harness/formulaWrap.ts).
 */
import { describe, expect, it } from 'vitest';
import { formulaText, HORIZON_FORMULA } from '../../src/core/formulaText';
import { discountHelp } from '../../src/renderer/src/screens/estimator/discountHorizon';
import { SETTING_HELP } from '../../src/renderer/src/screens/estimator/settingHelp';
import { GLOSSARY } from '../../src/renderer/src/help/glossary';
import { effectiveShareRuleText } from '../../src/core/diagnostics/severity';
import { terminalText } from '../../src/cli/terminal';

describe('a formula held on one line', () => {
  it('has no plain space left', () => {
    expect(HORIZON_FORMULA).toBe('1/(1\u00a0−\u00a0γ)');
    expect(formulaText('0 < γ < 1')).not.toMatch(/ /);
  });

  it('is the one text of the horizon in the Method step, the glossary and the weights rule', () => {
    expect(discountHelp(0.95, null)).toContain(`(${HORIZON_FORMULA})`);
    expect(discountHelp(0.95, 60)).toContain(`(${HORIZON_FORMULA})`);
    expect(SETTING_HELP.discount).toContain(`(${HORIZON_FORMULA})`);
    expect(GLOSSARY.find((g) => g.term.startsWith('Discount'))?.meaning).toContain(HORIZON_FORMULA);
    expect(effectiveShareRuleText()).toContain(HORIZON_FORMULA);
    for (const text of [discountHelp(0.95, 60), SETTING_HELP.discount, effectiveShareRuleText()]) expect(text).not.toContain('1/(1 − γ)');
  });

  it('reads with plain spaces on the terminal', () => {
    expect(terminalText(`horizon ${HORIZON_FORMULA}`)).toBe('horizon 1/(1 − γ)');
  });
});
