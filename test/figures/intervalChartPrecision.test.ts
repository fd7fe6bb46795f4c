/**
 * One chart, one precision (JCGM 100 §7.2.2, common practice: a value is written to the decimal place
 * of its uncertainty): the interval chart writes a value without an interval (the model rollouts'
 * check) at the decimals of the chart's first interval, and the present controller's line in its key
 * at the decimals of its own row. The screen review's report showed "5.737" among "5.63" and a key
 * "present controller: 6.399" over a row "6.40".
 */
import { describe, expect, it } from 'vitest';
import { intervalChart } from '../../src/figures/charts/intervalChart';
import { inlineSvg } from '../../src/figures/writers/inlineSvg';

const rows = [
  { label: 'Fitted Q-evaluation', value: 5.6312, interval: [5.07, 6.21] as const },
  { label: 'Rollouts of a fitted plant model', value: 5.7371, interval: null },
  { label: 'present controller', value: 6.3991, interval: [5.72, 7.1] as const, present: true },
];

describe('interval chart precision', () => {
  it('writes every value and the present controller’s key at the intervals’ decimals', () => {
    const svg = inlineSvg((look) => intervalChart({ rows, axisLabel: 'J', title: '', reference: 6.3991, theme: 'light' }, look) as never, { widthPx: 640, heightPx: 240, id: 't', label: 'J' });
    const texts = [...svg.matchAll(/<text[^>]*>([^<]*)<\/text>/g)].map((m) => m[1]);
    expect(texts).toContain('5.63');
    expect(texts).toContain('5.74');
    expect(texts).toContain('6.40');
    expect(texts.some((t) => t.includes('present controller: 6.40'))).toBe(true);
    expect(texts.filter((t) => /5\.737|6\.399/.test(t))).toEqual([]);
  });
});
