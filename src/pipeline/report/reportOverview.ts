/** The report's opening sections: the summary, the job, the data and the settings. */
import type { Assessment } from '../assessment';
import { summariseCandidate } from '../../project/candidateSummary';
import { CAUTIONS } from '../cautions';
import { heldRowsLeftOutText } from '../../core/diagnostics/heldActionsFinding';
import { html, formatNumber, formatWrittenAt, type Html } from './htmlText';
import { valueUnit, type ReportInput } from './reportInput';
import { valueSenseSentence } from '../valueUnitWords';
import { columnUnits, columnUnitText } from '../columnUnitWords';
import { TRIAL_RULE, trialAnswer, trialChoice } from '../trialChoice';
import { policyLabel } from '../policyNames';
import { centreText } from '../baselineWords';
import { PRESENT_CONTROLLER } from '../../figures/parts/plotTheme';
import { loggedLimitText } from '../../core/loggedLimitWords';
import { shareText } from '../../core/shareText';
import { horizonStepsText } from '../../core/horizonText';

export function summarySection(input: ReportInput): Html {
  const a = input.assessment, e = input.evaluation;
  const ranking = a?.comparison.ranking;
  const best = ranking ? policyLabel(ranking.order[0]) : [...e.policies].sort((x, y) => (e.valueSense === 'cost' ? x.policyValue - y.policyValue : y.policyValue - x.policyValue))[0]?.name;
  const serious = a ? [...a.warnings, ...a.candidates.flatMap((c) => c.warnings)].filter((w) => w.severity === 'serious').length : null;
  return html`<div class="summary" id="summary"><p><strong>Summary.</strong> ${valueSenseSentence(e.valueSense, valueUnit(input))}. By point estimate the best policy is
    <strong>${best ?? '—'}</strong>${ranking?.frequency != null ? html`; the full ranking ${ranking.order.map(policyLabel).join(' › ')} holds in ${shareText(ranking.frequency)} of ${a!.settings.resamples.toLocaleString('en-US')} bootstrap resamples` : ''}.
    ${serious === null ? 'Intervals and diagnostics were not computed (see Settings).' : `${serious} serious warning${serious === 1 ? '' : 's'} (see Diagnostics and Cross-checks).`}</p>
    ${a ? answerParagraph(input, a) : ''}</div>`;
}

/** Where the report shows what the answer points to: the cautions on its first page, above the summary; every warning in the list at the end of Diagnostics (reportEvidence.ts). */
const REPORT_PLACES = { cautions: 'above', warnings: 'under Diagnostics' } as const;

/** Which candidate to trial, in the words the app's Findings and the command line use (pipeline/trialChoice.ts), with the rule. */
function answerParagraph(input: ReportInput, a: Assessment): Html | string {
  const answer = trialAnswer(a, trialChoice(a), REPORT_PLACES, valueUnit(input));
  if (!answer) return '';
  return html`<p id="answer"><strong>${answer.headline}</strong>${answer.detail ? ` ${answer.detail}` : ''}${answer.logCautions ? ` ${answer.logCautions}` : ''}</p>
    <p class="small">${TRIAL_RULE}</p>`;
}

/** The cautions at the head of the document, so a printout carries them on its first page. */
export function firstPageCautions(): Html {
  return html`<aside class="cautions-first" id="read-first" aria-label="Cautions"><p><strong>Read before using any number.</strong></p>
    <ul>${CAUTIONS.map((c) => html`<li>${c}</li>`)}</ul></aside>`;
}

export function jobSection(input: ReportInput): Html {
  const p = input.project;
  return html`<section id="job"><h2>Job</h2>
    <table><tbody>
      <tr><th>Project</th><td>${p.name}</td></tr>
      <tr><th>Description</th><td>${p.description || '—'}</td></tr>
      <tr><th>Project file</th><td>${input.projectFile}</td></tr>
      <tr><th>Data file</th><td>${p.data.path}</td></tr>
      <tr><th>Evaluated</th><td>${formatWrittenAt(input.evaluation.evaluatedAt)}</td></tr>
      <tr><th>Report written</th><td>${formatWrittenAt(input.generatedAt)}</td></tr>
      <tr><th>Question</th><td>How would each of ${p.candidates.length} candidate setpoint polic${p.candidates.length === 1 ? 'y' : 'ies'} perform, judged offline from the logs gathered under the present controller?</td></tr>
    </tbody></table>
    <h3>Candidates</h3>
    <table><thead><tr><th>Name</th><th>Mean action</th><th>Dither</th><th>Limits</th><th>Description</th></tr></thead><tbody>
    ${p.candidates.map((c) => {
      const summary = summariseCandidate(c, p.columns);
      return html`<tr><td>${c.name}</td><td>${summary.mean.join('; ')}</td><td>${summary.dither}</td><td>${summary.limits}</td><td>${c.description}</td></tr>`;
    })}
    ${presentControllerRow(input)}
    </tbody></table></section>`;
}

/**
 * The baseline beside the candidates: the present controller as fitted to the log, with the actuator
 * limits read from the log and how the log showed each (core/loggedLimitWords.ts).
 */
function presentControllerRow(input: ReportInput): Html {
  const model = input.evaluation.presentController?.model;
  if (!model) return html``;
  const name = (j: number) => (model.lo.length > 1 ? ` on ${model.actions?.[j] ?? `action ${j + 1}`}` : '');
  const limits = model.lo.map((_, j) => `${loggedLimitText(model.lo[j], model.hi[j], model.limitEvidence && { lo: model.limitEvidence.lo[j], hi: model.limitEvidence.hi[j] }, model.units?.[j] ?? '', (v) => formatNumber(v, 4))}${name(j)}`);
  const dither = model.std.map((v, j) => `${formatNumber(v, 4)}${model.units?.[j] ? ` ${model.units[j]}` : ''}${name(j)}`);
  return html`<tr><td>${PRESENT_CONTROLLER} (baseline)</td><td>as fitted to the log${heldRowsLeftOutText(model.heldRowsLeftOut)}, ${centreText(model, (v) => formatNumber(v, 4))}</td><td>${dither.join('; ')}</td><td>read from the log: ${limits.join('; ')}</td><td>The controller that ran while the log was recorded, evaluated like the candidates.</td></tr>`;
}

/** Significant digits of the column statistics: the app's statistics table shows four (renderer format/numberFormat.ts). */
const STATISTIC_DIGITS = 4;

export function dataSection(input: ReportInput): Html {
  const s = input.data.summary, p = input.project;
  const units = columnUnits(p);
  // As the app's import table writes it (pipeline/columnUnitWords.ts); a timestamp's cell is left blank, since the summary does not say whether its clock is calendar time.
  const unit = (c: { name: string; roles: readonly string[] }) => (c.roles.includes('timestamp') ? '' : columnUnitText(c.roles, units.get(c.name)));
  return html`<section id="data"><h2>Data</h2>
    <p>${s.rowCount.toLocaleString('en-US')} rows read, ${s.usedRowCount.toLocaleString('en-US')} used (${shareText(s.excludedFraction)} excluded);
      ${s.transitionCount.toLocaleString('en-US')} transitions in ${s.episodeCount.toLocaleString('en-US')} runs${s.samplingPeriodSeconds ? `, sampled every ${formatNumber(s.samplingPeriodSeconds, 4)} s` : ''}.
      The reward is ${p.columns.reward.kind === 'column' ? `column “${p.columns.reward.column}”` : `the expression ${p.columns.reward.expression}`}, read as a ${p.columns.reward.sense}.</p>
    <table><thead><tr><th>Column</th><th>Used as</th><th>Unit</th><th class="num">Min</th><th class="num">Mean</th><th class="num">Max</th><th class="num">Std dev</th></tr></thead><tbody>
    ${s.columns.map((c) => html`<tr><td>${c.name}</td><td>${c.roles.join(', ')}</td><td>${unit(c)}</td><td class="num">${formatNumber(c.min, STATISTIC_DIGITS)}</td><td class="num">${formatNumber(c.mean, STATISTIC_DIGITS)}</td><td class="num">${formatNumber(c.max, STATISTIC_DIGITS)}</td><td class="num">${formatNumber(c.std, STATISTIC_DIGITS)}</td></tr>`)}
    </tbody></table>
    ${input.data.episodeReport.length ? html`<ul class="small">${input.data.episodeReport.map((line) => html`<li>${line}</li>`)}</ul>` : ''}</section>`;
}

export function settingsSection(input: ReportInput): Html {
  const s = input.evaluation.settings, a = input.assessment;
  return html`<section id="settings"><h2>Settings</h2>
    <table><tbody>
      <tr><th>Discount γ per logged step</th><td>${formatNumber(s.discount)} (effective horizon ${horizonStepsText(s.discount)} steps)</td></tr>
      <tr><th>Approximator</th><td>${s.approximator}</td></tr>
      ${s.polynomialPart ? html`<tr><th>Polynomial part of the network</th><td>${s.polynomialPart.reason}</td></tr>` : ''}
      <tr><th>Action quadrature</th><td>${s.quadratureNodes} Gauss–Hermite nodes per action</td></tr>
      <tr><th>Start states</th><td>${s.startStates} (${input.project.startStates.kind === 'given' ? 'given in the project' : 'the first state of each logged run'})</td></tr>
      <tr><th>Seed</th><td>${s.seed}</td></tr>
      ${a ? html`<tr><th>Bootstrap</th><td>${a.settings.resamples.toLocaleString('en-US')} resamples of the ${a.settings.episodes} runs, level ${shareText(a.settings.level)}, seed ${a.settings.seed}; ${a.settings.solver}</td></tr>` : ''}
    </tbody></table>
    ${a ? methodList(a) : html`<p><strong>Intervals, cross-checks and diagnostics were not computed:</strong> ${input.assessmentProblems.join('; ')}</p>`}</section>`;
}

function methodList(a: Assessment): Html {
  return html`<h3>Definitions and thresholds</h3><ul class="small">${a.method.map((m) => html`<li>${m}</li>`)}</ul>`;
}
