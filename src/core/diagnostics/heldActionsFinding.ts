/**
 * The rule that reads the held-actions check (heldActions.ts) and its words, stated once: the app, the
 * command line, the report and the method statement all take their text from here.
 *
 * The effect E decides (heldActions.ts: by how much of its own dither the law fitted to every row sits off
 * the law the rows not held follow, RMS over the logged states). Thresholds (written before measuring,
 * /work/notes/held40-rule.md; test/battery/README.md, "Held actions"): on the cooling tower with manual
 * stretches (seed 1; J of the law fitted to every row, rolled out on the plant, against today's automatic law):
 *
 *   held share   2 %     3 %     5 %     10 %
 *   E            0.147   0.206   0.338   0.565
 *   J off        2.3 %   3.2 %   5.9 %   11.6 %
 *
 * Serious from E = 0.5, where that J first moves by the cross-checks' 10 % yardstick (interpolated: 0.501,
 * rounded down); a caution from 0.1 (a quarter of it, rounded down: J off by a few per cent at most, within
 * what the battery's J scatters by — a look, not a verdict). Fewer than HELD_MIN_ROWS held rows: nothing.
 *
 * The repair (written before measuring, /work/notes/held42-rule.md; test/battery/README.md, "Held actions",
 * "The law fitted on the moving rows"): wherever the rule finds something (a caution or worse), the present
 * controller's law is fitted on the rows not held (pipeline/plan/presentController.ts); FQE still uses every row.
 * The importance-sampling checks are then not applicable (on a held row the logging law is a point mass, not the
 * fitted Gaussian). The severity is unchanged: a drop to a caution once repaired was measured and not adopted (on
 * the tower with 10 % held, a candidate's J — which the repair does not touch — was then confident and wrong).
 */
import { shareText } from '../shareText';
import type { HeldEffect, HeldStretches } from './heldActions';

/** Effect from which the finding is a caution, and serious (see above). */
export const HELD_CAUTION = 0.1;
export const HELD_SERIOUS = 0.5;
/** Fewest held rows the rule reads (ours: a law fitted on thousands of rows is moved little by fewer). */
export const HELD_MIN_ROWS = 50;

export const HELD_TOPIC = 'heldActions';

export type HeldSeverity = 'caution' | 'serious' | null;

/** Runs in the log, and how many hold a held row. */
export interface HeldRuns {
  readonly withHeld: number;
  readonly total: number;
}

/** Where the present controller's law was fitted on the rows not held: how many rows, and the runs with held rows. */
export interface HeldRepair {
  readonly rowsUsed: number;
  readonly runs: HeldRuns;
}

/** The rule's verdict on the check's numbers: null below HELD_MIN_ROWS held rows or below the caution; a caution where enough rows are held but no effect could be read. */
export function heldSeverity(stretches: HeldStretches, effect: HeldEffect): HeldSeverity {
  if (stretches.rows < HELD_MIN_ROWS) return null;
  // Enough held rows, but their pull on the law could not be read: a caution that says so, never silence.
  if ('reason' in effect) return 'caution';
  if (effect.effect >= HELD_SERIOUS) return 'serious';
  return effect.effect >= HELD_CAUTION ? 'caution' : null;
}

/** Whether the present controller's law is to be fitted on the rows not held: wherever the rule finds something. */
export function heldLawRepaired(stretches: HeldStretches, effect: HeldEffect): boolean {
  return !('reason' in effect) && heldSeverity(stretches, effect) !== null;
}

/** Why the importance-sampling checks do not apply where the law was fitted on the rows not held (a reason, as the checks print it). */
export function heldImportanceReason(runs: HeldRuns): string {
  return `actions were held in ${runs.withHeld.toLocaleString('en-US')} of ${runs.total.toLocaleString('en-US')} runs, and on a held row the logged action came from no law with dither (a point mass, not the present controller’s fitted model), so the importance weights are not defined there`;
}

/** After "as fitted to the log": the held rows the law was fitted without where the repair applied, else nothing (one phrase for app, CLI and report). */
export function heldRowsLeftOutText(heldRowsLeftOut: number | undefined): string {
  return heldRowsLeftOut ? ` without its ${heldRowsLeftOut.toLocaleString('en-US')} held rows` : '';
}

/** E as the words give it: two decimals, "less than 0.01" below. */
export function effectText(effect: number): string {
  if (!Number.isFinite(effect)) return 'more than any multiple (the rows not held follow the states with no dither at all)';
  return effect < 0.005 ? 'less than 0.01' : effect.toFixed(2);
}

export function heldActionsRuleText(): string {
  return `Held actions: a row whose every action equals the row before’s exactly, in the same run and away from the actuator limits read from the log, is held (a law with dither repeats a value with probability zero); ` +
    `the present controller’s law is fitted by least squares on every row and on the rows not held, and the effect is the root mean square over the logged states of the difference of their means, in the second law’s dither; ` +
    `with at least ${HELD_MIN_ROWS} held rows, an effect from ${HELD_CAUTION} is a caution and from ${HELD_SERIOUS} serious (where, on a test plant, the J of the law fitted to every row first moved by 10 %), and then no candidate is named for a trial; an effect that cannot be read is a caution; ` +
    `wherever it is a caution or serious, the present controller’s law is fitted on the rows not held (fitted Q-evaluation still uses every row) and the importance-sampling checks are not applicable (on a held row the logging law is a point mass).`;
}

/** The finding's words, or null where the rule finds nothing; `repaired` where the law was fitted on the rows not held. */
export function heldActionsFinding(stretches: HeldStretches, effect: HeldEffect, repaired: HeldRepair | null = null, repairFailed = ''): { severity: 'caution' | 'serious'; topic: string; message: string } | null {
  const severity = heldSeverity(stretches, effect);
  if (!severity) return null;
  const { rows, stretches: count, longest } = stretches;
  const law = 'reason' in effect ? unreadWords(effect.reason)
    : repaired ? repairedWords(effect.effect, severity, repaired) : pooledWords(effect.effect, severity, repairFailed);
  return {
    severity, topic: HELD_TOPIC,
    message: `${rows.toLocaleString('en-US')} rows (${shareText(stretches.share)}) in ${count.toLocaleString('en-US')} stretch${count === 1 ? '' : 'es'} of up to ${longest} rows repeat the action of the row before exactly, away from the actuator limits. ` +
      law +
      'Likely causes: the loop in manual, a held or frozen signal, historian compression, or an action held by design between moves (a setpoint changed by hand now and then), which no law with dither describes. ' +
      'Export the loop’s mode with the log and leave out the rows in manual (time windows, where there are few), or log the action without compression, and evaluate again.',
  };
}

function unreadWords(reason: string): string {
  return `How far they pull the present controller’s law could not be read (${reason}), so its law is fitted on every row, held rows included: read its J and every difference from it with care. `;
}

function pooledWords(effect: number, severity: 'caution' | 'serious', repairFailed: string): string {
  return (repairFailed ? `The present controller’s law could not be fitted on the rows not held (${repairFailed}), so it is fitted on every row. ` : '') +
    `The present controller’s law fitted to every row differs from the law the other rows follow by ${effectText(effect)} of its dither` +
    (severity === 'serious' ? ': its J is the J of a law that never ran, and every difference is taken against it (on a test plant, 0.56 put that J off by 12 %); no candidate is named for a trial. ' : ' (serious from ' + HELD_SERIOUS + '). ');
}

function repairedWords(effect: number, severity: 'caution' | 'serious', repaired: HeldRepair): string {
  const { runs } = repaired;
  return `A law fitted to every row would differ from the law the other rows follow by ${effectText(effect)} of its dither, so the present controller’s law is fitted on the ${repaired.rowsUsed.toLocaleString('en-US')} rows not held; ` +
    'fitted Q-evaluation still uses every row. ' +
    `The importance-sampling checks are not applicable (actions held in ${runs.withHeld.toLocaleString('en-US')} of ${runs.total.toLocaleString('en-US')} runs), and the logged return measures the months as logged, held stretches included` +
    (severity === 'serious'
      ? '; each candidate’s J is still read from a log that mixes two ways of acting, and the refit can itself be pulled where held stretches sit at an actuator stop (on a test cold store it stayed far off), so the present controller’s J may still be wrong and every difference is taken against it: no candidate is named for a trial. '
      : ' (serious from ' + HELD_SERIOUS + '). ');
}
