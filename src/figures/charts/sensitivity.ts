/**
 * J over a range of one setting (the discount, the feature degree or centres, the network width):
 * one line per candidate and the logged behaviour as a dashed reference, the project's own setting
 * marked by a larger point. Whether the lines cross is what the reader looks for: a conclusion
 * that flips within the range depends on the setting.
 */
import type { ChartConfiguration, ChartDataset } from 'chart.js';
import type { SensitivityData as SensitivityCurve } from './figureData';
import { axisTitles, sharedOptions, valueAxis } from '../parts/chartStyle';
import { legendPlugin, type LegendKey } from '../parts/legendBox';
import { LOGGED_RETURN, LOGGED_RETURN_LABEL, PRESENT_DASH_PX } from '../parts/plotTheme';
import type { PlotLook } from '../parts/plotLook';
import type { Theme } from '../parts/plotTheme';
import { formatValue } from '../parts/tickFormat';
import { discountText } from '../../core/horizonText';
import { keepUnitGroups } from '../../core/unitGroups';
import { FIT_STATUS_WORDS, type FitStatus } from '../../core/fqe/fitStatus';

export const SENSITIVITY_DEFAULTS = { heightPx: 300, crossedExtraPx: 48, lineWidthPx: 2, pointRadiusPx: 3, projectPointRadiusPx: 6, crossRadiusPx: 7, crossWidthPx: 2.5 } as const;

/**
 * The on-screen height: with crosses the subtitle takes a second line and the legend a row more, which
 * at 300 px left a plot shorter than its value axis's title (the title ran up into the legend's cross).
 */
export function sensitivityChartHeight(curve: Pick<SensitivityCurve, 'series'>): number {
  const d = SENSITIVITY_DEFAULTS;
  return d.heightPx + (hasCrossedPoints(curve) ? d.crossedExtraPx : 0);
}

/**
 * The legend's words for a crossed point, short enough for one legend row. A failing pair says only
 * that its two J cannot both be right, not which is wrong, and the change may fail by being too small
 * as well as too large (a cost that falls as the horizon grows): so neither "cannot be right" of the
 * point alone nor "by more than". Every crossed point is in some failing pair (the crosses are a
 * fewest cover of them, core/diagnostics/possibleChange.ts fewestWrong); the sentence under the
 * figure says why (beyondPossibleSentence).
 */
export const BEYOND_POSSIBLE_KEY = 'J at odds with J at another γ';

/** A setting as the sentences name it: a discount by discountText (core/horizonText.ts), the rest by formatValue. */
function settingText(curve: Pick<SensitivityCurve, 'parameter' | 'settings'>, i: number): string {
  return curve.parameter === 'discount' ? discountText(curve.settings[i]) : formatValue(curve.settings[i]);
}

/**
 * The ranking verdict of one sweep, as every host says it (chart subtitle, panel, report, summary):
 * the settings where a J is crossed are left out, and named (pipeline/sweepRanking.ts).
 */
export function rankingVerdict(curve: Pick<SensitivityCurve, 'rankingStable' | 'leftOut' | 'settings' | 'parameter' | 'rankingChanges' | 'projectIndex'>): string {
  const out = curve.leftOut ?? [], changes = changesText(curve);
  const verdict = `${shortVerdict(curve)}${changes ? `: ${changes}` : ''}`;
  if (!out.length) return verdict;
  return `${verdict} (left out: ${out.map((i) => settingText(curve, i)).join(', ')}, where a J is crossed)`;
}

/** Settings named, and pairs per setting (grouped by the one ranked above), before "and N more". */
const CHANGES_NAMED = { settings: 3, pairs: 3 } as const;

/** A series' name in quotes, each number held to its unit (core/unitGroups.ts), so a sentence wraps "“PI with a 2 %/min rate limit”" between words, not inside "2 %/min". */
const quoted = (name: string): string => `“${keepUnitGroups(name)}”`;

/** “A”, “B” and “C”. */
function listText(items: readonly string[]): string {
  return items.length > 1 ? `${items.slice(0, -1).join(', ')} and ${items[items.length - 1]}` : items[0];
}

/**
 * Where the ranking differs from the project's setting, in words: "at 1, “B” ranks above “A” and “C”,
 * and “A” above “C”; each the other way round at the project’s 2"; empty when the curve has no changes
 * (stable, or saved before they were kept). A pair tied at either setting is never among them, so "ranks
 * above" is true of the two J (pipeline/sweepRanking.ts). The pairs at a setting are grouped by the one ranked above;
 * where the project's own setting is left out, the first setting kept is named (pipeline/sweepRanking.ts).
 */
function changesText(curve: Pick<SensitivityCurve, 'rankingChanges' | 'settings' | 'parameter' | 'projectIndex' | 'leftOut'>): string {
  const changes = curve.rankingChanges ?? [], out = curve.leftOut ?? [];
  if (!changes.length) return '';
  const more = (shown: number, all: number) => (all > shown ? ` (${all - shown} more pair${all - shown > 1 ? 's' : ''})` : '');
  const parts = changes.slice(0, CHANGES_NAMED.settings).map(({ at, swapped }) => {
    const shown = swapped.slice(0, CHANGES_NAMED.pairs), ahead = [...new Set(shown.map(([a]) => a))];
    const groups = ahead.map((a, k) => `${quoted(a)} ${k === 0 ? 'ranks ' : ''}above ${listText(shown.filter(([x]) => x === a).map(([, b]) => quoted(b)))}`);
    return `at ${settingText(curve, at)}, ${groups.join(', and ')}${more(shown.length, swapped.length)}`;
  });
  const reference = out.includes(curve.projectIndex)
    ? `the first setting without a crossed J, ${settingText(curve, curve.settings.findIndex((_, i) => !out.includes(i)))}`
    : `the project’s ${settingText(curve, curve.projectIndex)}`;
  const rest = changes.length - parts.length, pairs = changes.reduce((n, c) => n + c.swapped.length, 0);
  return `${parts.join('; ')}${rest > 0 ? `; and at ${rest} more setting${rest > 1 ? 's' : ''}` : ''}; ${pairs > 1 ? 'each ' : ''}the other way round at ${reference}`;
}

/** rankingVerdict without the settings left out, for the figure's subtitle (Chart.js squeezes a line wider than the plot). */
function shortVerdict(curve: Pick<SensitivityCurve, 'rankingStable' | 'leftOut' | 'settings'>): string {
  const out = curve.leftOut ?? [];
  if (!out.length) return curve.rankingStable ? 'the ranking is the same at every setting' : 'the ranking changes within this range';
  if (curve.settings.length - out.length < 2) return 'too few settings without a crossed J to compare the ranking';
  return curve.rankingStable ? 'the ranking is the same at every setting without a crossed J' : 'the ranking changes between the settings without a crossed J';
}

/** Whether some point of the sweep is crossed. */
export function hasCrossedPoints(curve: Pick<SensitivityCurve, 'series'>): boolean {
  return curve.series.some((serie) => serie.beyondPossible?.some(Boolean) ?? false);
}

/** The sweeps' verdicts in one phrase, for the Findings panel's gist and the answer's link to it. */
export function sweepsVerdict(curves: readonly Pick<SensitivityCurve, 'rankingStable' | 'series'>[]): string {
  const crossed = curves.some(hasCrossedPoints);
  if (!curves.every((c) => c.rankingStable)) return `the ranking changes within the range${crossed ? '; some J are crossed (at odds with J at another discount)' : ''}`;
  return crossed ? 'the ranking is the same at every setting without a crossed J; some J are crossed (at odds with J at another discount)' : 'the ranking is the same at every setting shown';
}

/**
 * Which points are crossed, in one sentence for the panel and the report ("J of “A” at 0.966 and
 * 0.975 …"); null when none is. `name` shows a series' name as the host does.
 */
export function beyondPossibleSentence(curve: Pick<SensitivityCurve, 'series' | 'settings' | 'parameter'>, name: (n: string) => string = (n) => n): string | null {
  const parts = curve.series.flatMap((serie) => {
    const at = curve.settings.flatMap((_, i) => (serie.beyondPossible?.[i] ? [settingText(curve, i)] : []));
    return at.length ? [`of ${quoted(name(serie.name))} at ${at.length > 1 ? `${at.slice(0, -1).join(', ')} and ${at[at.length - 1]}` : at[0]}`] : [];
  });
  if (!parts.length) return null;
  return `Crossed points: J ${parts.join('; ')}. Between a crossed J and J at another setting the change lies outside what the per-step values allow, on paired resamples of the runs, so the two cannot both be right; the crosses are the fewest points that account for every such pair (the candidate’s warnings say by how much).`;
}

/** A swept fit's status in the words a reader sees (core/fqe/fitStatus.ts); an engine's message as it is. */
function statusWords(status: string): string {
  if (status === 'singular') return 'no solution: its equations are singular';
  return status in FIT_STATUS_WORDS ? FIT_STATUS_WORDS[status as FitStatus] : status;
}

/** Statuses of a point that stands for a converged fit, or for the logged return (no fit). */
const SETTLED_STATUSES = new Set(['converged', 'project setting', 'logged']);

/**
 * The points no converged fit stands behind, in one sentence for the panel, the report and the
 * command line: where a series has no J (its fit at that setting failed or did not meet its
 * convergence rule; a gap in the line) and where a J is drawn as the fit reached it without meeting
 * the rule (a network stopped at its iteration limit, or the project's own unconverged fit). A gap or
 * an unconverged point is never left unexplained; null when every point stands for a converged fit.
 */
export function unconvergedPointsSentence(curve: Pick<SensitivityCurve, 'series' | 'settings' | 'parameter'>, name: (n: string) => string = (n) => n): string | null {
  const named = (drawn: boolean) => curve.series.flatMap((serie) => curve.settings.flatMap((_, i) => {
    const status = serie.status?.[i] ?? (serie.values[i] === null ? 'no value' : 'converged');
    const pick = drawn ? serie.values[i] !== null && !SETTLED_STATUSES.has(status) : serie.values[i] === null;
    return pick ? [`${quoted(name(serie.name))} at ${settingText(curve, i)} (${statusWords(status)})`] : [];
  }));
  const gaps = named(false), drawn = named(true);
  const parts = [
    ...(gaps.length ? [`No J where the fit at that setting failed or did not converge: ${gaps.join('; ')}; the line has a gap there, and the ranking at that setting is read among the others.`] : []),
    ...(drawn.length ? [`Drawn where the fit reached it without converging, so not to be relied on: ${drawn.join('; ')}.`] : []),
  ];
  return parts.length ? parts.join(' ') : null;
}

/** rankingVerdict as a sentence of its own. */
export function rankingSentence(curve: Pick<SensitivityCurve, 'rankingStable' | 'leftOut' | 'settings' | 'parameter' | 'rankingChanges' | 'projectIndex'>): string {
  return `${sentence(rankingVerdict(curve))}.`;
}

/** A cross in a legend swatch, as Chart.js draws 'crossRot' points. */
function crossSwatch(radiusPx: number, widthPx: number, colour: string): NonNullable<LegendKey['overlay']> {
  return (ctx, rect, look) => {
    const r = radiusPx * look.scale * Math.SQRT1_2, x = rect.x + rect.width / 2, y = rect.y + rect.height / 2;
    ctx.save();
    ctx.strokeStyle = colour;
    ctx.lineWidth = widthPx * look.scale;
    ctx.beginPath();
    ctx.moveTo(x - r, y - r);
    ctx.lineTo(x + r, y + r);
    ctx.moveTo(x - r, y + r);
    ctx.lineTo(x + r, y - r);
    ctx.stroke();
    ctx.restore();
  };
}

export interface SensitivityPlotProps {
  curve: SensitivityCurve;
  /** What J is, with its sense, for the value axis (e.g. "J (discounted cost: lower is better)"). */
  valueLabel: string;
  title: string;
  theme: Theme;
}

type XY = { x: number; y: number | null };

/**
 * The logged return's series, drawn as the reference: marked by the pipeline (`reference`); in results
 * saved before the mark, the series the host labelled as the logged return. Never by a prefix of the
 * name, which drew a candidate the user named "logged …" or "present controller …" as the reference.
 */
export function isBehaviourSeries(serie: { name: string; reference?: boolean }): boolean {
  return serie.reference ?? serie.name === LOGGED_RETURN;
}

export function sensitivityChart(props: SensitivityPlotProps, look: PlotLook): ChartConfiguration<'line', XY[]> {
  const { curve } = props, p = look.palette, s = look.scale, d = SENSITIVITY_DEFAULTS;
  let candidate = 0;
  const datasets: ChartDataset<'line', XY[]>[] = curve.series.map((serie) => {
    const reference = isBehaviourSeries(serie);
    const colour = reference ? p.reference : p.series[candidate++ % p.series.length];
    return {
      label: reference ? LOGGED_RETURN_LABEL : serie.name,
      data: curve.settings.map((x, i) => ({ x, y: serie.values[i] })),
      borderColor: colour, backgroundColor: colour, borderWidth: d.lineWidthPx * s, borderDash: reference ? PRESENT_DASH_PX.map((v) => v * s) : [],
      pointRadius: curve.settings.map((_, i) => (serie.beyondPossible?.[i] ? d.crossRadiusPx : i === curve.projectIndex ? d.projectPointRadiusPx : d.pointRadiusPx) * s),
      pointStyle: curve.settings.map((_, i) => (serie.beyondPossible?.[i] ? 'crossRot' as const : 'circle' as const)),
      pointBorderWidth: curve.settings.map((_, i) => (serie.beyondPossible?.[i] ? d.crossWidthPx : 1) * s),
      spanGaps: false,
    };
  });
  // With crosses the verdict is longer: on a line of its own, where Chart.js would squeeze one line past the plot's width.
  const project = `large points: the project’s setting (${formatValue(curve.settings[curve.projectIndex] ?? NaN)})`;
  const shared = sharedOptions(look, props.title, curve.leftOut?.length ? [project, shortVerdict(curve)] : `${project}; ${shortVerdict(curve)}`);
  const keys: LegendKey[] = datasets.map((set) => ({
    label: String(set.label), kind: 'line' as const, colour: String(set.borderColor), lineWidthPx: d.lineWidthPx,
    dash: (set.borderDash as number[]).map((v) => v / s), markerRadiusPx: d.pointRadiusPx,
  }));
  if (curve.series.some((serie) => serie.beyondPossible?.some(Boolean))) keys.push({ label: BEYOND_POSSIBLE_KEY, kind: 'marker', colour: p.mutedText, overlay: crossSwatch(d.crossRadiusPx, d.crossWidthPx, p.mutedText) });
  return {
    type: 'line',
    data: { datasets },
    plugins: [
      legendPlugin(keys, look),
      ...axisTitles(look, [{ scaleId: 'x', position: 'bottom', text: curve.label }, { scaleId: 'y', position: 'left', text: props.valueLabel }]),
    ],
    options: {
      ...shared,
      parsing: false,
      interaction: { mode: 'index', intersect: false },
      scales: {
        x: integerSettings(curve.settings) ? integerAxis(valueAxis(look, 'bottom')) : { ...valueAxis(look, 'bottom'), type: 'linear' },
        y: { ...valueAxis(look, 'left'), type: 'linear' },
      },
      plugins: {
        ...shared.plugins,
        tooltip: { ...shared.plugins?.tooltip, callbacks: { label: (item) => `${item.dataset.label}: ${item.parsed.y === null ? 'no value' : formatValue(item.parsed.y)}` } },
      },
    },
  };
}

/** A setting that only takes whole values (a polynomial degree, a network width): ticks on whole numbers only, no "1.2" degrees. */
function integerSettings(settings: readonly number[]): boolean {
  return settings.length > 0 && settings.every((v) => Number.isInteger(v));
}

function integerAxis(axis: ReturnType<typeof valueAxis>): ReturnType<typeof valueAxis> & { type: 'linear' } {
  return { ...axis, type: 'linear', ticks: { ...axis.ticks, precision: 0 } };
}

export function sensitivitySummary(props: SensitivityPlotProps): string {
  const { curve } = props;
  const lines = curve.series.map((serie) => {
    const shown = serie.values.filter((v): v is number => v !== null);
    return shown.length === 0 ? `${serie.name}: no values` : `${serie.name} from ${formatValue(Math.min(...shown))} to ${formatValue(Math.max(...shown))}`;
  });
  return `${props.valueLabel} over ${curve.label} from ${formatValue(curve.settings[0])} to ${formatValue(curve.settings[curve.settings.length - 1])}: ${lines.join('; ')}. `
    + rankingSentence(curve);
}

function sentence(text: string): string {
  return text.charAt(0).toUpperCase() + text.slice(1);
}
