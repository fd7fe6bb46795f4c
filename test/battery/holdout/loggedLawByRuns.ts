/**
 * The logged law over a span of runs, as the broken-log hold-outs' tests read it: ordinary least squares of
 * the logged action on the first state's deviation from a reference (one action, one regressor), over the
 * rows of runs [from, to). Unbiased when the dither is independent of the state (common practice).
 */
import type { TransitionSet } from '../../../src/core/transitions';

export function loggedLawByRuns(data: TransitionSet, from: number, to: number, reference: number) {
  const ds = data.stateDim;
  let n = 0, sx = 0, sy = 0, sxx = 0, sxy = 0, syy = 0;
  for (let i = 0; i < data.count; i++) {
    if (data.episode[i] < from || data.episode[i] >= to) continue;
    const x = data.states[ds * i] - reference, y = data.actions[i];
    n++; sx += x; sy += y; sxx += x * x; sxy += x * y; syy += y * y;
  }
  const cxx = sxx / n - (sx / n) ** 2, cxy = sxy / n - (sx / n) * (sy / n), cyy = syy / n - (sy / n) ** 2;
  const slope = cxy / cxx;
  return { slope, intercept: sy / n - slope * (sx / n), residualSd: Math.sqrt(cyy - slope * cxy), meanState: sx / n + reference };
}
