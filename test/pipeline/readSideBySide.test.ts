/**
 * Words and numbers read side by side, from the last screen review (heating-loop, tank-levels and the
 * two-valve fixture): each number is written by one writer, or by one rule, in the app, the report,
 * the exports and the command line. The rules are ours (core/shareText.ts, core/horizonText.ts,
 * figures/parts/tickFormat.ts tuningValueTexts); the expected digits are worked by hand:
 * 0.062912 → 6.29 % and 0.062 → 6.20 % at two decimals; 1/(1 − 0.97) = 33.33… → 33.3 at three
 * significant digits; the integral times 300 · 2^k s are labelled 300, 600, 1,200, 2,400, 4,800 on the
 * map's axis (gridPointLabels, thousands separated). All data here is invented.
 */
import { describe, expect, it } from 'vitest';
import { sharesText, shareText } from '../../src/core/shareText';
import { actionSupportFinding } from '../../src/core/diagnostics/severity';
import { horizonStepsText } from '../../src/core/horizonText';
import type { Assessment, CoverageDiagnostics } from '../../src/pipeline/assessment';
import { diagnosticsSection } from '../../src/pipeline/report/reportEvidence';
import { comparisonSection } from '../../src/pipeline/report/reportComparison';
import { dataSection, settingsSection } from '../../src/pipeline/report/reportOverview';
import { retuneSection } from '../../src/pipeline/report/reportRetune';
import type { ReportInput } from '../../src/pipeline/report/reportInput';
import type { RetuneMapResult } from '../../src/pipeline/retuneMaps';
import { formatRetuneMap } from '../../src/cli/retuneMapFormat';
import { coverageSentences, levelText, unvisitedSentence } from '../../src/renderer/src/screens/findings/assessmentWords';
import { headline } from '../../src/renderer/src/screens/findings/retuneMapWords';
import { discountWithHorizon } from '../../src/renderer/src/screens/estimator/discountHorizon';
import { FINDINGS_SECTIONS } from '../../src/renderer/src/screens/findings/findingsSections';
import { gridPointLabels } from '../../src/figures/parts/tickFormat';
import { pointReadout } from '../../src/figures/charts/retuneMapText';
import { plotTitle } from '../../src/figures/writers/plotSpec';
import { limitLabelText, limitLabelTexts } from '../../src/figures/charts/actionSlice';
import { VALUES_CHART_TITLE } from '../../src/figures/parts/plotTheme';
import { UNVISITED_TOPIC, unvisitedWarningMessage } from '../../src/pipeline/unvisitedWords';

const diagnostics = (candidate: number, logged: number): CoverageDiagnostics => ({
  occupancyShift: null, occupancyShiftUpper: null, presentControllerShift: null, shiftFeatures: '', importanceWeights: null,
  actionSupport: { meanOutside: candidate, p90Outside: 0.19, maxOutside: 0.4, behaviourMeanOutside: logged, neighbours: 20, queryStates: 200 },
} as unknown as CoverageDiagnostics);

function assessmentWith(d: CoverageDiagnostics, unvisitedShare: number | null, warnings: Assessment['warnings'] = []): Assessment {
  return {
    candidates: [{ name: 'PI', diagnostics: d, settled: null, confirmation: { status: 'unconfirmed', text: '' }, warnings: [] }],
    presentController: null, unvisitedShare, plantMemory: null, warnings,
  } as unknown as Assessment;
}

describe('1. shares compared in one sentence share a precision', () => {
  it('the rule: the most decimals any takes alone, no finer than 0.01\u00a0%; exact 0, 1 and "below" as alone', () => {
    expect(sharesText([0.062912, 0.062])).toEqual(['6.29\u00a0%', '6.20\u00a0%']);
    expect(sharesText([0.269, 0.028])).toEqual(['26.9\u00a0%', '2.8\u00a0%']);
    expect(sharesText([0.73, 0.0042])).toEqual(['73.00\u00a0%', '0.42\u00a0%']);
    expect(sharesText([0.062912, 0.000123])).toEqual(['6.29\u00a0%', '0.01\u00a0%']); // alone 0.0123 %: finer than the place a share is compared at
    expect(sharesText([0.062912, 0, 1, 5e-8, null])).toEqual(['6.29\u00a0%', '0\u00a0%', '100\u00a0%', 'below 0.01\u00a0%', '—']);
    expect(sharesText([0.5])).toEqual([shareText(0.5)]);
  });

  it('the coverage finding, the app’s sentence and the report’s row write 6.29\u00a0% beside 6.20\u00a0%, never beside 6.2\u00a0%', () => {
    const d = diagnostics(0.062912, 0.062);
    // The finding speaks above the caution limit (10 %, severity.ts): 12.90 % beside 6.29 %.
    const finding = actionSupportFinding(0.129, 20, 0.062912)!.message, sentence = coverageSentences(d).join(' ');
    const report = diagnosticsSection({ assessment: assessmentWith(d, null), assessmentProblems: [] } as unknown as ReportInput).html;
    expect(finding).toMatch(/^On average 12\.90\u00a0% .*\(the present controller itself: 6\.29\u00a0%\)/);
    expect(sentence).toContain('on average 6.29\u00a0%');
    expect(sentence).toContain('19.00\u00a0% at the 90th percentile');
    expect(sentence).toContain('40.00\u00a0% at worst (the present controller itself: 6.20\u00a0%)');
    expect(report).toMatch(/<td class="num">6\.29\u00a0%<\/td><td class="num">6\.20\u00a0%<\/td>/);
    for (const text of [sentence, report]) expect(text).not.toMatch(/\b6\.2\u00a0%/);
    expect(finding).not.toMatch(/\b12\.9\u00a0%/);
  });
});

/** An invented 5 × 5 map over gain × integral time (300 · 2^k s), its best point at 2,400 s. */
function retuneMap(): RetuneMapResult {
  const gains = [10, 20, 30, 40, 50], times = [300, 600, 1200, 2400, 4800];
  const points = gains.flatMap((g) => times.map((t) => ({ coordinates: [g, t], value: 5 + g / 100 + t / 10000, interval: [4, 7] as [number, number], status: 'converged', support: null, occupancyShift: 1, route: 'closedForm' as never })));
  const index = 2 * times.length + 3;
  return {
    candidate: 'invented PI', features: 'polynomial degree 2', notes: [], presentController: 5.6, points,
    axes: [{ parameter: 'a', label: 'proportional gain K_c (%/°C)', values: gains }, { parameter: 'b', label: 'integral time T_i (s)', values: times }],
    best: { index, value: points[index].value, coordinates: points[index].coordinates },
  };
}

describe('2. a tuning value reads as the retune map’s axis labels it', () => {
  it('2,400 in the app’s headline, the figure’s readout, the report’s caption and grid, and the command line', () => {
    const map = retuneMap();
    expect(gridPointLabels(map.axes[1].values)).toEqual(['300', '600', '1,200', '2,400', '4,800']);
    expect(headline(map)).toContain('integral time T_i (s) = 2,400');
    expect(pointReadout({ map, valueLabel: 'J', sense: 'cost', title: '', theme: 'light' }, map.best!.index)).toContain('integral time T_i (s): 2,400');
    const input = { retuneMaps: [map], retuneMapProblems: [], evaluation: { valueSense: 'cost' }, project: { columns: { reward: { unit: 'kWh' } } } } as unknown as ReportInput;
    const report = retuneSection(input, { next: () => 1 } as never).html;
    expect(report).toMatch(/T<sub>i<\/sub> \(s\) = 2,400/);
    expect(report).toContain('<th class="num">4,800</th>');
    expect(report).not.toMatch(/= 2400|>4800</);
    expect(formatRetuneMap(map, 0.9)).toContain('integral time T_i (s) = 2,400');
  });

  it('with its unit kept, the integral time reads in the figure’s minutes everywhere: 2,400 s = 40 min (figures/parts/tuningAxis.ts shownMap)', () => {
    const raw = retuneMap(), map = { ...raw, axes: raw.axes.map((a, i) => (i === 1 ? { ...a, unit: 's' } : a)) };
    expect(headline(map)).toContain('integral time T_i (min) = 40');
    const input = { retuneMaps: [map], retuneMapProblems: [], evaluation: { valueSense: 'cost' }, project: { columns: { reward: { unit: 'kWh' } } } } as unknown as ReportInput;
    const report = retuneSection(input, { next: () => 1 } as never).html;
    expect(report).toMatch(/T<sub>i<\/sub> \(min\) = 40/);
    expect(report).toContain('<th class="num">80</th>'); // 4,800 s
    expect(report).not.toMatch(/\(s\)|4,800|2,400/);
    const cli = formatRetuneMap(map, 0.9);
    expect(cli).toContain('integral time T_i (min) = 40');
    expect(cli).not.toContain('(s)');
    expect(map.axes[1].values).toEqual([300, 600, 1200, 2400, 4800]); // the result itself (and --json) keeps the project's seconds
  });
});

describe('3. one title for the values chart', () => {
  it('the Findings panel, its chart, the export’s default and the report’s caption', () => {
    expect(FINDINGS_SECTIONS.find((s) => s.id === 'values')!.title).toBe(VALUES_CHART_TITLE);
    expect(plotTitle({ kind: 'comparison', props: { evaluation: {} as never, theme: 'light' } })).toBe(VALUES_CHART_TITLE);
    const estimate = { value: 5, standardError: 0.1, percentile: [4.8, 5.2] as [number, number], basic: [4.8, 5.2] as [number, number], replicates: 10, failedReplicates: 0 };
    const assessment = {
      settings: { level: 0.9, resamples: 100, episodes: 40 }, candidates: [{ name: 'PI', policyValue: estimate }], presentController: null, behaviour: estimate,
      comparison: { baseline: { name: 'logged', note: '' }, differences: [], ranking: { order: ['PI'], frequency: 1, neighbours: [] } },
    } as unknown as Assessment;
    const report = comparisonSection({ assessment, evaluation: { valueSense: 'cost', behaviour: { meanTruncationWeight: 0.2 } }, project: { columns: { reward: {} } } } as unknown as ReportInput, { next: () => 2 } as never).html;
    expect(report).toContain(`Figure 2. ${VALUES_CHART_TITLE}, beside the baseline`);
  });
});

describe('4. one precision for the effective horizon', () => {
  it('33.3 steps in the report’s settings, the app’s facts line and the figures’ settings caption', () => {
    expect(horizonStepsText(0.97)).toBe('33.3');
    expect(horizonStepsText(0.999)).toBe('1,000');
    const report = settingsSection({ evaluation: { settings: { discount: 0.97, approximator: 'linear', quadratureNodes: 7, startStates: 10, seed: 1 } }, assessment: null, assessmentProblems: ['not run'], project: { startStates: { kind: 'episodeStarts' } } } as unknown as ReportInput).html;
    expect(report).toContain('(effective horizon 33.3 steps)');
    expect(discountWithHorizon(0.97, null)).toBe('0.97 (horizon about 33.3 steps)');
  });
});

describe('5. the unvisited share is said once', () => {
  it('where a caution states it, neither the app nor the report adds the plain sentence', () => {
    const warning = { severity: 'caution' as const, topic: UNVISITED_TOPIC, message: unvisitedWarningMessage(0.62) };
    expect(unvisitedSentence(0.62, [warning])).toBeNull();
    expect(unvisitedSentence(0.2, [])).toContain('Unvisited states: 20\u00a0%');
    const report = diagnosticsSection({ assessment: assessmentWith(diagnostics(0.01, 0.01), 0.62, [warning]), assessmentProblems: [] } as unknown as ReportInput).html;
    expect(report.split('62\u00a0% of the value-surface grid')).toHaveLength(2);
  });
});

describe('6. the chance of sitting at a limit reads as a share', () => {
  it('"upper limit 1.1: 2.58\u00a0% probability", never "P = 0.02581"', () => {
    expect(limitLabelText('upper', 1.1, 0.025807)).toBe('upper limit 1.1: 2.58\u00a0% probability');
    expect(limitLabelText('lower', 0, null)).toBe('lower limit 0');
  });

  it('both limits on one slice at one precision: "2.80 %" beside "0.31 %", never "2.8 %"', () => {
    expect(limitLabelTexts([{ side: 'lower', edge: 0, probability: 0.028 }, { side: 'upper', edge: 1.1, probability: 0.0031 }]))
      .toEqual(['lower limit 0: 2.80\u00a0% probability', 'upper limit 1.1: 0.31\u00a0% probability']);
  });
});

describe('8. the report’s excluded share and confidence level by the one share writer', () => {
  it('one excluded row in a million is "below 0.01\u00a0%", not "0.0\u00a0%"; the level reads "90\u00a0%" as the app writes it', () => {
    const summary = { rowCount: 1_000_000, usedRowCount: 999_999, excludedFraction: 1e-6, transitionCount: 999_000, episodeCount: 10, samplingPeriodSeconds: null, columns: [] };
    const project = { columns: { states: [], actions: [], reward: { kind: 'column', column: 'cost', sense: 'cost' } } };
    const data = dataSection({ data: { summary, episodeReport: [] }, project } as unknown as ReportInput).html;
    expect(data).toContain('(below 0.01\u00a0% excluded)');
    const settings = settingsSection({
      evaluation: { settings: { discount: 0.9, approximator: 'linear', quadratureNodes: 7, startStates: 10, seed: 1 } }, project: { startStates: { kind: 'episodeStarts' } },
      assessment: { settings: { level: 0.9, resamples: 100, episodes: 40, seed: 1, solver: 'one thread' }, method: [] },
    } as unknown as ReportInput).html;
    expect(settings).toContain(`level ${levelText(0.9)},`);
    expect(levelText(0.9)).toBe('90\u00a0%');
  });
});
