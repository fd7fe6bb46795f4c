/** The comparison section: J of every policy with its intervals, paired differences and the ranking. */
import type { Assessment, IntervalEstimate } from '../assessment';
import { FIT_STATUS_WORDS } from '../../core/fqe/fitStatus';
import { html, raw, type Html } from './htmlText';
import { intervalAtPrecision, valueAtPrecision, valueWithError } from '../../figures/parts/uncertainNumber';
import { senseWords, valueAxisLabel, valueUnit, type FigureCounter, type ReportInput } from './reportInput';
import { valueColumnHead, valueUnitWords } from '../valueUnitWords';
import { intervalChart, intervalChartHeight, type IntervalRowData } from '../../figures/charts/intervalChart';
import { LOGGED_RETURN, PRESENT_CONTROLLER, VALUES_CHART_TITLE } from '../../figures/parts/plotTheme';
import { policyLabel } from '../policyNames';
import { inlineSvg } from '../../figures/writers/inlineSvg';
import { shareText, sharesText } from '../../core/shareText';
import { loggedReturnRole, truncationMatters } from '../../core/loggedReturn';
import { lawFittedOnMovingRows } from '../heldActionsCheck';
import { BASELINE_RANGE_READING } from '../baselineClassWarning';

export function comparisonSection(input: ReportInput, figures: FigureCounter): Html {
  const a = input.assessment;
  return html`<section id="comparison"><h2>Comparison of candidates</h2>
    ${a ? assessedComparison(input, a, figures) : pointComparison(input)}</section>`;
}

function assessedComparison(input: ReportInput, a: Assessment, figures: FigureCounter): Html {
  const words = senseWords(input), level = shareText(a.settings.level);
  const baseline = a.comparison.baseline, pc = a.presentController;
  const vsBaseline = new Map(a.comparison.differences.filter((d) => d.b === baseline.name).map((d) => [d.a, d]));
  // The completed logged return gets a row of its own only where the value past the runs' ends weighs enough to be said (core/loggedReturn.ts).
  const completed = truncationMatters(input.evaluation.behaviour);
  const rows = [
    ...a.candidates.map((c) => ({ name: c.name, estimate: c.policyValue, present: false })),
    ...(pc ? [{ name: `${PRESENT_CONTROLLER} — baseline`, estimate: pc.policyValue, present: true }] : []),
    ...(pc && completed ? [{ name: `${LOGGED_RETURN}, completed past time limits (check)`, estimate: pc.completedReturn, present: false }] : []),
    { name: pc ? `${LOGGED_RETURN} (${loggedReturnRole(completed, lawFittedOnMovingRows(a.heldActions))})` : `${LOGGED_RETURN} — baseline`, estimate: a.behaviour, present: !pc },
  ];
  // "Better than the baseline in", down the column at one precision (core/shareText.ts, sharesText).
  const differenceOf = rows.map((r) => (r.present ? undefined : vsBaseline.get(r.name)));
  const betterIn = sharesText(differenceOf.map((d) => d?.probabilityBetter ?? null));
  const figure = figures.next(), reference = pc ? pc.policyValue.value : a.behaviour.value;
  const chartRows: IntervalRowData[] = rows.map((r) => ({ label: r.name, value: r.estimate.value, interval: r.estimate.percentile, present: r.present }));
  return html`<p>J is the ${words.value}, ${valueUnitWords(valueUnit(input))} (${words.better}), the mean of ${raw('V<sup>π</sup>')} over the start states. ${baseline.note}
      Intervals are ${level} bootstrap intervals over runs; “minus baseline” is the paired difference J − J(baseline) on the same resamples.</p>
    <table><thead><tr><th>Policy</th><th class="num">${valueColumnHead('J', valueUnit(input))}</th><th class="num">Bootstrap s.e.</th><th class="num">${level} interval (percentile)</th><th class="num">${level} interval (basic)</th>
      <th class="num">Minus baseline</th><th class="num">${level} interval of the difference</th><th class="num">Better than the baseline in</th></tr></thead><tbody>
    ${rows.map((r, i) => {
      const d = differenceOf[i];
      return html`<tr><td>${r.name}</td>${estimateCells(r.estimate)}<td class="num">${d ? valueAtPrecision(d.difference.value, d.difference.percentile) : ''}</td>
        <td class="num">${d ? intervalAtPrecision(d.difference.percentile) : ''}</td><td class="num">${d ? resampleShare(betterIn[i], d.probabilityBetter) : ''}</td></tr>`;
    })}
    </tbody></table>
    ${baselineNotSettled(a)}
    <figure id="fig-comparison">${raw(intervalFigure('comparison-svg', chartRows, valueAxisLabel(input, 'J'), reference))}
      <figcaption>Figure ${figure}. ${VALUES_CHART_TITLE}, beside the baseline (dashed line), with ${level} percentile bootstrap intervals over ${a.settings.resamples.toLocaleString('en-US')} resamples of the ${a.settings.episodes} runs. ${words.better[0].toUpperCase()}${words.better.slice(1)}.</figcaption></figure>
    ${pairwise(a, level)}
    <h3>Ranking</h3>
    <p>By point estimate: <strong>${a.comparison.ranking.order.map(policyLabel).join(' › ')}</strong>. ${a.comparison.ranking.frequency === null
      ? 'How often it holds is not known: not every policy was resampled.'
      : `This whole order holds in ${shareText(a.comparison.ranking.frequency)} of the resamples.`}</p>
    <ul>${a.comparison.ranking.neighbours.map((n) => html`<li>${policyLabel(n.better)} better than ${policyLabel(n.worse)}${n.frequency === null ? '' : ` in ${shareText(n.frequency)} of resamples`}</li>`)}</ul>`;
}

/** Where the baseline's J is not settled across function classes: its range to report, and how the differences read against it (baselineClassWarning.ts). */
function baselineNotSettled(a: Assessment): Html {
  const pc = a.presentController;
  if (!pc?.functionClasses || pc.functionClasses.settled) return html``;
  return html`<p><strong>The ${PRESENT_CONTROLLER}’s J is not settled across function classes</strong> (range to report ${intervalAtPrecision(pc.reportedRange ?? null)}). ${BASELINE_RANGE_READING}</p>`;
}

/** "99.5 % of resamples" from the share as its column writes it; a dash where the share is unknown. */
function resampleShare(text: string, share: number | null): string {
  return share === null ? '—' : `${text} of resamples`;
}

/**
 * J, its bootstrap s.e. and its two intervals: J and the s.e. at the percentile interval's place (valueWithError, as
 * the app's tooltip and the terminal write them: "1.83", not "1.8" here and "1.83" there), each interval at its own;
 * a value without an interval (the model rollouts) at the decimals of `precision` (the candidate's J interval) where given.
 */
export function estimateCells(e: IntervalEstimate, precision: readonly [number, number] | null = null): Html {
  return html`<td class="num">${valueAtPrecision(e.value, e.percentile ?? precision)}</td><td class="num">${errorBeside(e.value, e.standardError, e.percentile)}</td>
    <td class="num">${intervalAtPrecision(e.percentile)}</td><td class="num">${intervalAtPrecision(e.basic)}</td>`;
}

/** A bootstrap s.e. read beside its value's interval: at the interval's place, else two significant digits (figures/parts/uncertainNumber.ts). */
function errorBeside(value: number, error: number | null, iv: readonly [number, number] | null): string {
  return valueWithError(value, error, iv).error;
}

function pairwise(a: Assessment, level: string): Html {
  const between = a.comparison.differences.filter((d) => d.b !== a.comparison.baseline.name);
  if (!between.length) return html``;
  const firstBetterIn = sharesText(between.map((d) => d.probabilityBetter));
  return html`<h3>Candidates against each other</h3>
    <table><thead><tr><th>Difference</th><th class="num">Value</th><th class="num">s.e.</th><th class="num">${level} interval (percentile)</th><th class="num">First better in</th></tr></thead><tbody>
    ${between.map((d, i) => html`<tr><td>${policyLabel(d.a)} − ${policyLabel(d.b)}</td><td class="num">${valueAtPrecision(d.difference.value, d.difference.percentile)}</td><td class="num">${errorBeside(d.difference.value, d.difference.standardError, d.difference.percentile)}</td>
      <td class="num">${intervalAtPrecision(d.difference.percentile)}</td><td class="num">${resampleShare(firstBetterIn[i], d.probabilityBetter)}</td></tr>`)}
    </tbody></table>`;
}

function pointComparison(input: ReportInput): Html {
  const e = input.evaluation;
  return html`<p>Point estimates only (no intervals: ${input.assessmentProblems.join('; ')}). The ± column covers start-state sampling only.</p>
    <table><thead><tr><th>Policy</th><th class="num">${valueColumnHead('J', valueUnit(input))}</th><th class="num">± s.e.</th><th>Fit</th></tr></thead><tbody>
    ${e.policies.map((p) => html`<tr><td>${p.name}</td>${errorCells(p.policyValue, p.standardError)}<td>${FIT_STATUS_WORDS[p.status]}</td></tr>`)}
    <tr><td>${LOGGED_RETURN}</td>${errorCells(e.behaviour.value, e.behaviour.standardError)}<td>${e.behaviour.episodes} runs</td></tr>
    </tbody></table>`;
}

/** A point estimate and its ± s.e. at one precision (figures/parts/uncertainNumber.ts, valueWithError). */
function errorCells(value: number, standardError: number | null): Html {
  const t = valueWithError(value, standardError);
  return html`<td class="num">${t.value}</td><td class="num">${t.error}</td>`;
}

/** Estimates with intervals as an inline SVG (figures/charts/intervalChart.ts), 640 px wide. */
export function intervalFigure(id: string, rows: IntervalRowData[], axisLabel: string, reference?: number): string {
  return inlineSvg((look) => intervalChart({ rows, axisLabel, title: '', reference, theme: 'light' }, look) as never,
    { widthPx: 640, heightPx: intervalChartHeight(rows.length), id, label: axisLabel.replace(/\^\{|\}|_\{/g, '') });
}

/** A policy's name as the report shows it. */
export const shownName = policyLabel;
