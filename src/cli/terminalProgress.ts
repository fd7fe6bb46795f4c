/**
 * Progress of a long run on the terminal, and Ctrl+C as cancel. Progress goes to stderr as one line
 * rewritten in place, only when stderr is a terminal (so pipes and files receive no control
 * characters); the first Ctrl+C asks the run to stop at its next safe point, a second one ends the
 * process at once. The run then ends with the documented "cancelled" exit status.
 */
import type { AssessmentProgress } from '../pipeline/assessProject';
import type { EvaluationProgress } from '../pipeline/projectRun';
import { progressText } from '../core/shareText';
import { terminalText } from './terminal';

export interface TerminalProgress {
  evaluation(progress: EvaluationProgress): void;
  assessment(progress: AssessmentProgress): void;
  /** Polled by the pipeline: true once the user pressed Ctrl+C. */
  cancelled(): boolean;
  /** Awaited between slices of a data pass (default: the pipeline's pacer); tests yield at every slice. */
  readonly pace?: () => Promise<void>;
  /** Clear the progress line and stop listening for Ctrl+C. */
  done(): void;
}

const REDRAW_MS = 200;

export function createTerminalProgress(stream: NodeJS.WriteStream = process.stderr): TerminalProgress {
  let stop = false, last = 0, shown = false;
  const onInterrupt = (): void => {
    if (stop) process.exit(130);
    stop = true;
    line('Cancelling at the next safe point… (Ctrl+C again to quit at once)', true);
  };
  process.on('SIGINT', onInterrupt);
  function line(text: string, force = false): void {
    if (!stream.isTTY) return;
    const now = Date.now();
    if (!force && now - last < REDRAW_MS) return;
    last = now;
    shown = true;
    stream.write(`\r\x1b[2K${terminalText(text).slice(0, Math.max(20, (stream.columns ?? 80) - 1))}`); // the terminal's forms: a plain space before %, names' controls escaped
  }
  return {
    evaluation(p) {
      const what = p.dataPass ? `reading the data ${progressText(p.dataPass.done / p.dataPass.total)}`
        : p.iteration ? `iteration ${p.iteration.iteration}${p.iteration.member ? ` of fit ${p.iteration.member.index} of ${p.iteration.member.count}` : ''}` : 'starting';
      line(`Fitting ${p.candidate} (${p.candidateIndex + 1} of ${p.candidateCount}): ${what}`, p.iteration === null && p.dataPass === null);
    },
    assessment(p) {
      line(p.stage === 'resampling' ? `Resampling runs: ${p.done} of ${p.total}` : p.stage === 'sensitivity' ? 'Sensitivity to the settings…' : 'Preparing the assessment…', p.done === 0);
    },
    cancelled: () => stop,
    done() {
      process.off('SIGINT', onInterrupt);
      if (shown && stream.isTTY) stream.write('\r\x1b[2K');
    },
  };
}
