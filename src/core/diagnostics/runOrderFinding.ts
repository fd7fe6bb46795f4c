/**
 * The rule that reads the run-order check (runOrder.ts) and its words, stated once: the app, the
 * command line, the report and the method statement all take their text from here.
 *
 * A coefficient changed with run order when its two-sided p, times the number of coefficients tested
 * (Bonferroni), is at most RUN_ORDER_ALPHA. SERIOUS: a coefficient of the present controller's law
 * (its intercept or a gain) changed — the baseline is then an average of tunings; or a coefficient of
 * the plant model on a state or an action changed — every estimate is then an average of plants.
 * CAUTION: only plant-model intercepts changed — a slow disturbance the states do not carry.
 *
 * Threshold chosen by the rule written before measuring (/work/notes/runorder37-rule.md; table in
 * test/battery/README.md, "Run order", bench/runOrderBattery.ts).
 */
import { RUN_ORDER_ALPHA } from '../limits';
import { normalSurvival } from '../normalDistribution';
import type { RunName } from '../runLabelText';
import type { CoefficientTrend, RunOrderResult } from './runOrder';
import { changeAdvice } from './runOrderChangeWords';

export interface RunOrderNames {
  readonly stateNames: readonly string[];
  readonly actionNames: readonly string[];
  /** A run by its position in the data (0-based): its label and first line; absent, the words say where without naming runs. */
  readonly runName?: (position: number) => RunName;
}

export type RunOrderSeverity = 'caution' | 'serious';

/** The coefficients that changed with run order at family-wise level alpha (Bonferroni over those tested). */
export function changedTrends(result: RunOrderResult, alpha = RUN_ORDER_ALPHA): CoefficientTrend[] {
  if ('reason' in result) return [];
  const k = result.trends.length;
  return result.trends.filter((t) => t.p * k <= alpha);
}

/**
 * A changed coefficient's weight: serious for a gain or a plant response, and for the present controller's
 * output level when it moved in one step (a setpoint moved, a bias changed: the baseline fitted to all logged
 * actions is then a law that never ran — found on a cold store whose setpoint moved halfway, where a trial was
 * named wrong; /work/notes/offset38-rule.md); a caution for the law's offset that drifts (an integral taking up
 * a drifting load, a season) and for the plant model's offset either way.
 */
export function trendSeverity(t: CoefficientTrend): RunOrderSeverity {
  if (t.input >= 0) return 'serious';
  return t.block === 'law' && t.change?.kind === 'step' ? 'serious' : 'caution';
}

export function runOrderSeverity(result: RunOrderResult, alpha = RUN_ORDER_ALPHA): RunOrderSeverity | null {
  const changed = changedTrends(result, alpha);
  if (changed.length === 0) return null;
  return changed.some((t) => trendSeverity(t) === 'serious') ? 'serious' : 'caution';
}

/**
 * The fewest runs with which any of k coefficients could ever be called changed at level alpha: even a
 * perfect trend (ρ = ±1) has z = √(n − 1), so n must reach the smallest with k·2Φ(−√(n − 1)) ≤ alpha
 * (found by review: with 12 runs no coefficient of a 2-state, 1-action log can fire at 10⁻³, and the
 * sentence must not then read "no coefficient changed").
 */
export function fewestRunsToShow(k: number, alpha = RUN_ORDER_ALPHA): number {
  let n = 2;
  while (k * 2 * normalSurvival(Math.sqrt(n - 1)) > alpha) n++;
  return n;
}

export function runOrderRuleText(): string {
  return 'Run order: per run, in the order the runs appear in the data, the present controller’s law (each action on the states: least squares, or the baseline’s censored fit where the log shows an actuator limit) and the one-step plant model (each next state on the states and actions) are fitted; ' +
    'each coefficient’s trend over the runs is Spearman’s rank correlation with run order (z = ρ√(n − 1), normal approximation), ' +
    `and a coefficient changed when its two-sided p times the number of coefficients tested is at most ${RUN_ORDER_ALPHA} (Bonferroni). ` +
    'A change in a gain of the law (the present controller was retuned) or in the plant’s response to a state or an action (the plant drifted) is serious, and then no candidate is named for a trial; ' +
    'a change in the law’s output level alone is serious when it moved in one step (a setpoint moved: the baseline is then an average of two operating points) and a caution when it drifts (an integral taking up a drifting load also moves it), and a change in the plant model’s offset alone is a caution. ' +
    'Where the change lies: on the ranks of the changed coefficient the finding leads with, the single step fitting best by least squares over the split points (Hinkley 1970) against a straight line in run order — a step where it leaves the smaller residual sum of squares (evaluate the runs since it), else a steady drift (no part of the log describes the plant now). ' +
    'Where the project leaves runs out by label, the whole log is checked as well, in data order: its finding stands, with its own severity, unless the change it leads with is a step that lies before every run kept.';
}

/** The changed coefficients the finding shows, the one it leads with first: the serious ones if any, else all, by |z| falling. */
export function shownTrends(result: RunOrderResult, alpha = RUN_ORDER_ALPHA): CoefficientTrend[] {
  const changed = changedTrends(result, alpha), serious = changed.filter((t) => trendSeverity(t) === 'serious');
  return (serious.length > 0 ? serious : changed).sort((a, b) => Math.abs(b.z) - Math.abs(a.z));
}

/** The finding's words, or null when nothing changed with run order. */
export function runOrderFinding(result: RunOrderResult, names: RunOrderNames): { severity: RunOrderSeverity; topic: string; message: string } | null {
  const shown = shownTrends(result);
  if (shown.length === 0 || 'reason' in result) return null;
  const serious = shown.filter((t) => trendSeverity(t) === 'serious');
  const advice = names.runName ? changeAdvice(shown[0], coefficientText(shown[0], names), result.runs, names.runName) : null;
  const law = serious.some((t) => t.block === 'law'), plant = serious.some((t) => t.block === 'model');
  const first = shown.slice(0, 3).map((t) => trendText(t, names)).join('; ');
  const more = shown.length > 3 ? `; and ${shown.length - 3} more` : '';
  const opening = `The log may not be one plant under one controller: taking the ${result.runs.toLocaleString('en-US')} runs in the order they appear in the data, ${first}${more}. `;
  if (serious.length === 0) {
    return {
      severity: 'caution', topic: 'runOrder',
      message: opening + 'Only an offset moved — the present controller’s output level, drifting rather than in one step (as an integral taking up a drifting load moves it), or the plant model’s (a disturbance that the logged states do not carry). The estimates assume one plant under one controller throughout; look at what changed, and if the plant or the controller itself changed, evaluate the runs since the change: exclude the earlier rows.' +
        // Only the plant model's offset can step in a caution (the law's that steps is serious, trendSeverity): a disturbance's level, with runs since it; one that drifts is a slow disturbance, and cutting the log to its latest runs would only find it drifting there too.
        (advice && shown[0].change?.kind === 'step' ? ` ${advice}` : ''),
    };
  }
  const lawGain = serious.some((t) => t.block === 'law' && t.input >= 0);
  const why = [
    law ? (lawGain
      ? 'a gain of the present controller’s law changed (it was retuned?), so the baseline fitted to all logged actions is an average of tunings, not the controller in service now'
      : 'the present controller’s output level moved in one step (its setpoint or bias changed, or a load or grade change its integral took up?), so the baseline fitted to all logged actions mixes two operating points and is a law that never ran, not the controller in service now') : '',
    plant ? 'the plant’s response changed (wear, fouling, a replaced part?), so every estimate here, the cross-checks included, describes the log’s average plant, not today’s' : '',
  ].filter(Boolean).join('; and ');
  return {
    severity: 'serious', topic: 'runOrder',
    message: opening + `That means ${why}. On test plants that drifted, were retuned or had their setpoint moved halfway, the present controller’s J was off by 15\u00a0% or more with every cross-check agreeing. ` +
      'No candidate is named for a trial. ' + (advice ?? 'Find where the change happened and evaluate the runs since the change: exclude the earlier rows.'),
  };
}

/** "the present controller’s gain of valve on level": the coefficient in words. */
function coefficientText(t: CoefficientTrend, names: RunOrderNames): string {
  const action = (i: number) => names.actionNames[i] ?? `action ${i + 1}`, state = (i: number) => names.stateNames[i] ?? `state ${i + 1}`;
  const regressor = (c: number) => (c < names.stateNames.length ? state(c) : action(c - names.stateNames.length));
  return t.block === 'law'
    ? (t.input < 0 ? `the present controller’s ${action(t.output)} output at the log’s mean state` : `the present controller’s gain of ${action(t.output)} on ${regressor(t.input)}`)
    : (t.input < 0 ? `the plant model’s offset of next ${state(t.output)}` : `the plant’s response of next ${state(t.output)} to ${regressor(t.input)}`);
}

/** "the law’s gain of valve on level rose from 0.12 to 0.30 (ρ = 0.93 over 500 runs)". */
function trendText(t: CoefficientTrend, names: RunOrderNames): string {
  const what = coefficientText(t, names);
  const way = number(t.late) === number(t.early) ? 'moved' : t.late > t.early ? 'rose' : 'fell';
  return `${what} ${way} from ${number(t.early)} in the first fifth of the fitted runs to ${number(t.late)} in the last (Spearman’s ρ = ${t.rho.toFixed(2)} over ${t.runs.toLocaleString('en-US')} runs)`;
}

function number(v: number): string {
  return Number(v.toPrecision(3)).toString();
}

