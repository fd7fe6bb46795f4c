/**
 * The trend of the logged signals shows the runs left out by label: shaded like a time window, one
 * "left out" key, the reason in the band and on hover; on a clock that starts again in each run
 * (bands would cover runs kept too) drawn muted instead, which the subtitle says. Invented rows;
 * the group marks are worked by hand.
 */
import { describe, expect, it } from 'vitest';
import { groupsLeftOut, leftOutStretches } from '../../src/core/trend/groupsLeftOut';
import { signalEnvelope } from '../../src/core/trend/signalEnvelope';
import { MUTED_RUNS_WORDS, trendChart, trendSummary, type TrendPlotProps } from '../../src/figures/charts/trendChart';
import { plotPalette } from '../../src/figures/parts/plotTheme';
import type { PlotLook } from '../../src/figures/parts/plotLook';
import { exportPlotSvg } from '../../src/figures/writers/exportSvg';
import { estimatedTextMeasure } from '../../src/figures/writers/textMeasure';

const look: PlotLook = { palette: plotPalette('light'), scale: 1, interactive: false };

describe('groups of the trend holding runs left out', () => {
  it('marks a group by its first row left out, and joins a range\'s groups into stretches', () => {
    // rows 0–7; range 1 on rows 2–4, range 2 on rows 6–7; groups of 3 rows: [0,1,2] [3,4,5] [6,7]
    const marked = groupsLeftOut(Uint16Array.from([0, 0, 1, 1, 1, 0, 2, 2]), 3, 3);
    expect([...marked]).toEqual([1, 1, 2]);
    expect(leftOutStretches(marked)).toEqual([{ range: 0, first: 0, last: 1 }, { range: 1, first: 2, last: 2 }]);
    expect(leftOutStretches(Uint16Array.from([0, 2, 2, 0, 2]))).toEqual([{ range: 1, first: 1, last: 2 }, { range: 1, first: 4, last: 4 }]);
  });
});

/** 100 rows, one per second, in 4 runs of 25; runs 2 and 3 (rows 25–74) left out as one range. */
function props(runTime = false): TrendPlotProps {
  const time = Float64Array.from({ length: 100 }, (_, r) => (runTime ? r % 25 : r));
  const trend = signalEnvelope([{ name: 'level', role: 'state', unit: 'm', values: Float64Array.from({ length: 100 }, (_, r) => Math.sin(r / 7)) }], time, 'seconds', false);
  const inRange = Uint16Array.from({ length: 100 }, (_, r) => (r >= 25 && r < 75 ? 1 : 0));
  return {
    trend: { ...trend, leftOut: groupsLeftOut(inRange, trend.rowsPerGroup, trend.time.length) },
    windows: [], title: 'Logged signals over time', theme: 'light', runTime, runsLeftOut: ['runs "2" to "3": trip test'],
  };
}

describe('the trend with runs left out by label', () => {
  it('shades them from their first row to the next row kept, with a "left out" key and the reason on hover', () => {
    const config = trendChart(props(), look);
    expect(config.plugins?.map((p) => p.id)).toContain('setpointLegend');
    const footer = config.options?.plugins?.tooltip?.callbacks?.footer as unknown as (items: unknown[]) => string;
    expect(footer([{ parsed: { x: 50 }, raw: { x: 50, y: 0, g: 50 } }])).toBe('left out: runs "2" to "3": trip test');
    expect(footer([{ parsed: { x: 10 }, raw: { x: 10, y: 0, g: 10 } }])).toBe('');
    expect(footer([{ parsed: { x: 75 }, raw: { x: 75, y: 0, g: 75 } }])).toBe('left out: runs "2" to "3": trip test'); // the band ends at the next row kept
    expect(footer([{ parsed: { x: 76 }, raw: { x: 76, y: 0, g: 76 } }])).toBe('');
    expect(trendSummary(props())).toContain('Runs left out by label, shaded: runs "2" to "3": trip test.');
  });

  it('on run time: drawn muted (no band over runs kept), said in the subtitle and the summary', () => {
    const p = props(true), config = trendChart(p, look);
    const segment = config.data.datasets[0].segment as { borderColor: (c: { p1DataIndex: number }) => string | undefined };
    const data = config.data.datasets[0].data;
    const at = (row: number) => data.findIndex((d) => d.g === row);
    expect(segment.borderColor({ p1DataIndex: at(50) })).toBe(look.palette.mutedText);
    expect(segment.borderColor({ p1DataIndex: at(10) })).toBeUndefined();
    const footer = config.options?.plugins?.tooltip?.callbacks?.footer as unknown as (items: unknown[]) => string;
    expect(footer([{ parsed: { x: 0 }, raw: { x: 0, y: 0, g: 50 } }])).toBe('left out: runs "2" to "3": trip test');
    expect(footer([{ parsed: { x: 0 }, raw: { x: 0, y: 0, g: 10 } }])).toBe(''); // the same run time, a run kept
    expect(trendSummary(p)).toContain(MUTED_RUNS_WORDS);
    expect(trendSummary(p)).toContain('Runs left out by label, drawn muted: runs "2" to "3": trip test.');
  });

  it('the SVG export draws the same band with its reason and the key (one figure stack)', () => {
    const svg = exportPlotSvg({ kind: 'trend', props: props() }, { widthPx: 1200, heightPx: 500, dpi: 96, background: 'white', caption: '', caution: '' }, estimatedTextMeasure)!;
    expect(svg).toContain('left out: runs "2" to "3": trip test'.replace(/"/g, '&quot;'));
    expect(svg).toContain('>left out<');
  });
});
