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

/**
 * A discount as the sentences name it: 1 − γ to two significant digits, so the horizon it stands for
 * reads to a few per cent and close discounts stay apart ("0.966" for 0.96638, "0.999" beside
 * "0.99933" and "0.9995"); never rounded to 1, which no discount is. Significant digits of γ itself
 * would write 0.9995 as "1" at three and 0.99933 and 0.99867 alike at four.
 */
export function discountText(discount: number): string {
  if (!(discount > 0 && discount < 1)) return String(discount);
  const decimals = Math.max(2, 1 - Math.floor(Math.log10(1 - discount)));
  return discount.toFixed(decimals).replace(/0+$/, '').replace(/\.$/, '');
}
