/**
 * The candidates block of `evaluate`: every form of the heating-loop sample in the trade's words, as the
 * terminal shows it. The summaries hold each number to its unit with a no-break space (for the app and
 * the report); the command line writes it as a plain space (cli/terminal.ts, terminalText, the rule
 * core/shareText.ts's header states), so a user finds "25 % per °C" as typed.
 */
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { formatCandidates } from '../../src/cli/formatCandidates';
import { summariseCandidate } from '../../src/project/candidateSummary';
import { recordingTerminal } from '../../src/cli/terminal';
import { parseProjectText } from '../../src/project/projectFile';

describe('formatCandidates', () => {
  it('describes the PI, schedule and rate-limited candidates with units, with plain spaces on the terminal', () => {
    const parsed = parseProjectText(readFileSync(new URL('../../sample-projects/heating-loop/heating-loop.spcritic', import.meta.url), 'utf8'), 'heating-loop.spcritic');
    if (!parsed.ok) throw new Error('sample did not load');
    const written = formatCandidates(parsed.value.document);
    expect(written).toContain('K_c 25\u00a0% per °C'); // held together in the text itself
    const terminal = recordingTerminal();
    terminal.out(written);
    const text = terminal.stdout;
    expect(text).not.toContain('\u00a0');
    expect(text).toContain('heating_valve_pct: PI, reverse acting, on 21 °C − zone_temp_c: K_c 25 % per °C, T_i 1800 s (integral state zone_error_integral); bias 82.7 %');
    expect(text).toContain('heating_valve_pct: schedule on outdoor_temp_c (-10 °C → 92 %, -6 °C → 87.7 %, -2 °C → 82.7 %, 2 °C → 76.9 %, 6 °C → 69.9 %; held beyond the ends), plus P, reverse acting, on 21 °C − zone_temp_c: K_c 20 % per °C');
    expect(text).toContain('dither 3 % (standard deviation); limits: clipped to 0 … 100 %; heating_valve_pct moves at most 2 % per step from valve_prev_pct');
    // A number's sign is the terminal's ASCII minus, as in every other number `evaluate` prints (the tables' "-5.361");
    // the "−" between a setpoint and its measurement is an operator between names, and stays.
    const schedule = parsed.value.document.candidates.find((c) => c.form.kind === 'schedule')!;
    expect(summariseCandidate(schedule, parsed.value.document.columns).mean[0]).toContain('−10\u00a0°C → 92\u00a0%'); // typeset where the report reads it
    expect(text).not.toMatch(/\u2212\d/);
  });

  it('writes the tank sample’s negative gains with the terminal’s minus', () => {
    const parsed = parseProjectText(readFileSync(new URL('../../sample-projects/tank-levels/tank-levels.spcritic', import.meta.url), 'utf8'), 'tank-levels.spcritic');
    if (!parsed.ok) throw new Error('sample did not load');
    const terminal = recordingTerminal();
    terminal.out(formatCandidates(parsed.value.document));
    expect(terminal.stdout).toContain('inflow_valve_pct = 189 % + (-60 % per m)·level_upper_m + (-90 % per m)·level_lower_m');
  });
});
