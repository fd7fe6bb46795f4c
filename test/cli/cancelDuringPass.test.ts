/**
 * Ctrl+C during a data pass: the pass yields to the event loop between blocks of transitions, so a
 * stop request that arrives as an event (as SIGINT does; here a timer set when the first block is
 * reported) is heard before the pass ends, and the command ends with the documented "cancelled"
 * status (exit 130, src/cli/exitStatus.ts) and writes nothing. No timing is asserted: the check is
 * how many blocks of the first pass were read before it stopped.
 */
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { EXIT } from '../../src/cli/exitStatus';
import { evaluateProjectFile } from '../../src/cli/evaluateProjectFile';
import type { TerminalProgress } from '../../src/cli/terminalProgress';

const project = join(__dirname, '..', '..', 'sample-projects', 'tank-levels', 'tank-levels.spcritic');

/** A terminal that "presses Ctrl+C" by an event-loop timer once the first block is reported; pace as given. */
function pressingCtrlC(pace: () => Promise<void>): { progress: TerminalProgress; passes: { done: number; total: number }[] } {
  let stop = false, pressed = false;
  const passes: { done: number; total: number }[] = [];
  const progress: TerminalProgress = {
    evaluation(p) {
      if (!p.dataPass || p.candidateIndex !== 0) return;
      passes.push(p.dataPass);
      if (!pressed) { pressed = true; setTimeout(() => { stop = true; }, 0); }
    },
    assessment: () => undefined,
    cancelled: () => stop,
    pace,
    done: () => undefined,
  };
  return { progress, passes };
}

describe('cancelling the command line during a data pass', () => {
  it('stops the first pass after a block or two, with exit 130 and the cancelled message', async () => {
    const { progress, passes } = pressingCtrlC(() => new Promise((resolve) => setTimeout(resolve, 0)));
    const result = await evaluateProjectFile(project, { resamples: 50 }, undefined, progress);
    expect(result.ok).toBe(false);
    if (result.ok) return;
    expect(result.failure.exitCode).toBe(EXIT.cancelled);
    expect(result.failure.message).toBe('Cancelled (Ctrl+C): no results were written.');
    const total = passes[0].total;
    expect(total).toBeGreaterThan(4 * passes[0].done); // the sample's pass has many blocks
    expect(passes.length).toBeLessThanOrEqual(2);
    expect(passes[passes.length - 1].done).toBeLessThan(total);
  }, 120_000);

  it('without yielding, the same request is heard only after the pass (the contrast that makes the check above meaningful)', async () => {
    const { progress, passes } = pressingCtrlC(async () => undefined);
    const result = await evaluateProjectFile(project, { resamples: 50 }, undefined, progress);
    expect(result.ok).toBe(false);
    if (!result.ok) expect(result.failure.exitCode).toBe(EXIT.cancelled);
    expect(passes[passes.length - 1].done).toBe(passes[0].total);
  }, 120_000);
});
