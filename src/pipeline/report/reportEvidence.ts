/** The evidence sections: coverage diagnostics, cross-checks, sensitivity, and the warnings and cautions. */
import type { Assessment, CandidateAssessment } from '../assessment';
import { OCCUPANCY_SHIFT_LIMITS, UPPER_PERCENTILE } from '../../core/diagnostics/severity';
import { shiftText } from '../../core/diagnostics/shiftText';
import { CAUTIONS } from '../cautions';
import { plantMemorySentence } from '../plantMemoryWords';
import { runOrderSentence } from '../runOrderWords';
import { beyondPossibleSentence, unconvergedPointsSentence, rankingSentence, sensitivityChart } from '../../figures/charts/sensitivity';
import { inlineSvg } from '../../figures/writers/inlineSvg';
import { estimateCells, intervalFigure, shownName } from './reportComparison';
import { html, raw, type Html } from './htmlText';
import { intervalAtPrecision, valueAtPrecision } from '../../figures/parts/uncertainNumber';
import { senseWords, valueAxisLabel, valueUnit, type FigureCounter, type ReportInput } from './reportInput';
import { valueColumnHead } from '../valueUnitWords';
import { shareText, sharesText } from '../../core/shareText';
import { unvisitedSentence } from '../unvisitedWords';
import { typesetText } from '../../core/typesetText';
import { effectiveRunsNumber } from '../../core/offPolicy/effectiveRunsText';
import { findingsHtml } from './reportFindings';

export function diagnosticsSection(input: ReportInput): Html {
  const a = input.assessment;
  if (!a) return html`<section id="diagnostics"><h2>Diagnostics</h2><p>Not computed: ${input.assessmentProblems.join('; ')}</p></section>`;
  return html`<section id="diagnostics"><h2>Diagnostics</h2>
    <p>Does the candidate stay inside what the logs cover? The last column gives the present controller (its model fitted to the log) for scale.</p>
    <table><thead><tr><th>Diagnostic</th>${a.candidates.map((c) => html`<th class="num">${c.name}</th>`)}<th class="num">present controller</th></tr></thead><tbody>
    ${diagnosticRows(a).map((row) => html`<tr><td>${row.label}</td>${row.values.map((v) => html`<td class="num">${v}</td>`)}<td class="num">${row.reference}</td></tr>`)}
    </tbody></table>
    ${cutParagraph(a)}
    ${unvisitedParagraph(a)}
    ${memoryParagraph(a)}
    <h3>Warnings</h3>${findingsHtml(a)}</section>`;
}

/** Where a range to report was cut to what the reward's definition allows, and why (assessPossible.ts cutToCertain). */
function cutParagraph(a: Assessment): Html {
  const cut = [...a.candidates, ...(a.presentController ? [{ ...a.presentController, name: 'present controller' }] : [])].filter((c) => c.rangeCut);
  return cut.length ? html`<p>Ranges marked (cut): ${typesetText(cut.map((c) => `${c.name}: ${c.rangeCut}`).join(' '))}</p>` : html``;
}

/** The unvisited share, unless a warning below states it (pipeline/unvisitedWords.ts: said once). */
function unvisitedParagraph(a: Assessment): Html {
  const sentence = unvisitedSentence(a.unvisitedShare, a.warnings);
  return sentence ? html`<p>${sentence}</p>` : html``;
}

function memoryParagraph(a: Assessment): Html {
  const sentence = plantMemorySentence(a.plantMemory), order = runOrderSentence(a.runOrder);
  return html`${sentence ? html`<p>${sentence}</p>` : html``}${order ? html`<p>${order}</p>` : html``}`;
}

function diagnosticRows(a: Assessment): { label: string; values: string[]; reference: string }[] {
  const first = a.candidates[0]?.diagnostics, pc = a.presentController;
  const row = (label: string, value: (c: CandidateAssessment) => string, reference: string) => ({ label, values: a.candidates.map(value), reference });
  const weights = (c: CandidateAssessment) => c.diagnostics.importanceWeights;
  const horizon = a.candidates.map(weights).find((w) => w)?.horizonSteps;
  return [
    row(`Occupancy shift (1 = like the logs; caution above ${OCCUPANCY_SHIFT_LIMITS.caution}×, serious above ${OCCUPANCY_SHIFT_LIMITS.serious}× the present controller’s level, at least 1)`,
      (c) => shiftText(c.diagnostics.occupancyShift), shiftText(first?.presentControllerShift)),
    row(`… ${UPPER_PERCENTILE}th percentile over resamples`, (c) => shiftText(c.diagnostics.occupancyShiftUpper), ''),
    // The present controller's as a candidate's, where the assessment has them (saved before it was fitted in the classes: blank).
    row('Across function classes', (c) => classesWord(c.settled), pc?.settled === undefined ? '' : classesWord(pc.settled)),
    row('Range to report (spans every function class’s interval; the number to carry forward where not settled)', rangeCell, pc?.reportedRange === undefined ? '' : rangeCell(pc)),
    row('Cross-checks', (c) => c.confirmation.status, a.presentController?.confirmation.status ?? ''),
    shareRow('Importance weights: effective share of the one-step ratios', (c) => weights(c)?.oneStepShare),
    row(`Importance weights: effective runs at step ${horizon ?? 'H'}`, (c) => { const w = weights(c); return !w ? '—' : w.horizonNotNumbers ? `not a number for ${w.horizonNotNumbers} of ${w.horizonEpisodes}` : w.horizonEffectiveEpisodes >= 1 ? `${effectiveRunsNumber(w.horizonEffectiveEpisodes)} of ${w.horizonEpisodes}` : `${w.horizonEffectiveEpisodes > 0 ? 'less than 1' : 'none'} of ${w.horizonEpisodes}`; }, ''),
    shareRow('Action probability outside the logged range near the state: mean', (c) => c.diagnostics.actionSupport.meanOutside, first?.actionSupport.behaviourMeanOutside),
    shareRow(`… ${UPPER_PERCENTILE}th percentile over states`, (c) => c.diagnostics.actionSupport.p90Outside),
    shareRow('… largest', (c) => c.diagnostics.actionSupport.maxOutside),
  ];

  /** A row of shares, read across (each candidate, the present controller): one precision for the row (core/shareText.ts sharesText). */
  function shareRow(label: string, share: (c: CandidateAssessment) => number | null | undefined, reference?: number | null) {
    const texts = sharesText([...a.candidates.map(share), reference]);
    return { label, values: texts.slice(0, -1), reference: reference === undefined ? '' : texts[texts.length - 1] };
  }
}

const classesWord = (settled: boolean | null | undefined): string => (settled === null || settled === undefined ? 'one class' : settled ? 'settled' : 'not settled');

function rangeCell(c: { reportedRange?: [number, number] | null; rangeCut?: string }): string {
  return c.reportedRange ? `${intervalAtPrecision(c.reportedRange)}${c.rangeCut ? ' (cut)' : ''}` : '—';
}

export function crossChecksSection(input: ReportInput, figures: FigureCounter): Html {
  const a = input.assessment;
  if (!a) return html`<section id="cross-checks"><h2>Cross-checks</h2><p>Not computed: ${input.assessmentProblems.join('; ')}</p></section>`;
  return html`<section id="cross-checks"><h2>Cross-checks by independent methods</h2>
    <p>Each method estimates the same J from the same logs under a different assumption; a large gap from fitted Q-evaluation (FQE) is flagged.</p>
    ${a.candidates.map((c) => {
      const n = figures.next(), level = shareText(a.settings.level);
      const rows = [{ label: 'Fitted Q-evaluation', value: c.policyValue.value, interval: c.policyValue.percentile },
        ...c.crossChecks.filter((x) => x.estimate).map((x) => ({ label: x.label, value: x.estimate!.value, interval: x.estimate!.percentile }))];
      return html`<h3>${c.name}</h3>
        <table><thead><tr><th>Method</th><th class="num">${valueColumnHead('J', valueUnit(input))}</th><th class="num">s.e.</th><th class="num">${level} interval (percentile)</th><th class="num">${level} interval (basic)</th><th class="num">− FQE (${level})</th><th>Verdict</th></tr></thead><tbody>
        <tr><td>Fitted Q-evaluation</td>${estimateCells(c.policyValue)}<td></td><td></td></tr>
        ${c.crossChecks.map((x) => html`<tr><td>${x.label}</td>${x.estimate ? estimateCells(x.estimate, c.policyValue.percentile) : html`<td class="num">—</td><td></td><td></td><td></td>`}
          <td class="num">${x.difference ? html`${valueAtPrecision(x.difference.value, x.difference.percentile)}<br/>${intervalAtPrecision(x.difference.percentile)}` : ''}</td>
          <td><span class="verdict-${x.agreement}">${verdictWord(x.agreement)}</span><br/><span class="small">${typesetText(x.note)}</span></td></tr>`)}
        </tbody></table>
        <figure id="fig-checks-${n}">${raw(intervalFigure(`checks-${n}-svg`, rows, valueAxisLabel(input, 'J')))}
          <figcaption>Figure ${n}. ${c.name}: J by fitted Q-evaluation and by each applicable cross-check, with ${level} percentile bootstrap intervals over the same resamples.</figcaption></figure>`;
    })}
    <h3>What each method rests on</h3>
    <ul><li><strong>Fitted Q-evaluation:</strong> the features represent ${raw('Q<sup>π</sup>')} well where the candidate goes (see Diagnostics), and runs are independent of one another.</li>
    ${(a.candidates[0]?.crossChecks ?? []).map((x) => html`<li><strong>${x.label}:</strong> ${x.assumption}</li>`)}</ul></section>`;
}

function verdictWord(agreement: string): string {
  return { agrees: 'agrees', disagrees: 'DISAGREES', uninformative: 'uninformative', notApplicable: 'not applicable' }[agreement] ?? agreement;
}

export function sensitivitySection(input: ReportInput, figures: FigureCounter): Html {
  const s = input.assessment?.sensitivity, words = senseWords(input);
  if (!s) return html`<section id="sensitivity"><h2>Sensitivity</h2><p>Not computed.</p></section>`;
  return html`<section id="sensitivity"><h2>Sensitivity</h2>
    <p>J over a range of settings: a conclusion that holds across the range does not hinge on the setting.</p>
    ${s.curves.map((curve) => {
      const n = figures.next();
      const shown = { ...curve, series: curve.series.map((x) => ({ ...x, name: shownName(x.name) })) };
      const chart = inlineSvg((look) => sensitivityChart({ curve: shown, valueLabel: valueAxisLabel(input, 'J'), title: '', theme: 'light' }, look) as never,
        { widthPx: 640, heightPx: 360, id: `sensitivity-${n}-svg`, label: `J against the ${curve.label}` });
      const crossed = beyondPossibleSentence(curve, shownName), missing = unconvergedPointsSentence(curve, shownName);
      return html`<figure id="fig-sensitivity-${n}">${raw(chart)}<figcaption>Figure ${n}. J (${words.value}, ${words.better}) against the ${curve.label}; large points: the project’s setting.
        ${curve.rankingStable ? rankingSentence(curve) : html`<strong>${rankingSentence(curve)}</strong>`}${crossed ? html` <strong>${crossed}</strong>` : ''}${missing ? ` ${missing}` : ''}</figcaption></figure>`;
    })}
    <ul class="small">${s.notes.map((note) => html`<li>${typesetText(note)}</li>`)}</ul></section>`;
}

export function cautionsSection(input: ReportInput, a: Assessment | null): Html {
  const evaluationWarnings = input.evaluation.warnings;
  return html`<section id="cautions"><h2>Cautions</h2>
    ${evaluationWarnings.length ? html`<h3>Warnings from the evaluation</h3><ul>${evaluationWarnings.map((w) => html`<li>${w}</li>`)}</ul>` : ''}
    ${a ? '' : html`<p>${input.assessmentProblems.join('; ')}</p>`}
    <div class="cautions"><ul>${CAUTIONS.map((c) => html`<li>${c}</li>`)}</ul></div></section>`;
}
