/**
 * The report's retune grid (pipeline/report/reportRetune.ts): each cell's J and its interval at one
 * precision — the interval's ends to three significant digits of its width, J to the same decimal
 * place (JCGM 100, the GUM, §7.2.2 — common practice; the rule of figures/parts/tickFormat.ts that
 * the app and the report's other tables use) — and a 10 × 10 grid still no wider than the A4 text
 * width when printed. A4 is 210 mm wide (ISO 216), less the report's 14 mm margins each side
 * (reportStyles.ts); 96 CSS px per inch (CSS Values §6.2). The maps are invented drawing data.
 */
import { chromium, type Browser } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { retuneSection } from '../../src/pipeline/report/reportRetune';
import { REPORT_CSS } from '../../src/pipeline/report/reportStyles';
import type { RetuneMapResult } from '../../src/pipeline/retuneMaps';
import type { ReportInput } from '../../src/pipeline/report/reportInput';
import { requireChromium } from '../support/chromiumPath';

const A4_TEXT_WIDTH_PX = Math.floor((182 / 25.4) * 96);

/** An invented n × n bowl of J around `centre`, every interval `halfWidth` either side. */
function invented(n: number, centre: number, halfWidth: number): RetuneMapResult {
  const gains = Array.from({ length: n }, (_, i) => 10 + 10 * i), times = Array.from({ length: n }, (_, i) => Math.round(300 * 2 ** (i / 2)));
  const points = gains.flatMap((g) => times.map((t) => {
    const value = centre * (1 + 0.0001 * (g - 42) ** 2 + 0.013 * Math.log2(t / 2400) ** 2);
    return { coordinates: [g, t], value, interval: [value - halfWidth, value + halfWidth] as [number, number], status: 'converged', support: null, occupancyShift: 1, route: 'closedForm' as never };
  }));
  return {
    candidate: 'invented PI', features: 'polynomial degree 2', notes: [], presentController: centre * 1.1, points,
    axes: [{ parameter: 'form.loops.0.proportionalGain', label: 'proportional gain K_c (%/°C)', values: gains }, { parameter: 'form.loops.0.integralTimeSeconds', label: 'integral time T_i (s)', values: times }],
    best: { index: 3, value: points[3].value, coordinates: points[3].coordinates },
  };
}

function section(map: RetuneMapResult): string {
  const input = { retuneMaps: [map], retuneMapProblems: [], evaluation: { valueSense: 'cost' }, project: { columns: { reward: { unit: 'kWh' } } } } as unknown as ReportInput;
  let n = 0;
  return retuneSection(input, { next: () => ++n } as never).html;
}

describe('the report\'s retune grid', () => {
  let browser: Browser;
  beforeAll(async () => {
    browser = await chromium.launch({ executablePath: requireChromium(), args: ['--headless=new', '--no-sandbox', '--disable-gpu'] });
  });
  afterAll(async () => browser?.close());

  it('writes each cell\'s J at its interval\'s decimal place', () => {
    const html = section(invented(3, 8.5, 0.02)); // width 0.04 → 4 decimals for three significant digits
    const first = /<td class="num retune-supported[^>]*>([^<]*)<br\/><span class="small">([^<]*)<\/span>/.exec(html)!;
    const decimals = (s: string) => s.split('.')[1]?.length ?? 0;
    const [lo, hi] = first[2].slice(1, -1).split(', ');
    expect(first[2]).toMatch(/^\[[\d.]+, [\d.]+\]$/);
    expect([decimals(first[1]), decimals(lo), decimals(hi)]).toEqual([4, 4, 4]);
    expect(Number(hi) - Number(lo)).toBeCloseTo(0.04, 4);
  });

  it('prints a 10 × 10 grid within the A4 text width, narrow intervals and large values included', async () => {
    const page = await browser.newPage({ viewport: { width: A4_TEXT_WIDTH_PX, height: 1000 } });
    await page.emulateMedia({ media: 'print' });
    for (const [centre, halfWidth] of [[8.5, 2], [8.5, 0.02], [1234.5, 15], [0.0321, 0.004], [45678, 900]]) {
      await page.setContent(`<html><head><style>${REPORT_CSS}</style></head><body>${section(invented(10, centre, halfWidth))}</body></html>`);
      const width = await page.$eval('.retune-grid', (e) => e.getBoundingClientRect().width);
      expect(width, `J ≈ ${centre} ± ${halfWidth}`).toBeLessThanOrEqual(A4_TEXT_WIDTH_PX);
      expect(await page.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(A4_TEXT_WIDTH_PX);
    }
    await page.close();
  }, 60_000);
});
