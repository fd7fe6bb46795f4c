/**
 * The report's slice caption states each action's own dither with its unit when a candidate has
 * several actions (the blending tank hold-out: a hot and a cold valve). The numbers are the
 * candidate's own, as given in its project; before, the caption stated the first slice's dither
 * and the first action's unit for every action.
 */
import { describe, expect, it } from 'vitest';
import type { ActionSlice } from '../../src/pipeline/assessment';
import { sliceDitherText, sliceStatesText } from '../../src/pipeline/report/reportFigures';

const slice = (actionIndex: number, candidateStd: number): ActionSlice => ({
  label: 'T at its 50th percentile', state: [22, 1], actionIndex, actions: [0, 1], values: [0, 0], candidateMean: 0.5, candidateStd, loggedRange: [0, 1],
});

describe('slice caption dither', () => {
  it('names one action’s dither and unit', () => {
    expect(sliceDitherText([slice(0, 0.08)], [{ column: 'steam_valve', unit: '%' }])).toBe('dither 0.08 %');
  });

  it('names each of two actions’ own dither and unit', () => {
    const slices = [slice(0, 0.1), slice(1, 0.06), slice(0, 0.1), slice(1, 0.06)];
    expect(sliceDitherText(slices, [{ column: 'hot_valve', unit: 'fraction' }, { column: 'cold_valve', unit: '' }]))
      .toBe('dither 0.1 fraction on hot_valve, 0.06 on cold_valve');
  });
});

describe('slice caption states', () => {
  it('names each state once where two actions each have a slice there (the screen review read every state twice)', () => {
    const at = (label: string, actionIndex: number): ActionSlice => ({ ...slice(actionIndex, 0.1), label });
    const slices = [at('T at its 10th percentile', 0), at('T at its 10th percentile', 1), at('T at its 50th percentile', 0), at('T at its 50th percentile', 1)];
    expect(sliceStatesText(slices)).toBe('T at its 10th percentile; T at its 50th percentile');
  });
});
