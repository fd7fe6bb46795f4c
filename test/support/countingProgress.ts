/**
 * The command line's progress port (cli/terminalProgress.ts) for tests that act during an import:
 * `onPace` runs at each of the import's yields with the count of yields before it, `cancelled` is
 * what a stop request would answer; `seen` counts the yields and the fits begun.
 */
import type { TerminalProgress } from '../../src/cli/terminalProgress';

export function countingProgress(onPace: (paces: number) => void | Promise<void>, cancelled: () => boolean = () => false): { progress: TerminalProgress; seen: { paces: number; fits: number } } {
  const seen = { paces: 0, fits: 0 };
  const progress: TerminalProgress = {
    evaluation: () => { seen.fits++; },
    assessment: () => undefined,
    cancelled,
    pace: async () => { await onPace(seen.paces++); },
    done: () => undefined,
  };
  return { progress, seen };
}
