/**
 * The guard on the per-project degree choice (networkDegreeChoice.ts): a polynomial part of a higher
 * degree is kept only when J's start states lie inside the logs, by the product's own start-coverage
 * rule (../diagnostics/startCoverage.ts, worded by ../diagnostics/severity.ts). Otherwise the default
 * degree, and the fit says why.
 *
 * Why: the criterion scores each degree on held-out returns of the present controller, so it sees
 * only the states the logged runs pass through. A polynomial of higher degree extrapolates worse
 * beyond the data than one of lower degree (Runge's phenomenon; common practice in curve fitting),
 * and J over starts beyond every logged state is exactly such an extrapolation: on the battery the
 * unguarded choice took degree 4 on a clipped greenhouse logged steady and its J over the wide starts
 * became confident and wrong (test/battery/README.md, "A per-project choice of the polynomial part's
 * degree"). The guard does not make far starts right; it keeps the degree the linear approximator
 * and the comparator use there, where the cross-checks and the "disagree" mark were measured.
 *
 * The rule (stated before the sweep): the starts pass when at most START_OUTSIDE_LIMITS.caution of
 * them score outside the logs — the share below which the assessment raises no caution about them.
 * Starts that are the logged runs' own first rows (a project's `episodeStarts`) are logged states and
 * pass by construction; the assessment does not score them either (pipeline/assessAssembly.ts).
 *
 * Shapes: starts count×ds row-major.
 */
import { startCoverage } from '../diagnostics/startCoverage';
import { severityAbove, START_OUTSIDE_LIMITS } from '../diagnostics/severity';
import { shareText } from '../shareText';
import type { TransitionSet } from '../transitions';
import type { DegreeChoice } from './networkDegreeChoice';

export interface StartGuard {
  /** True when the starts are the logged runs' first rows (not scored: inside by construction). */
  readonly runStarts: boolean;
  readonly starts: number;
  /** Starts scoring outside the logs (0 when runStarts). */
  readonly outside: number;
  /** Whether a degree above the default may be kept. */
  readonly inside: boolean;
}

/** The guarded choice: the criterion's numbers, its own pick, and the start guard behind the degree used. */
export interface GuardedDegreeChoice extends DegreeChoice {
  /** The degree the held-out criterion picked, before the guard. */
  readonly criterionChose: number;
  /** The start guard; null when the criterion kept the default degree (nothing to guard). */
  readonly startGuard: StartGuard | null;
}

type LoggedStates = Pick<TransitionSet, 'count' | 'stateDim' | 'states' | 'episode'>;

/** runStarts: the starts are the data's own run starts (a project's `episodeStarts`). */
export function startGuard(data: LoggedStates, starts: Float64Array, runStarts: boolean): StartGuard {
  const count = starts.length / data.stateDim;
  if (runStarts) return { runStarts, starts: count, outside: 0, inside: true };
  const { outside } = startCoverage(data, starts);
  return { runStarts, starts: count, outside, inside: count > 0 && severityAbove(outside / count, START_OUTSIDE_LIMITS) === null };
}

/** Applies the guard to a choice; the guard is only computed when the criterion picked a degree above the default. */
export function guardDegreeChoice(choice: DegreeChoice, guard: () => StartGuard): GuardedDegreeChoice {
  const base = choice.degrees[0];
  if (choice.chosen === base) return { ...choice, criterionChose: choice.chosen, startGuard: null };
  const g = guard();
  if (g.inside) return { ...choice, criterionChose: choice.chosen, startGuard: g };
  const share = shareText(g.outside / g.starts);
  return {
    ...choice, chosen: base, criterionChose: choice.chosen, startGuard: g,
    sentence: `Polynomial part of degree ${base}, the default: degree ${choice.chosen} predicted the present controller’s held-out returns better, ` +
      `but ${g.outside} of the ${g.starts} start states of J (${share}) lie outside the logged states, more than the ${shareText(START_OUTSIDE_LIMITS.caution)} the start-coverage rule allows, ` +
      `and a higher degree extrapolates worse beyond the data. (${choice.sentence})`,
  };
}
