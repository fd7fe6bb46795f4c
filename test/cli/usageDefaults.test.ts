/**
 * The command line's usage text names the assessment's defaults as the assessment applies them
 * (core/limits.ts, read by pipeline/assessSettings.ts): 1,000 resamples (Efron & Tibshirani 1993, §19.3,
 * B ≥ 1000 for percentile intervals; common practice) and a 90 % level.
 */
import { describe, expect, it } from 'vitest';
import { runCli } from '../../src/cli/run';
import { recordingTerminal } from '../../src/cli/terminal';
import { DEFAULT_LEVEL, DEFAULT_RESAMPLES } from '../../src/pipeline/assessSettings';

describe('usage text', () => {
  it('gives the resamples and level the assessment uses when the project names none', async () => {
    const terminal = recordingTerminal();
    expect(await runCli(['--help'], terminal)).toBe(0);
    expect([DEFAULT_RESAMPLES, DEFAULT_LEVEL]).toEqual([1000, 0.9]);
    expect(terminal.stdout).toContain('(default: the project’s, else 1000)');
    expect(terminal.stdout).toContain('(default: the project’s, else 0.9)');
  });
});
