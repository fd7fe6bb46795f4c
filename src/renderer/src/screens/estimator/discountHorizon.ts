/**
 * The discount factor as a time horizon: a cost k steps ahead weighs γ^k, so the weights sum to
 * 1/(1 − γ) steps (the "effective horizon", common practice), and a cost counts half after
 * ln 2 / −ln γ steps (its half-life). With the sampling period the import found, both read in time.
 */
import { formatDuration, formatNumber } from '../../format/numberFormat';
import { stepsText } from '../../../../core/horizonText';
import { HORIZON_FORMULA } from '../../../../core/formulaText';

export interface DiscountHorizon {
  horizonSteps: number;
  halfLifeSteps: number;
  horizonSeconds: number | null;
  halfLifeSeconds: number | null;
}

export function discountHorizon(discount: number, periodSeconds: number | null): DiscountHorizon | null {
  if (!(discount > 0 && discount < 1)) return null;
  const horizonSteps = 1 / (1 - discount), halfLifeSteps = Math.log(2) / -Math.log(discount);
  const period = periodSeconds !== null && periodSeconds > 0 ? periodSeconds : null;
  return { horizonSteps, halfLifeSteps, horizonSeconds: period && horizonSteps * period, halfLifeSeconds: period && halfLifeSteps * period };
}

/** The help line under the discount field, with the horizon in steps and, when known, in time. */
export function discountHelp(discount: number, periodSeconds: number | null): string {
  const h = discountHorizon(discount, periodSeconds);
  if (!h) return 'Weight of a cost one logged step later, between 0 and 1 (exclusive).';
  const inTime = h.horizonSeconds !== null && h.halfLifeSeconds !== null
    ? ` At the ${formatNumber(periodSeconds!)} s sampling period: a horizon of about ${formatDuration(h.horizonSeconds * 1000)}; a cost ${formatDuration(h.halfLifeSeconds * 1000)} ahead counts half.`
    : ' Give the log a timestamp column to see this in time.';
  return `Weight of a cost one logged step later. ${formatNumber(discount)} looks about ${stepsText(h.horizonSteps)} steps ahead (${HORIZON_FORMULA}); a cost ${stepsText(h.halfLifeSteps)} steps ahead counts half.${inTime}`;
}

/**
 * The discount with its time horizon, for a facts line: "0.97 (horizon about 33.3 steps; about 16 min
 * 40 s at the 30 s sampling period)", or the discount alone outside (0, 1). The same numbers as discountHelp.
 */
export function discountWithHorizon(discount: number, periodSeconds: number | null): string {
  const h = discountHorizon(discount, periodSeconds);
  if (!h) return formatNumber(discount);
  const inTime = h.horizonSeconds === null ? '' : `; about ${formatDuration(h.horizonSeconds * 1000)} at the ${formatNumber(periodSeconds!)} s sampling period`;
  return `${formatNumber(discount)} (horizon about ${stepsText(h.horizonSteps)} steps${inTime})`;
}
