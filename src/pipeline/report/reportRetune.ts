/**
 * The retune maps section: each map as a figure — the same chart the app draws and exports
 * (src/figures/charts/retuneMap.ts: a heat map over two parameters with the colour bar, the
 * unsupported points hatched and keyed in the legend, the best supported point outlined; a curve
 * over one), written inline by the shared figure stack (src/figures/writers/inlineSvg.ts) — and
 * below it the same numbers as a table, the accessible fallback: for two axes a grid laid out as the
 * figure is, the first axis across and the second up, each cell J with its interval, shaded by whether the logs support
 * it (the occupancy-shift rule, src/core/diagnostics/severity.ts); the present controller's value
 * for reference.
 */
import { retuneMapChart, retuneMapHeight, retuneMapSummary } from '../../figures/charts/retuneMap';
import { bestValueText } from '../../figures/charts/retuneMapText';
import { richTextHtml, subscriptMarkup } from '../../figures/parts/richText';
import { inlineSvg } from '../../figures/writers/inlineSvg';
import { CAUTION_SHORT } from '../cautions';
import type { RetuneMapPoint, RetuneMapResult } from '../retuneMaps';
import { escapeHtml, html, raw, type Html } from './htmlText';
import { shiftText } from '../../core/diagnostics/shiftText';
import { intervalAtPrecision, valueAtPrecision } from '../../figures/parts/uncertainNumber';
import { gridPointLabels, tuningValueTexts } from '../../figures/parts/tickFormat';
import { shownMap } from '../../figures/parts/tuningAxis';
import { senseWords, valueAxisLabel, valueUnit, type FigureCounter, type ReportInput } from './reportInput';
import { valueColumnHead, valueUnitWords } from '../valueUnitWords';

/** The figure's width in CSS px: the report's text column (reportStyles.ts, 980 px less padding). */
const MAP_WIDTH_PX = 720;
/** Most grid columns in one table, however narrow the numbers. */
const MOST_COLUMNS = 10;
/** The printed text width: A4's 210 mm (ISO 216) less the report's 14 mm side margins (reportStyles.ts), at 96 CSS px per inch. */
const TEXT_WIDTH_PX = Math.floor((182 / 25.4) * 96);
/**
 * A grid cell's text (0.85 × 13 px = 11.05 px, reportStyles.ts) in CSS px per character: a digit or
 * letter, and a narrow mark (". , [ ]"). The stylesheet's faces (Segoe UI, Arial and their metric twins)
 * set digits at 0.556 em = 6.15 px and these marks at 3.07 px (measured in Chromium); 4 % more, so a
 * close call gives one column less rather than a grid past the margin. Checked against Chromium's
 * layout in test/pipeline/reportRetuneGrid.test.ts.
 */
const CHAR_PX = { wide: 6.4, narrow: 3.2 } as const;
/** A cell's padding (2 × 4 px) and 2 px for rounding. */
const CELL_EXTRA_PX = 10;

const SUPPORT_WORD = { caution: 'thin logs', serious: 'beyond the logs', unknown: 'support unknown' } as const;

export function retuneSection(input: ReportInput, figures: FigureCounter): Html {
  const maps = input.retuneMaps;
  if (maps.length === 0 && input.retuneMapProblems.length === 0) {
    return html`<section id="retune-maps"><h2>Retune maps</h2><p>This project defines no retune map (the project field <code>retuneMaps</code>).</p></section>`;
  }
  return html`<section id="retune-maps"><h2>Retune maps</h2>
    ${input.retuneMapProblems.length ? html`<p>Not computed: ${input.retuneMapProblems.join('; ')}</p>` : html``}
    <p>Each point is J of the candidate with the numbers on its axes, by linear fitted Q-evaluation on the same logs.
      In the figure, hatched points are on thin logs (light hatching) or beyond the logs (grey, dense hatching) — read those as extrapolation; the outlined point is the best supported one.
      The table under each figure gives the same numbers with their intervals:
      <span class="retune-supported">unshaded</span>: the logs support the estimate; <span class="retune-caution">light</span>: thin logs (caution);
      <span class="retune-serious">dark</span>: beyond the logs (serious).</p>
    ${maps.map(shownMap).map((m, i) => html`${mapFigure(input, m, i, figures.next())}${mapTable(m, valueUnit(input))}`)}</section>`; // tuning values in their axes' shown units (an integral time in minutes)
}

/** "proportional gain K_c (%/°C)" with its symbol's subscript set as HTML. */
function axisHtml(label: string): string {
  return richTextHtml(subscriptMarkup(label), escapeHtml);
}

/** The map drawn by the shared chart, with a numbered caption that says what is marked and the short caution. */
function mapFigure(input: ReportInput, map: RetuneMapResult, index: number, n: number): Html {
  const words = senseWords(input);
  const props = {
    map: { ...map, axes: map.axes.map((a) => ({ ...a, label: subscriptMarkup(a.label) })) },
    valueLabel: valueAxisLabel(input, 'J'), sense: input.evaluation.valueSense, title: '', theme: 'light' as const,
  };
  const svg = inlineSvg((look) => retuneMapChart(props, look), {
    widthPx: MAP_WIDTH_PX, heightPx: retuneMapHeight(map), id: `retune-map-${index}`, label: retuneMapSummary(props),
  });
  const over = raw(map.axes.map((a) => axisHtml(a.label)).join(map.axes.length === 2 ? ' (across) and ' : ''));
  return html`<figure id="fig-retune-map-${index}" class="retune-figure">${raw(svg)}<figcaption>Figure ${n}. Retune map of ${map.candidate}: J (${words.value}, ${words.better}) over ${over}${map.axes.length === 2 ? ' (up)' : ''};
    hatched: not supported by the logs; outlined: the best supported point${map.presentController === null ? '' : '; dashed: the present controller'}. The table below gives each point’s value and interval. ${CAUTION_SHORT}</figcaption></figure>`;
}

function mapTable(map: RetuneMapResult, unit: string): Html {
  const best = map.best, bestInterval = best ? map.points[best.index]?.interval ?? null : null;
  const caption = html`<p><strong>${map.candidate}</strong> — ${best
    ? html`best supported point ${raw(tuningValueTexts(map.axes, best.coordinates).map((text, a) => `${axisHtml(map.axes[a].label)} = ${escapeHtml(text)}`).join(', '))}, J ${bestValueText(map)}`
    : 'no point is both converged and supported by the logs'}${map.presentController === null ? '' : `; present controller J ${valueAtPrecision(map.presentController, bestInterval)}`}.${
    // A grid's cells have no J head of their own: the caption says what they hold, in which unit (valueUnitWords).
    map.axes.length === 1 ? '' : ` Each cell: J at that point, ${valueUnitWords(unit)}, with its interval below it.`}</p>`;
  const notes = html`<ul class="small">${map.notes.map((n) => html`<li>${n}</li>`)}</ul>`;
  const cell = (p: RetuneMapPoint, i: number) => html`<td class="num retune-${p.support === null ? 'supported' : p.support}${best?.index === i ? ' retune-best' : ''}"
    title="${p.support === null ? 'supported' : SUPPORT_WORD[p.support]}; occupancy shift ${shiftText(p.occupancyShift)}">${p.value === null ? `no value (${p.status})` : valueAtPrecision(p.value, p.interval)}<br/><span class="small">${intervalAtPrecision(p.interval)}</span></td>`;
  if (map.axes.length === 1) {
    return html`${caption}<table><thead><tr><th>${raw(axisHtml(map.axes[0].label))}</th><th class="num">${valueColumnHead('J', unit)} and interval</th></tr></thead><tbody>
      ${map.points.map((p, i) => html`<tr><td class="num">${tuningValueTexts(map.axes, p.coordinates)[0]}</td>${cell(p, i)}</tr>`)}</tbody></table>${notes}`;
  }
  return html`${caption}${gridTables(map, cell)}${notes}`;
}

/**
 * The grid as the figure draws it: the first axis across (columns, left to right), the second up
 * (rows, highest at the top), so a cell stands where its point stands in the figure. Wider than
 * MOST_COLUMNS, the columns are split into balanced blocks, each a table of its own with the row
 * values repeated, so a grid of up to 20 per axis (the schema's limit) keeps to the A4 text width.
 */
function gridTables(map: RetuneMapResult, cell: (p: RetuneMapPoint, i: number) => Html): Html[] {
  const [across, up] = map.axes, n = up.values.length, blocks = Math.ceil(across.values.length / columnsThatFit(map));
  const acrossText = gridPointLabels(across.values), upText = gridPointLabels(up.values); // as the figure's axes label them
  const size = Math.ceil(across.values.length / blocks), rowOrder = up.values.map((_, r) => n - 1 - r);
  return Array.from({ length: blocks }, (_, b) => {
    const columns = across.values.map((_, c) => c).slice(b * size, (b + 1) * size);
    const part = blocks > 1 ? ` (columns ${columns[0] + 1}–${columns[columns.length - 1] + 1} of ${across.values.length})` : '';
    return html`<table class="retune-grid"><thead><tr><th>${raw(axisHtml(up.label))} ↑ · ${raw(axisHtml(across.label))} →${part}</th>${columns.map((c) => html`<th class="num">${acrossText[c]}</th>`)}</tr></thead><tbody>
    ${rowOrder.map((r) => html`<tr><th class="num">${upText[r]}</th>${columns.map((c) => cell(map.points[c * n + r], c * n + r))}</tr>`)}
    </tbody></table>`;
  });
}

/** Estimated width of a line of grid text that does not break (a value, an interval's end with its bracket). */
function textPx(text: string): number {
  return [...text].reduce((sum, ch) => sum + (/[.,:;[\]()' ]/.test(ch) ? CHAR_PX.narrow : CHAR_PX.wide), 0);
}

/**
 * How many columns of the grid fit the text width beside the row values: the widest unbreakable piece
 * of any cell (its value, or one end of its interval: an interval may break after its comma) decides.
 */
function columnsThatFit(map: RetuneMapResult): number {
  const [across, up] = map.axes;
  const pieces = map.points.flatMap((p) => [p.value === null ? `no value (${p.status})`.split(' ') : [valueAtPrecision(p.value, p.interval)], intervalAtPrecision(p.interval).split(' ')].flat());
  const cellPx = Math.max(...[...pieces, ...gridPointLabels(across.values)].map(textPx)) + CELL_EXTRA_PX;
  const labelWords = `${up.label} ${across.label}`.split(/\s+/);
  const rowHeaderPx = Math.max(...[...labelWords, ...gridPointLabels(up.values)].map(textPx)) + CELL_EXTRA_PX;
  return Math.max(1, Math.min(MOST_COLUMNS, Math.floor((TEXT_WIDTH_PX - rowHeaderPx) / cellPx)));
}
