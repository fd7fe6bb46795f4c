/**
 * The definitions and thresholds behind an assessment, stated once in words for the report and
 * the JSON, so a reviewer can see what each number means without reading the code. Every threshold
 * is quoted from the constant the code applies (src/core/diagnostics/severity.ts,
 * crossCheckVerdict.ts, functionClassRange.ts, possibleStateValues.ts, returnConcentration.ts, plantMemoryFinding.ts).
 */
import { DEFAULT_ACTION_SUPPORT } from '../core/diagnostics/actionSupport';
import { CLASS_AGREEMENT } from '../core/diagnostics/functionClassRange';
import { actionSupportRuleText, effectiveShareRuleText, occupancyShiftRuleText, startCoverageRuleText } from '../core/diagnostics/severity';
import { possibleValuesRuleText } from '../core/diagnostics/possibleStateValues';
import { MAX_VALUE_CHECK_STATES } from '../core/limits';
import { LOGGED_LIMITS_NAMED, loggedLimitRuleText } from '../core/loggedActionLimits';
import { plantMemoryRuleText } from '../core/diagnostics/plantMemoryFinding';
import { heldActionsRuleText } from '../core/diagnostics/heldActionsFinding';
import { runOrderRuleText } from '../core/diagnostics/runOrderFinding';
import { returnConcentrationRuleText } from '../core/diagnostics/returnConcentration';
import { CROSS_CHECK_RULE } from '../core/offPolicy/crossCheckVerdict';
import { COMPARED_DEGREES, MAX_CLASS_FEATURES } from './assessClasses';
import { MODEL_THRESHOLDS } from './assessModelCheck';
import { ROLLOUT_RESAMPLES, ROLLOUT_STARTS, ROLLOUTS_PER_START, ROLLOUTS_TOTAL } from './assessRollouts';
import type { AssessmentSettings } from './assessSettings';
import { shareText } from '../core/shareText';

export function methodStatements(settings: AssessmentSettings, episodes: number, startsFollowEpisodes: boolean, resampling: string): string[] {
  const pct = shareText;
  const a = CROSS_CHECK_RULE, m = MODEL_THRESHOLDS, k = DEFAULT_ACTION_SUPPORT, c = CLASS_AGREEMENT;
  return [
    `Intervals: nonparametric bootstrap over the ${episodes} logged runs (whole runs drawn with replacement; Hao et al. 2021), ` +
      `${settings.resamples} resamples, seed ${settings.seed}, level ${pct(settings.level)}; percentile and basic intervals (Davison & Hinkley 1997, §5.2–5.3). ` +
      `How each candidate is resampled: ${resampling}.` + (startsFollowEpisodes ? ' Start states are resampled with their runs.' : ' The given start states are held fixed.') +
      ' These intervals cover the sampling of the runs only, with the function class held fixed.',
    `Function classes: each candidate is also fitted with polynomial features of degree ${COMPARED_DEGREES.join(', ')} (up to ${MAX_CLASS_FEATURES} features) on the same resamples. ` +
      `The classes agree unless a pair differs by more than ${c.standardErrors} paired standard errors (the spread of the paired resamples read from their quartiles, interquartile range / 1.349, so a few runaway fits cannot hide a gap) and ${pct(c.relative)} of J; ` +
      `agreement counts only from a class that could have seen a gap of ${pct(CROSS_CHECK_RULE.detectableGap)} of J (${c.standardErrors} paired standard errors within it), and where no other class could check the project’s own the estimate is not settled; ` +
      'the reported range spans every class’s interval, so it covers sampling and the spread between the classes fitted — not a bias they all share.',
    `Baseline: the present controller is modelled from the log (linear-Gaussian in the state, clipped at ${LOGGED_LIMITS_NAMED} and fitted there by censored maximum likelihood) ` +
      'and evaluated by the same fitted Q-evaluation as the candidates, on the same resamples; every candidate is compared with it (with a network, its last layer re-solved on each resample, a draw of the training’s own spread added, and each difference’s interval widened by both fits’ stopping-rule drift). The logged discounted return ' +
      `is shown as a check, cut short where runs end on a time limit, and completed there by the fitted value γ^T·V̂(s_T). Limits: ${loggedLimitRuleText()} (our rule).`,
    `Cross-checks are informative only when they could see an error of ${pct(a.detectableGap)} of J (three paired standard errors within it), with an effective size of at least ` +
      `max(${a.minEffectiveEpisodes}, ${pct(a.minEffectiveShare)} of the runs) for the importance weights, at most ${pct(a.maxTailWeight)} of the discount weight past the runs’ ends, ` +
      `and for the model rollouts at most ${pct(a.maxShareOutsideLogs)} of simulated steps at the edge of the logged states, and at most ${pct(a.maxRewardShareAtEdge)} of the model’s ` +
      `discounted rewards (in size) from states held there — half the ${pct(a.detectableGap)} the check must see, since an extrapolated part may be wrong by its whole size; an informative check disagrees when the paired ` +
      `difference exceeds ${a.standardErrors} standard errors and ${pct(a.relative)} of J (our rule). A network’s fit is not paired with the checks (its resamples re-solve only the last layer, and its interval carries bounds of unknown sign): ` +
      'there the difference’s standard error is the check’s plus the fit’s own, a bound that holds whatever their correlation. When no check is informative, the estimate is reported as unconfirmed; ' +
      'so it is where the function classes disagree and only checks resting on a plant model fitted to the same logs (rollouts, the linear-quadratic closed form) agree.',
    `Model rollouts: a one-step plant model (polynomial in the state and action) fitted to the logs, simulated from up to ${ROLLOUT_STARTS} start states ` +
      `(${ROLLOUTS_PER_START} rollouts each, at least ${ROLLOUTS_TOTAL} in all), on the first ${ROLLOUT_RESAMPLES} resamples; its Monte Carlo error is added to the paired standard error. ` +
      `Linear-quadratic closed form: used only when each next state has linear-dynamics R² ≥ ${m.dynamicsRSquared}, ` +
      `quadratic terms explain at most ${pct(m.curvatureShare)} of its residual sum of squares, and the quadratic reward fit has R² ≥ ${m.rewardRSquared} (our thresholds).`,
    occupancyShiftRuleText(),
    effectiveShareRuleText(),
    `${actionSupportRuleText()} The logged range near a state is that of the actions at the ${k.neighbours} nearest logged states (states scaled by their standard deviations), ` +
      `for up to ${k.queryStates} logged states.`,
    possibleValuesRuleText(MAX_VALUE_CHECK_STATES),
    returnConcentrationRuleText(),
    plantMemoryRuleText(),
    runOrderRuleText(),
    heldActionsRuleText(),
    'Never-visited region: the share of the value-surface grid (spanning the logged range of its two states) with no logged state at a grid point or its 8 neighbours (our definition); V there is extrapolated.',
    ...(startsFollowEpisodes ? [] : [startCoverageRuleText()]),
  ];
}
