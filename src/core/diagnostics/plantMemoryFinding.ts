/**
 * The rule that reads the plant-memory check (plantMemory.ts) and its words, stated once: the app,
 * the command line, the report and the method statement all take their text from here.
 *
 * Effect size decides: the chance-adjusted partial R² of the component with the most left to explain,
 *   R̄² = 1 − (1 − R²)(N − p)/(N − p − q)
 * (the adjusted R² of the added block, which removes the share q/(N − p) that q unrelated regressors
 * explain by chance; Ezekiel's correction, common practice), and the F statistic only guards small
 * logs: it must also exceed the 0.1 % point of F(q, d), d = N − p − q, by the cube-root approximation
 * z = ((1 − b)F^{1/3} − (1 − a)) / √(a + bF^{2/3}), a = 2/(9q), b = 2/(9d) (Paulson 1942; Abramowitz &
 * Stegun 26.6.15, from memory), solved for F at z_{0.999} = 3.090 (A&S table 26.1, from memory); at
 * d = ∞ it is the Wilson–Hilferty point of χ²_q/q (Wilson & Hilferty 1931).
 *
 * Thresholds chosen on the battery (bench/plantMemoryTable.ts, 3 seeds): on every Markov plant of the
 * battery and the hold-outs, both ways of logging, R̄² stayed at or below 0.2 % at 20,000 rows (3 seeds)
 * and 0.9 % at 2,000 (1 seed). On the dead-time vessel (test/battery/deadTimePlant.ts, 80,000 rows,
 * d = 1..5, with a share f of the valve's effect late), the product's J (linear, degree 2) against the
 * exact J, and its shift from the same seed's J without dead time (within ±3 % there):
 *
 *   f      R̄²        J − exact (two candidates)    shift from d = 0
 *   0.03   0.8–1.5 %   −0.4 … +3.2 %                 none
 *   0.1    9–14 %      −0.8 … +3.0 %                 ≤ 0.7 points
 *   0.2    31–40 %     −2.6 … +2.2 %                 1–2 points
 *   0.3    53–60 %     −6.3 … +0.5 %                 3–6 points
 *   0.5    78–81 %     −20 … −4 %                    6–20 points
 *   1      94 %        −59 … −10 %                   11–59 points
 *
 * Hence a caution from 5 % (more than five times the Markov plants' largest, where the memory is plain
 * to see though J may still be right), and a serious finding from 50 % (where J first moved by more than the
 * ±3 % it scatters by without dead time). The battery's Markov plants are linear or mildly nonlinear; a strongly nonlinear Markov
 * plant whose misfit leaks into the earlier rows could reach the caution, which then says to look, not
 * that J is wrong.
 */
import { shareText } from '../shareText';
import type { ComponentMemory, PlantMemoryResult } from './plantMemory';

/** Adjusted partial R² above which the finding is a caution, and a serious one (chosen on the battery; see above). */
export const MEMORY_CAUTION = 0.05;
export const MEMORY_SERIOUS = 0.5;
/** z of the upper 0.1 % point of the standard normal (Abramowitz & Stegun table 26.1, from memory). */
const Z_999 = 3.09;

export interface MemoryNames {
  readonly stateNames: readonly string[];
  readonly actionNames: readonly string[];
}

/** R̄² of one component: the partial R² less what q unrelated regressors explain by chance; 0 or more. */
export function adjustedPartialRSquared(c: ComponentMemory): number {
  if (!(c.denominatorDf > 0)) return 0;
  return Math.max(0, 1 - ((1 - c.partialRSquared) * (c.denominatorDf + c.numeratorDf)) / c.denominatorDf);
}

/** The upper 0.1 % point of F(q, d) by A&S 26.6.15 (d = ∞: Wilson–Hilferty's point of χ²_q/q): the larger root for F^{1/3}. */
export function memoryFCritical(q: number, d = Infinity): number {
  const a = 2 / (9 * q), b = 2 / (9 * d), z2 = Z_999 * Z_999;
  const qa = (1 - b) ** 2 - z2 * b, qb = (1 - a) * (1 - b), qc = (1 - a) ** 2 - z2 * a;
  return ((qb + Math.sqrt(qb * qb - qa * qc)) / qa) ** 3;
}

/** The component the rule reads: the largest R̄² among those that pass the F guard; null if none. */
export function memoryComponent(result: PlantMemoryResult): ComponentMemory | null {
  if ('reason' in result) return null;
  const passing = result.components.filter((c) => c.numeratorDf > 0 && c.fStatistic > memoryFCritical(c.numeratorDf, c.denominatorDf));
  return passing.reduce<ComponentMemory | null>((a, c) => (!a || adjustedPartialRSquared(c) > adjustedPartialRSquared(a) ? c : a), null);
}

export function plantMemoryRuleText(): string {
  return `Plant memory: each next-state value is regressed on polynomial terms of the present state and action (up to two degrees above the one-step plant model’s, so that a misfit of the present row is not read as memory), then on the states and actions of the earlier rows of the same run as well ` +
    `(residual analysis of a one-step model, Ljung 1999, §16.6, as a nested least-squares regression with an F-test); the share of what the model left that the earlier rows explain, adjusted for chance, ` +
    `above ${memoryPercent(MEMORY_CAUTION)} is a caution and above ${memoryPercent(MEMORY_SERIOUS)} serious (when its F also exceeds its 0.1 % point): the logged state then does not carry the plant’s memory, which every estimate and cross-check here assumes. ` +
    'Where it is serious, the model rollouts and the linear-quadratic closed form are not applied (they simulate a one-step model that assumes the same), and no candidate is named for a trial.';
}

/** The finding's words, or null below the caution threshold or without a result. */
export function plantMemoryFinding(result: PlantMemoryResult, names: MemoryNames): { severity: 'caution' | 'serious'; topic: string; message: string } | null {
  const c = memoryComponent(result);
  if (!c || !(adjustedPartialRSquared(c) > MEMORY_CAUTION)) return null;
  const share = adjustedPartialRSquared(c), serious = share > MEMORY_SERIOUS, s = c.strongest;
  const state = names.stateNames[c.component] ?? `state ${c.component + 1}`;
  const most = s ? ` — most of it ${signalName(s.kind, s.index, names)} ${s.lag} row${s.lag === 1 ? '' : 's'} back` : '';
  return {
    severity: serious ? 'serious' : 'caution', topic: 'plantMemory',
    message: `The logged state may not carry the plant’s memory: the rows before explain ${memoryPercent(share)} of what the one-step model leaves unexplained in ${state}${most}. ` +
      'Every estimate here, the cross-checks included, assumes the next state depends on the present state and action only; a dead time or a lag that is not logged breaks that' +
      (serious ? ', and then J and the cross-checks can all be off together (on a test plant with a dead time, 53–60 % put J off by up to 6 %, 94 % by up to 59 %); the model rollouts and the closed form, which assume it too, are not applied. ' : '. ') +
      'Add the earlier values named here as derived states (columns.derived, kind "previous") and evaluate again.',
  };
}

function signalName(kind: 'state' | 'action', index: number, names: MemoryNames): string {
  const list = kind === 'state' ? names.stateNames : names.actionNames;
  return list[index] ?? `${kind} ${index + 1}`;
}

/** A share as the finding, the rule and the coverage line write it: by the one share writer (core/shareText.ts), so its thresholds read "5 %" beside "50 %", not "5.0 %". */
export const memoryPercent = shareText;
