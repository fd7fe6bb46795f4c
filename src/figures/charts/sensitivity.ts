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

export const SENSITIVITY_DEFAULTS = { heightPx: 300, lineWidthPx: 2, pointRadiusPx: 3, projectPointRadiusPx: 6, crossRadiusPx: 7, crossWidthPx: 2.5 } as const;

/** The legend's words for a crossed point (a J whose change from another discount lies beyond what the per-step values allow; the sentence under the figure says so). */
export const BEYOND_POSSIBLE_KEY = 'J that cannot be right (changes with γ too much)';

/**
 * The ranking verdict of one sweep, as every host says it (chart subtitle, panel, report, summary):
 * the settings where a J cannot be right are left out, and named.
 */
export function rankingVerdict(curve: Pick<SensitivityCurve, 'rankingStable' | 'leftOut' | 'settings'>, brief = false): string {
  const base = curve.rankingStable ? 'the ranking is the same at every setting' : 'the ranking changes within this range';
  const out = curve.leftOut ?? [];
  if (!out.length) return base;
  const where = curve.rankingStable ? `${base} where every J can be right` : base;
  // Brief, for the figure's subtitle: the settings left out are read off the crosses, and named under the figure.
  return brief ? where : `${where} (left out: ${out.map((i) => formatValue(curve.settings[i])).join(', ')}, where a J cannot be right)`;
}

/**
 * Which points are crossed, in one sentence for the panel and the report ("J of “A” at 0.966 and 0.975
 * cannot be right …"); null when none is. `name` shows a series' name as the host does.
 */
export function beyondPossibleSentence(curve: Pick<SensitivityCurve, 'series' | 'settings'>, name: (n: string) => string = (n) => n): string | null {
  const parts = curve.series.flatMap((serie) => {
    const at = curve.settings.flatMap((x, i) => (serie.beyondPossible?.[i] ? [formatValue(x)] : []));
    return at.length ? [`of “${name(serie.name)}” at ${at.length > 1 ? `${at.slice(0, -1).join(', ')} and ${at[at.length - 1]}` : at[0]}`] : [];
  });
  if (!parts.length) return null;
  return `Crossed points: J ${parts.join('; ')} cannot be right — its change from another setting lies beyond what the per-step values allow, on paired resamples of the runs (the candidate’s warnings say by how much).`;
}

/** rankingVerdict as a sentence of its own. */
export function rankingSentence(curve: Pick<SensitivityCurve, 'rankingStable' | 'leftOut' | 'settings'>): string {
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
  const crossed = curve.series.some((serie) => serie.beyondPossible?.some(Boolean));
  const shared = sharedOptions(look, props.title, `large points: the project’s setting (${formatValue(curve.settings[curve.projectIndex] ?? NaN)}); ${rankingVerdict(curve, true)}`);
  const keys: LegendKey[] = datasets.map((set) => ({
    label: String(set.label), kind: 'line' as const, colour: String(set.borderColor), lineWidthPx: d.lineWidthPx,
    dash: (set.borderDash as number[]).map((v) => v / s), markerRadiusPx: d.pointRadiusPx,
  }));
  if (crossed) keys.push({ label: BEYOND_POSSIBLE_KEY, kind: 'marker', colour: p.mutedText, overlay: crossSwatch(d.crossRadiusPx, d.crossWidthPx, p.mutedText) });
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
        x: integerSettings(curve.settings) ? integerAxis(valueAxis(look, curve.label, 'bottom')) : { ...valueAxis(look, curve.label, 'bottom'), type: 'linear' },
        y: { ...valueAxis(look, props.valueLabel, 'left'), type: 'linear' },
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
