/** The readable table `evaluate` prints by default. */
import { COMPARATOR_DEGREE } from '../core/fqe/comparatorDegree';
import { FIT_STATUS_WORDS } from '../core/fqe/fitStatus';
import { loggedReturnRole, truncationMatters, truncationSentence } from '../core/loggedReturn';
import { lawFittedOnMovingRows } from '../pipeline/heldActionsCheck';
import { heldRowsLeftOutText } from '../core/diagnostics/heldActionsFinding';
import type { Evaluation } from '../pipeline/estimates';
import { centreText as centreIn, perAction as perActionIn } from '../pipeline/baselineWords';
import { LOGGED_RETURN, PRESENT_CONTROLLER } from '../figures/parts/plotTheme';
import { significant, textTable as table } from './textTable';
import { valueColumnHead, valueSenseSentence } from '../pipeline/valueUnitWords';
import { atDecimals, intervalText, rowDecimals, valueInIntervalText } from './uncertainNumberText';
import type { Assessment, IntervalEstimate } from '../pipeline/assessment';
import { loggedLimitText } from '../core/loggedLimitWords';
import { shareText } from '../core/shareText';

/** A fitted parameter (offset, dither): four significant digits. */
const number = (v: number | null): string => significant(v, 4);
/**
 * A value and its standard error at one precision: the decimal place of the interval the assessment
 * prints for the same row where there is one, else the error's two significant digits — the app's rule
 * (one precision per screen: the Findings' value table takes the interval's place once it has one), so
 * this table and the assessment table below it print one J alike.
 */
const withError = (value: number | null, error: number | null, iv: Interval): [string, string] => [atDecimals(value, rowDecimals(iv, error)), atDecimals(error, rowDecimals(iv, error))];
type Interval = readonly [number, number] | null;

const STATUS_WORDS = { converged: 'converged', maxIterations: 'NOT CONVERGED', diverged: 'DIVERGED' } as const;

/** The baseline's numbers per action at the command line's four significant digits (pipeline/baselineWords.ts). */
export const perAction = (label: string, values: readonly number[], actions: readonly string[] | undefined, units?: readonly string[]): string => perActionIn(label, values, actions, units, number);
export const centreText = (model: NonNullable<Evaluation['presentController']>['model']): string => centreIn(model, number);

/**
 * The actuator limits read from the log, each with how the log showed it ("actuator limits read from
 * the log: lower 0 % (repeated extreme), upper 100 % (at a declared bound)"); with several actions each named.
 */
export function limitsText(model: NonNullable<Evaluation['presentController']>['model']): string {
  const one = (j: number) => loggedLimitText(model.lo[j], model.hi[j], model.limitEvidence && { lo: model.limitEvidence.lo[j], hi: model.limitEvidence.hi[j] }, model.units?.[j] ?? '', number);
  const several = model.lo.length > 1 && model.actions?.length === model.lo.length;
  return `actuator limits read from the log: ${model.lo.map((_, j) => (several ? `${one(j)} on ${model.actions![j]}` : one(j))).join('; ')}`;
}

/** The value table; with the assessment, each row at the precision of the interval the assessment gives it. */
export function formatEvaluation(e: Evaluation, projectFile: string, assessment: Assessment | null = null, unit = ''): string {
  const s = e.settings;
  const rows: string[][] = [['policy', valueColumnHead('value J', unit), '± s.e.', 'fixed point', 'fit']];
  // A fit stopped at its iteration limit shows the J it reached, as the app and the assessment table below do, marked
  // NOT CONVERGED with its message saying why; a diverged fit has no value ("no value", not "not settled", which names
  // the function-class verdict of the assessment).
  e.policies.forEach((p, i) => {
    const shown = p.status !== 'diverged', iv = assessment?.candidates[i]?.policyValue.percentile ?? null;
    const [value, error] = withError(p.policyValue, p.standardError, iv), d = rowDecimals(iv, p.standardError);
    rows.push([p.name, shown ? value : 'no value', shown ? error : '', atDecimals(p.fixedPointValue, d), p.status === 'converged' ? `converged (${p.iterations} it.)` : STATUS_WORDS[p.status]]);
  });
  const pc = e.presentController, truncation = truncationSentence(e.behaviour), completed = truncationMatters(e.behaviour);
  if (pc) {
    const x = pc.estimate, shown = x.status !== 'diverged', iv = assessment?.presentController?.policyValue.percentile ?? null;
    const [value, error] = withError(x.policyValue, x.standardError, iv), d = rowDecimals(iv, x.standardError);
    rows.push([`${PRESENT_CONTROLLER} [baseline]`, shown ? value : 'no value', shown ? error : '', atDecimals(x.fixedPointValue, d), x.status === 'converged' ? `converged (${x.iterations} it.)` : STATUS_WORDS[x.status]]);
    if (completed) rows.push([`${LOGGED_RETURN}, completed past time limits (check)`, ...withError(pc.completedReturn.value, pc.completedReturn.standardError, assessment?.presentController?.completedReturn.percentile ?? null), '', `${e.behaviour.episodes} runs`]);
  }
  rows.push([pc ? `${LOGGED_RETURN} (${loggedReturnRole(completed, lawFittedOnMovingRows(assessment?.heldActions))})` : `${LOGGED_RETURN} [baseline]`, ...withError(e.behaviour.value, e.behaviour.standardError, assessment?.behaviour.percentile ?? null), '', `${e.behaviour.episodes} runs`]);
  const lines = [
    `Setpoint Critic — ${e.project} (${projectFile})`,
    // What J is, in the sentence the app's Findings and the report's summary say (pipeline/valueUnitWords.ts).
    `${valueSenseSentence(e.valueSense, unit)}; discount ${s.discount}.`,
    `${s.transitions.toLocaleString('en-US')} transitions in ${s.episodes} runs; J averaged over ${s.startStates} start states; ${s.approximator}; ${s.quadratureNodes} quadrature nodes; seed ${s.seed}.`,
    // The degree the network's fits used, in the fit's own sentence (the choice's, or that the project fixed it).
    ...(s.polynomialPart ? [s.polynomialPart.reason] : []),
    '',
    table(rows),
    '',
    '± s.e. covers start-state sampling only; it is not a confidence interval for the fit.',
    ...e.policies.filter((p) => p.status !== 'converged').map((p) => `SERIOUS — ${p.name}: ${unconvergedWords(p.status)} ${p.message}`),
    ...e.policies.flatMap((p, i) => (p.network ? [networkLine(p.name, p.network, assessment?.candidates[i]?.policyValue ?? null, assessment?.settings.level)] : [])),
    `Computed by ${[...new Set(e.policies.map((p) => p.backend))].join('; ')}.`,
    pc ? `Baseline: the present controller as modelled from the log${heldRowsLeftOutText(pc.model.heldRowsLeftOut)} (${centreText(pc.model)}; ${perAction('dither', pc.model.std, pc.model.actions, pc.model.units)}; ${limitsText(pc.model)}) and evaluated like the candidates.`
      : `Baseline: the logged return, because ${e.presentControllerReason}.`,
    ...(truncation ? [`${truncation}${pc ? '; compare with the baseline above' : ''}.`] : []),
    ...(e.warnings.length ? ['', 'Warnings:', ...e.warnings.map((w) => `  - ${w}`)] : []),
    '',
  ];
  return lines.join('\n');
}

/** What the value table's row of a fit that did not converge holds, and what the comparison does with it. */
function unconvergedWords(status: Evaluation['policies'][number]['status']): string {
  return status === 'diverged'
    ? 'its fit diverged, so no value is reported for it.'
    : `its fit ${FIT_STATUS_WORDS[status]} without meeting its convergence rule: the J shown is where it stopped, not a settled value, and it is left out of the differences and the ranking.`;
}

/**
 * One network's line: its J interval — with the assessment, the one the assessment table prints (on its resamples, at its
 * level), so the two tables never give two intervals for one J — and the linear estimate and difference its agreement rule read.
 */
function networkLine(name: string, n: NonNullable<Evaluation['policies'][number]['network']>, assessed: IntervalEstimate | null, assessedLevel = n.level): string {
  const own = assessed?.percentile ? { interval: assessed.percentile, level: assessedLevel, covers: assessed.covers } : n;
  const level = shareText(own.level), inInterval = valueInIntervalText;
  return `${name}: network J ${level} interval ${intervalText(own.interval)} (${own.covers}); degree-${COMPARATOR_DEGREE} linear J ${inInterval(n.linear.value, n.linear.interval)}; ` +
    `network − linear ${inInterval(n.difference.value, n.difference.interval)}${own.level === n.level ? '' : ` (these two at ${shareText(n.level)}, the level the agreement rule reads)`}. ${n.agreement.verdict === 'disagree' ? 'SERIOUS — ' : ''}${n.agreement.message}`;
}

/** The cautions, printed last so they are the final thing a reader sees. */
export function formatCautions(e: Evaluation): string {
  return ['', 'Cautions:', ...e.cautions.map((c) => `  - ${c}`), ''].join('\n');
}
