/**
 * No-break spaces stay on screen and in the report, where lines wrap, and leave the plain-text files,
 * where nothing wraps, so a search typed with plain spaces finds "1/(1 − γ)" or "2.8 %" (issue 11;
 * core/formulaText.ts says where each is written). Plain text here: the app's table CSV and clipboard
 * copy (components/tableText.ts plainCellText; U+00A0 is white space to \s, ECMA-262 §12.2 WhiteSpace),
 * the value-surface CSV (export/surfaceCsv.ts) and the command line's text and --json (cli/terminal.ts).
 */
import { describe, expect, it } from 'vitest';
import { terminalText } from '../../../src/cli/terminal';
import { formulaText, HORIZON_FORMULA } from '../../../src/core/formulaText';
import { shareText } from '../../../src/core/shareText';
import { plainCellText, toCsv, toTabSeparated } from '../../../src/renderer/src/components/tableText';
import { surfaceCsv } from '../../../src/renderer/src/export/surfaceCsv';
import { valueLabel } from '../../../src/renderer/src/screens/findings/plotLabels';
import { bowlSurface } from '../../figures/syntheticPlotData';

const NBSP = '\u00a0';
const sentence = `about 20 logged steps (${HORIZON_FORMULA}); ${shareText(0.028)} of the states`;

describe('no-break spaces on screen, plain spaces in text files', () => {
  it('the screen form holds the formula and the share together', () => {
    expect(HORIZON_FORMULA).toBe(`1/(1${NBSP}−${NBSP}γ)`);
    expect(sentence).toContain(`${NBSP}%`);
  });

  it('the app\'s table CSV and clipboard copy write them as plain spaces', () => {
    const cells = [['check', 'words'], ['horizon', plainCellText(` ${sentence}\n`)]];
    for (const text of [toCsv(cells), toTabSeparated(cells)]) {
      expect(text).not.toContain(NBSP);
      expect(text).toContain('1/(1 − γ)');
      expect(text).toContain('2.8 %');
    }
    expect(plainCellText(formulaText('0 < γ < 1'))).toBe('0 < γ < 1');
  });

  it('the value-surface CSV carries none', () => {
    expect(surfaceCsv(bowlSurface(3, 2), valueLabel('cost', 'V', '€'))).not.toContain(NBSP);
  });

  it('the command line\'s text and --json write them as plain spaces, one for one', () => {
    const json = JSON.stringify({ warnings: [sentence] });
    const written = terminalText(json);
    expect(written).toContain('1/(1 − γ)');
    expect(written).not.toContain(NBSP);
    expect(written.length).toBe(json.length);
    expect(JSON.parse(written).warnings[0]).toBe(sentence.replaceAll(NBSP, ' '));
  });
});
