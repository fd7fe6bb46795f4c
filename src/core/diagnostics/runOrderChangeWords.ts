/**
 * What to do about a coefficient that changed with run order, by the shape of its change
 * (changeShape.ts): after a step, evaluate the runs since it, and which runs to leave out; after a
 * steady drift, no run marks the change and no part of the log describes today's plant: leaving out
 * earlier runs narrows the gap but does not close it, and the check keeps its warning where runs are left
 * out (it reads the whole log, runsLeftOutReading.ts), so the advice is fresh logs after the cause is
 * mended (memory38). One writer for the app, the command line and the report (through
 * runOrderFinding.ts); run labels as runLabelText writes them.
 */
import { RUN_ORDER_MIN_RUNS } from '../limits';
import { runNameText, runSpanText, type RunName } from '../runLabelText';
import type { CoefficientTrend } from './runOrder';

/** Where the project says which runs to leave out, and where the app does. */
const LEAVE_OUT_WHERE = 'project field data.csv.excludedRuns; in the app, Plant log → Runs left out';

/**
 * The advice sentence for the coefficient the finding leads with (`what`: its name in words), or null when
 * its shape is unknown. `runs`: the log's run count; `runName(position)`: run position (0-based, data order) named.
 */
export function changeAdvice(t: CoefficientTrend, what: string, runs: number, runName: (position: number) => RunName): string | null {
  if (!t.change) return null;
  if (t.change.kind === 'step') {
    const at = t.change.run, first = runName(0), before = runName(at - 1), since = runName(at), where = `${capital(what)} changed around ${runNameText(since)} (the ${ordinal(at + 1)} of ${runs.toLocaleString('en-US')} in the data)`;
    // Review39: a noisy steady drift often fits one step a little better than a line; only a clear step is a place to cut.
    if (!t.change.clear) {
      return `${where}, in what looks more like one step than a steady drift, but not clearly enough to cut the log at: leaving out the runs before it may leave a drift in the runs kept, and where runs are left out by label this check still reads the whole log and keeps the warning. ` +
        'Look at what changed around then (a retune, a setpoint, a replaced part, wear) before evaluating any part of this log.';
    }
    const kept = runs - at, few = kept < RUN_ORDER_MIN_RUNS ? `, too few for this check to read on their own (it needs ${RUN_ORDER_MIN_RUNS}), so log more runs under the present plant and controller before trusting a trial` : '';
    return `${where}, in one step rather than a steady drift. ` +
      `To evaluate the runs since the change, ${leaveOut(first, before, since)}; that keeps ${kept.toLocaleString('en-US')} run${kept === 1 ? '' : 's'}${few}.`;
  }
  return `${capital(what)} changed steadily over the runs, not in one step, so no run marks the change and no part of the log describes the plant as it is now. ` +
    'Leaving out earlier runs narrows the gap but does not close it: the plant went on changing through the runs kept, so their numbers describe it as it was partway through them ' +
    '(on a test pump that wore steadily, the latest third left the present controller’s J off by about 11\u00a0% instead of 24\u00a0%), and where runs are left out by label this check still reads the whole log and keeps the warning. ' +
    'What would help: fresh logs, in a file of their own, taken after the cause (wear, fouling, an instrument) is found and mended, or since a known replacement.';
}

/** "leave out runs "1" to "17" (…)", or the rows above the next run's first line where the log has no run column. */
function leaveOut(first: RunName, last: RunName, next: RunName): string {
  const span = runSpanText(first, last);
  return span ? `leave out ${span} (${LEAVE_OUT_WHERE})` : `leave out the rows above line ${next.line.toLocaleString('en-US')} (the log has no run column to name the runs by)`;
}

function capital(s: string): string {
  return s.charAt(0).toUpperCase() + s.slice(1);
}

/** 1st, 2nd, 3rd, 4th, 11th, 12th, 13th, 21st … */
export function ordinal(k: number): string {
  const tens = k % 100, units = k % 10;
  const suffix = tens >= 11 && tens <= 13 ? 'th' : units === 1 ? 'st' : units === 2 ? 'nd' : units === 3 ? 'rd' : 'th';
  return `${k.toLocaleString('en-US')}${suffix}`;
}
