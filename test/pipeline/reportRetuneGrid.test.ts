/**
 * The report's retune grid (pipeline/report/reportRetune.ts): each cell's J and its interval at one
 * precision — the interval's ends to three significant digits of its width, J to the same decimal
 * place (JCGM 100, the GUM, §7.2.2 — common practice; the rule of figures/parts/uncertainNumber.ts that
 * the app and the report's other tables use) — laid out as the figure beside it draws the map (the
 * first axis across, the second up: retuneMap.ts puts axes[0] on x and axes[1] on y), and grids up to
 * 20 × 20 (the schema's limit) no wider than the A4 text width when printed. A4 is 210 mm wide (ISO 216), less the report's 14 mm margins each side
 * (reportStyles.ts); 96 CSS px per inch (CSS Values §6.2). The maps are invented drawing data.
 */
import { chromium, type Browser } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { retuneSection } from '../../src/pipeline/report/reportRetune';
import { REPORT_CSS } from '../../src/pipeline/report/reportStyles';
import type { RetuneMapResult } from '../../src/pipeline/retuneMaps';
import type { ReportInput } from '../../src/pipeline/report/reportInput';
import { requireChromium } from '../support/chromiumPath';
import { join } from 'node:path';

const SCREENS = join(__dirname, '..', '..', 'test-artifacts', 'screens');

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

  it('lays the grid out as the figure: the first axis across, the second up (highest row first)', () => {
    const map = invented(3, 8.5, 0.02), html = section(map);
    const table = html.slice(html.indexOf('<table class="retune-grid"'));
    const headers = [...table.slice(0, table.indexOf('</thead>')).matchAll(/<th class="num">([^<]*)<\/th>/g)].map((m) => Number(m[1]));
    const rows = [...table.matchAll(/<tr><th class="num">([^<]*)<\/th>/g)].map((m) => Number(m[1]));
    expect(headers).toEqual(map.axes[0].values);
    expect(rows).toEqual([...map.axes[1].values].reverse());
    // The cell at the top left is the point at the first gain and the largest integral time.
    const first = /<td class="num[^>]*>([^<]*)<br\/>/.exec(table)!;
    const point = map.points.find((p) => p.coordinates[0] === map.axes[0].values[0] && p.coordinates[1] === map.axes[1].values[2])!;
    expect(first[1]).toBe(point.value!.toFixed(4));
  });

  it('prints grids up to 20 × 20 within the A4 text width, narrow intervals and large values included', async () => {
    const page = await browser.newPage({ viewport: { width: A4_TEXT_WIDTH_PX, height: 1000 } });
    await page.emulateMedia({ media: 'print' });
    for (const n of [10, 13, 20]) {
      for (const [centre, halfWidth] of [[8.5, 2], [8.5, 0.02], [1234.5, 15], [0.0321, 0.004], [45678, 900], [1234567.8, 3.2]]) {
        await page.setContent(`<html><head><style>${REPORT_CSS}</style></head><body>${section(invented(n, centre, halfWidth))}</body></html>`);
        const widths = await page.$$eval('.retune-grid', (all) => all.map((e) => e.getBoundingClientRect().width));
        for (const width of widths) expect(width, `${n} × ${n}, J ≈ ${centre} ± ${halfWidth}`).toBeLessThanOrEqual(A4_TEXT_WIDTH_PX);
        expect(await page.evaluate(() => document.documentElement.scrollWidth), `${n} × ${n}, J ≈ ${centre}`).toBeLessThanOrEqual(A4_TEXT_WIDTH_PX);
        // Every point once, in one of the tables.
        expect(await page.$$eval('.retune-grid td', (cells) => cells.length)).toBe(n * n);
        if (n === 10 && centre < 1e4) expect(widths, `10 × 10, J ≈ ${centre}: one table where it fits`).toHaveLength(1);
        // For a person to look at: the widest grid the schema allows, split into blocks that fit the page.
        if (n === 20 && centre === 8.5 && halfWidth === 0.02) await page.screenshot({ path: join(SCREENS, 'report-retune-grid-20.png'), fullPage: true });
      }
    }
    await page.close();
  }, 120_000);
});
