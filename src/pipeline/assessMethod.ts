/**
 * The definitions and thresholds behind an assessment, stated once in words for the report and
 * the JSON, so a reviewer can see what each number means without reading the code.
 */
import { DEFAULT_ACTION_SUPPORT } from '../core/diagnostics/actionSupport';
import { AGREEMENT_THRESHOLDS } from './assessCrossChecks';
import { COVERAGE_THRESHOLDS } from './assessDiagnostics';
import { MODEL_THRESHOLDS } from './assessModelCheck';
import type { AssessmentSettings } from './assessSettings';

export function methodStatements(settings: AssessmentSettings, episodes: number, startsFollowEpisodes: boolean, approximator: 'linear' | 'network'): string[] {
  const pct = (x: number) => `${Math.round(100 * x)} %`;
  const c = COVERAGE_THRESHOLDS, a = AGREEMENT_THRESHOLDS, m = MODEL_THRESHOLDS, k = DEFAULT_ACTION_SUPPORT;
  return [
    `Intervals: nonparametric bootstrap over the ${episodes} logged episodes (whole episodes drawn with replacement; Hao et al. 2021), ` +
      `${settings.resamples} resamples, seed ${settings.seed}, level ${pct(settings.level)}; percentile and basic intervals (Davison & Hinkley 1997, §5.2–5.3). ` +
      (approximator === 'linear'
        ? 'Each resample reruns the linear fit on that resample (same features, ridge, discount and tolerance) from per-episode sums.'
        : 'With the network approximator the candidates are not resampled (each resample would refit the network), so their J has no interval; the baseline and the cross-checks are.') +
      (startsFollowEpisodes ? ' Start states are resampled with their episodes.' : ' The given start states are held fixed.'),
    'Baseline: the logged behaviour’s own discounted return per episode, resampled with the same episodes, so every candidate is compared with it by a paired bootstrap.',
    `Cross-checks agree unless the paired difference exceeds ${a.standardErrors} of its standard errors and ${pct(a.relative)} of J (our rule). ` +
      `Importance-weighted checks are uninformative when the weights at the effective horizon have a Kish effective size below max(${a.minEffectiveEpisodes}, ${pct(a.minEffectiveShare)} of the episodes).`,
    `Model-based check: used only when each next state has linear-dynamics R² ≥ ${m.dynamicsRSquared}, quadratic terms explain at most ${pct(m.curvatureShare)} ` +
      `of its residual sum of squares, and the quadratic reward fit has R² ≥ ${m.rewardRSquared} (our thresholds).`,
    `Distribution shift νᵀΣ⁻¹ν (Duan, Jia & Wang 2020): ν is the candidate’s mean feature vector over the start states, and over the logged next states, with the candidate’s actions ` +
      `by the action quadrature; Σ the logged feature second moment (with the fit’s ridge). 1 means no shift; caution above ${c.distributionShift.caution}, serious above ${c.distributionShift.serious} (our rule).`,
    `Importance weights: Kish effective sample size (Kish 1965) of the one-step ratios and of the cumulative weights at the effective horizon 1/(1 − γ); ` +
      `caution below ${pct(c.effectiveShare.caution)} of the episodes, serious below ${pct(c.effectiveShare.serious)} (a common rule of thumb).`,
    `Action support: for up to ${k.queryStates} logged states, the logged actions at the ${k.neighbours} nearest logged states (states scaled by their standard deviations; ` +
      `searched among up to ${k.referenceStates.toLocaleString('en-US')} logged states) give a range; the share of the candidate’s action probability outside it is averaged. ` +
      `Caution above ${pct(c.outside.caution)}, serious above ${pct(c.outside.serious)} (our rule); the logged controller’s own share is shown for scale.`,
    'Never-visited region: the share of the value-surface grid (spanning the logged range of its two states) with no logged state at a grid point or its 8 neighbours (our definition); V there is extrapolated.',
  ];
}
