/** The readable summary of an assessment for the terminal: intervals, comparison, cross-checks, warnings. */
import type { Assessment, IntervalEstimate } from '../pipeline/assessment';
import { plantMemorySentence } from '../pipeline/plantMemoryWords';
import { runOrderSentence } from '../pipeline/runOrderWords';
import { policyLabel } from '../pipeline/policyNames';
import { valueColumnHead } from '../pipeline/valueUnitWords';
import { LOGGED_RETURN, PRESENT_CONTROLLER } from '../figures/parts/plotTheme';
import { shareText, sharesText } from '../core/shareText';
import { loggedReturnRole } from '../core/loggedReturn';
import { lawFittedOnMovingRows } from '../pipeline/heldActionsCheck';
import { beyondPossibleSentence, unconvergedPointsSentence, rankingVerdict } from '../figures/charts/sensitivity';
import { textTable as table } from './textTable';
import { TRIAL_RULE, trialAnswer, trialChoice } from '../pipeline/trialChoice';
import { ASCII_MINUS, valueWithError } from '../figures/parts/uncertainNumber';
import { atDecimals, intervalText as interval, ratioText, rowDecimals, valueInIntervalText } from './uncertainNumberText';

/** A cross-check's value and its interval where it has one; without one (the model rollouts, a closed form without resamples) the value alone, so the line does not read "8.24 — — Uninformative". */
const checkValue = (value: number, iv: [number, number] | null, precision: [number, number] | null): string => (iv ? valueInIntervalText(value, iv) : atDecimals(value, rowDecimals(precision)));

/** A row's J and s.e. at the decimal place of its percentile interval (else of its s.e.), as the app and the report write them (valueWithError); each interval at its own. */
function estimateRow(name: string, e: IntervalEstimate): string[] {
  const shown = valueWithError(e.value, e.standardError, e.percentile, ASCII_MINUS);
  return [name, shown.value, shown.error, interval(e.percentile), interval(e.basic)];
}

const settledWord = (settled: boolean | null): string => (settled === null ? 'one class' : settled ? 'settled' : 'NOT SETTLED');

/** `completedShown`: whether the logged return completed past time limits gets its own row (core/loggedReturn.ts truncationMatters of the evaluation's logged return). */
export function formatAssessment(a: Assessment, completedShown = true, unit = ''): string {
  const level = shareText(a.settings.level);
  const rows = [['policy', valueColumnHead('J', unit), 'bootstrap s.e.', `${level} percentile`, `${level} basic`, 'range to report', 'function classes', 'cross-checks', 'occupancy shift']];
  for (const c of a.candidates) {
    rows.push([...estimateRow(c.name, c.policyValue), interval(c.reportedRange), settledWord(c.settled), c.confirmation.status, ratioText(c.diagnostics.occupancyShift)]);
  }
  const pc = a.presentController;
  // Its range to report and verdict as a candidate's (an assessment saved before it had them: its interval, no verdict).
  if (pc) rows.push([...estimateRow(`${PRESENT_CONTROLLER} [baseline]`, pc.policyValue), interval(pc.reportedRange ?? pc.policyValue.percentile), pc.settled === undefined ? '' : settledWord(pc.settled), pc.confirmation.status, ratioText(pc.occupancyShift)]);
  rows.push([...estimateRow(pc ? `${LOGGED_RETURN} (${loggedReturnRole(completedShown, lawFittedOnMovingRows(a.heldActions))})` : `${LOGGED_RETURN} [baseline]`, a.behaviour), '', '', '', '']);
  if (pc && completedShown) rows.push([...estimateRow(`${LOGGED_RETURN}, completed past time limits (check)`, pc.completedReturn), '', '', '', '']);
  const diffs = [['difference', 'value', `${level} percentile`, 'first better in']];
  // The shares down the column at one precision (core/shareText.ts, sharesText): "50.0 %" under "99.5 %".
  const firstBetterIn = sharesText(a.comparison.differences.map((d) => d.probabilityBetter));
  a.comparison.differences.forEach((d, i) => diffs.push([`${policyLabel(d.a)} − ${policyLabel(d.b)}`, atDecimals(d.difference.value, rowDecimals(d.difference.percentile, d.difference.standardError)), interval(d.difference.percentile), firstBetterIn[i]]));
  const named = [...a.candidates, ...(pc ? [{ ...pc, functionClasses: null }] : [])];
  const checks = named.flatMap((c) => [
    `  ${policyLabel(c.name)}: ${c.confirmation.text}`,
    ...c.crossChecks.map((x) => `    · ${x.label}: ${x.estimate ? `${checkValue(x.estimate.value, x.estimate.percentile, c.policyValue.percentile)} — ` : ''}${x.note}`),
  ]);
  // The baseline's function classes and cut beside the candidates', under its row's name.
  const ranged = [...a.candidates, ...(pc ? [{ ...pc, name: `${PRESENT_CONTROLLER} [baseline]` }] : [])];
  const classes = ranged.flatMap((c) => (c.functionClasses ? [
    `  ${c.name}: ${c.functionClasses.reason}`,
    ...c.functionClasses.classes.map((k) => `    · ${k.label}: ${k.interval ? valueInIntervalText(k.value, k.interval) : `${valueInIntervalText(k.value, null)} —`}`),
  ] : []));
  const cuts = ranged.flatMap((c) => (c.rangeCut ? [`  ${c.name}: ${c.rangeCut}`] : []));
  const warnings = [...a.warnings, ...a.candidates.flatMap((c) => c.warnings.map((w) => ({ ...w, message: `${c.name}: ${w.message}` })))];
  const memory = plantMemorySentence(a.plantMemory), order = runOrderSentence(a.runOrder);
  // The sweeps in a line each, by the figure's own verdict (figures/charts/sensitivity.ts): the numbers are in --json and the report.
  const sweeps = a.sensitivity ? a.sensitivity.curves.flatMap((c) => [`  J against the ${c.label}: ${rankingVerdict(c)}.`, ...[beyondPossibleSentence(c), unconvergedPointsSentence(c)].flatMap((x) => (x ? [`    ${x}`] : []))]) : [];
  return [
    `Bootstrap over ${a.settings.episodes} runs: ${a.settings.resamples} resamples, level ${level}, seed ${a.settings.seed}. Baseline: ${policyLabel(a.comparison.baseline.name)}.`,
    a.comparison.baseline.note,
    '',
    table(rows),
    '',
    table(diffs),
    '',
    `Ranking: ${a.comparison.ranking.order.map(policyLabel).join(' > ')} (${a.comparison.ranking.frequency === null ? 'not every policy was resampled' : `holds in ${shareText(a.comparison.ranking.frequency)} of resamples`}).`,
    ...answerLines(a),
    ...(classes.length ? ['', 'Function classes (the range to report spans them):', ...classes] : []),
    ...(cuts.length ? ['', 'Ranges to report cut to what the reward’s definition allows:', ...cuts] : []),
    '',
    'Cross-checks:',
    ...checks,
    ...(sweeps.length ? ['', 'Sensitivity (J refitted at other settings):', ...sweeps] : []),
    ...(memory ? ['', memory] : []),
    ...(order ? ['', order] : []),
    ...(warnings.length ? ['', 'Assessment warnings:', ...warnings.map((w) => `  - [${w.severity}] ${w.message}`)] : []),
    '',
    `Computed with ${a.settings.threads}.`,
    '',
  ].join('\n');
}

/** Where the terminal shows what the answer points to. */
const TERMINAL_PLACES = { cautions: 'at the end', warnings: 'in the list below', minus: ASCII_MINUS } as const;

/** The answer, as the app's Findings and the report say it (pipeline/trialChoice.ts), with the rule it follows. */
function answerLines(a: Assessment): string[] {
  const answer = trialAnswer(a, trialChoice(a), TERMINAL_PLACES);
  if (!answer) return [];
  return ['', `Answer: ${[answer.headline, answer.detail, answer.logCautions].filter(Boolean).join(' ')}`, `  (${TRIAL_RULE})`];
}
