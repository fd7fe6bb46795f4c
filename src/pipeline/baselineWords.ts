/**
 * The modelled present controller in words, for every host that prints it (the command line's
 * baseline line, the report's candidates table): each number per action, and where its law sits.
 */
import type { Evaluation } from './estimates';

type BaselineModel = NonNullable<Evaluation['presentController']>['model'];

/**
 * "offset 1.2 %" with one action; with several, each value named by its action's column: "offset 0.3 on
 * hot_valve, 0.7 on cold_valve". Each value in its action's unit where the project declares one.
 */
export function perAction(label: string, values: readonly number[], actions: readonly string[] | undefined, units: readonly string[] | undefined, format: (v: number) => string): string {
  const valued = (v: number, j: number) => `${format(v)}${units?.[j] ? ` ${units[j]}` : ''}`;
  if (values.length <= 1 || !actions || actions.length !== values.length) return `${label} ${values.map(valued).join(', ')}`;
  return `${label} ${values.map((v, j) => `${valued(v, j)} on ${actions[j]}`).join(', ')}`;
}

/**
 * Where the modelled controller sits: its mean action at the mean logged state, the number an engineer
 * can hold against the log; the offset (the mean at the state 0, often far outside the logs) only for
 * results saved before that was kept. "Before the limits" only where the log shows a limit: there the
 * censored fit's mean is that of the unclipped law (it may lie past a limit), and without one the words
 * would name a clip the model does not have (the tank sample read "before the limits; … limits: none seen").
 */
export function centreText(model: BaselineModel, format: (v: number) => string): string {
  if (!model.meanAtMeanState) return perAction('offset', model.offset, model.actions, model.units, format);
  const limited = [...model.lo, ...model.hi].some((limit) => limit !== null);
  return `linear in the state: ${perAction('mean', model.meanAtMeanState, model.actions, model.units, format)} at the mean logged state${limited ? ', before the limits' : ''}`;
}
