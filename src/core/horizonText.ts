/**
 * The discount's effective horizon 1/(1 − γ) in logged steps (common practice), written once for
 * every host: the Estimator's help line, the Run screen, the figures' settings caption, the plan's
 * check of the discount against the logs and the report's settings table all call horizonStepsText,
 * so the report never reads "33.33 steps" beside a caption's "about 33.3". HORIZON_DIGITS
 * significant digits, trailing zeros dropped, thousands separated ("33.3", "20", "1,000"): the
 * horizon is a scale, not a count, and three digits tell one discount's from another's at the
 * precision a discount is typed (0.97 against 0.975: 33.3 against 40).
 */
import { horizonSteps } from './limits';

/** Significant digits of a number of steps (the horizon, a half-life in steps). */
export const HORIZON_DIGITS = 3;

/** "33.3" from 33.333…, "1,000" from 1000: a number of logged steps at HORIZON_DIGITS significant digits. */
export function stepsText(steps: number): string {
  if (!Number.isFinite(steps)) return steps > 0 ? '∞' : '—';
  return Number(steps.toPrecision(HORIZON_DIGITS)).toLocaleString('en-US', { maximumFractionDigits: 20 });
}

/** The effective horizon of discount γ in logged steps: "33.3" for γ = 0.97. */
export function horizonStepsText(discount: number): string {
  return stepsText(horizonSteps(discount));
}
