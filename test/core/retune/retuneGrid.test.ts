/**
 * The retune grid reuses the policy-free sums and forms ψ by moments; each point must still be the
 * same linear FQE that fitLinearFqe runs for that candidate alone (its J to rounding), and its
 * per-episode sums the ones the bootstrap forms (episodeBellmanSums.ts). Data: the invented PI
 * loop of test/battery/piLoop.ts, read through the project and the import.
 */
import { describe, expect, it } from 'vitest';
import { createActionQuadrature } from '../../../src/core/actionQuadrature';
import { episodeBellmanSums, resampleBellmanStatistics } from '../../../src/core/bootstrap/episodeBellmanSums';
import type { BellmanStatistics } from '../../../src/core/fqe/bellmanStatistics';
import { createFeatureMap, type FeatureMap } from '../../../src/core/features/featureMap';
import { polynomialFeatureSpec } from '../../../src/core/features/polynomialFeatures';
import { radialBasisGridSpec } from '../../../src/core/features/radialBasisFeatures';
import { fitStateActionStandardiser } from '../../../src/core/features/standardiser';
import { fitLinearFqe } from '../../../src/core/fqe/linearFqe';
import { retuneGrid, type RetunePointMaterial } from '../../../src/core/retune/retuneGrid';
import { axisValues, gridPoints } from '../../../src/core/retune/retuneAxes';
import { candidatePolicy } from '../../../src/pipeline/candidatePolicy';
import { piLoopCsv, PI_LOOP_BEHAVIOUR } from '../../battery/piLoop';
import { piLoopData, piLoopProject } from '../../battery/piProject';

type Limits = 'none' | 'clip' | 'rate';
const candidate = (proportionalGain: number, integralTimeSeconds: number, limits: Limits) => ({
  name: `Kc ${proportionalGain}, Ti ${integralTimeSeconds}`,
  form: { kind: 'pi', loops: [{ measurement: 'temp_c', setpoint: 50, bias: 50, proportionalGain, integralTimeSeconds, integralState: 'temp_integral', action: 'reverse' }] },
  dither: [1],
  ...(limits === 'clip' ? { bounds: { lo: [30], hi: [70], mode: 'clip' } } : {}),
  ...(limits === 'rate' ? { bounds: { lo: [0], hi: [100], mode: 'clip' }, rateLimit: { maxStep: [2.5], previousAction: ['heater_prev'] } } : {}),
});

function setting(rate: Limits) {
  const grid = gridPoints([{ from: 2, to: 5, count: 3, spacing: 'linear' }, { from: 60, to: 240, count: 2, spacing: 'logarithmic' }]);
  const project = piLoopProject(grid.map(([kc, ti]) => candidate(kc, ti, rate)), true);
  const data = piLoopData(project, piLoopCsv(80, 41, 5, { ...PI_LOOP_BEHAVIOUR, dither: 3, maxStep: 2.5, limits: [0, 100] }));
  return { project, data, policies: project.candidates.map((c) => candidatePolicy(c, data)) };
}

/** Largest gap over the blocks of two sets of statistics. */
function statisticsGap(a: BellmanStatistics, b: BellmanStatistics): number {
  return Math.max(largestGap(a.gram, b.gram), largestGap(a.crossNext, b.crossNext), largestGap(a.featureReward, b.featureReward), largestGap([a.rewardSquare], [b.rewardSquare]));
}

/** Largest |a − b| relative to 1 + |b|. */
function largestGap(a: ArrayLike<number>, b: ArrayLike<number>): number {
  let gap = 0;
  for (let j = 0; j < b.length; j++) gap = Math.max(gap, Math.abs(a[j] - b[j]) / (1 + Math.abs(b[j])));
  return gap;
}

const options = { discount: 0.95, ridge: 1e-9, quadratureNodes: 10, tolerance: 1e-12, maxIterations: 5000 };

describe('retune grid', () => {
  it('spaces axes linearly or logarithmically, row-major over two axes', () => {
    expect(axisValues({ from: 60, to: 240, count: 3, spacing: 'logarithmic' }).map((v) => +v.toFixed(9))).toEqual([60, 120, 240]);
    expect(gridPoints([{ from: 1, to: 2, count: 2, spacing: 'linear' }, { from: 0, to: 1, count: 2, spacing: 'linear' }])).toEqual([[1, 0], [1, 1], [2, 0], [2, 1]]);
  });

  it.each(['none', 'clip', 'rate'] as Limits[])('gives each point the J of a fit of that candidate alone (limits: %s)', (rate) => {
    const { data, policies } = setting(rate);
    const standardiser = fitStateActionStandardiser(data).spec;
    const maps: [string, FeatureMap][] = [
      ['polynomial (moments)', createFeatureMap(polynomialFeatureSpec(standardiser, 2))],
      ['radial basis (quadrature)', createFeatureMap(radialBasisGridSpec(standardiser, { pointsPerDimension: 3 }))],
    ];
    for (const [, features] of maps) {
      const materials: RetunePointMaterial[] = [];
      const result = retuneGrid({ data, features, policies, ...options, perEpisode: true, onPoint: (m) => materials.push(m) });
      expect(result.points).toHaveLength(6);
      for (const p of [0, 5]) {
        const alone = fitLinearFqe({ data, policy: policies[p], features, ...options });
        const reference = (alone.status === 'diverged' ? alone.fixedPoint : alone.iterative)!.policyValue.value;
        const weights = new Uint32Array(data.episodeCount).fill(1).map((_, k) => 1 + (k % 3));
        const perEpisode = episodeBellmanSums(data, features, createActionQuadrature(policies[p], options.quadratureNodes));
        const gaps = {
          value: Math.abs(result.points[p].policyValue! - reference) / Math.abs(reference),
          cross: largestGap(materials[p].statistics.crossNext, alone.statistics.crossNext),
          // Compared through the statistics they give (the two packings may keep different halves of the symmetric blocks).
          episodes: statisticsGap(resampleBellmanStatistics(materials[p].episodeSums!, weights), resampleBellmanStatistics(perEpisode, weights)),
        };
        // The sums agree to rounding; J to a few parts in 10⁷ where a radial-basis fixed point
        // (condition number ~10⁶) amplifies that rounding.
        expect(gaps.cross).toBeLessThan(1e-11);
        expect(gaps.episodes).toBeLessThan(1e-11);
        expect(gaps.value).toBeLessThan(1e-6);
      }
      // Polynomial features: the closed-form route, unless a rate limit's band is within reach on most rows.
      expect(result.points[0].route).toBe(features.toSpec().kind !== 'polynomial' ? 'quadrature' : rate === 'rate' ? 'moments' : 'closedForm');
      if (features.toSpec().kind === 'polynomial') {
        const shares = result.points.map((point) => point.correctedRows / data.count);
        // none: no limit to correct; clip: only rows near the limits; rate: per-row route, nothing corrected.
        if (rate === 'none') expect(Math.max(...shares)).toBe(0);
        if (rate === 'clip') expect(Math.max(...shares) > 0 && Math.max(...shares) <= 0.25).toBe(true);
        if (rate === 'rate') expect(Math.max(...shares)).toBe(0);
      }
    }
  });

  it('gives a scheduled candidate (moments per row) the J of a fit of it alone', () => {
    const { project, data } = setting('none');
    const scheduled = { ...project.candidates[0], form: { kind: 'schedule' as const, loops: [{ input: 'temp_c', breakpoints: [45, 50, 55], values: [70, 50, 35], feedback: { measurement: 'temp_c', setpoint: 50, proportionalGain: 1, integralTimeSeconds: 200, integralState: 'temp_integral', action: 'reverse' as const } }] }, bounds: { lo: [0], hi: [100], mode: 'clip' as const } };
    const policy = candidatePolicy(scheduled, data);
    const features = createFeatureMap(polynomialFeatureSpec(fitStateActionStandardiser(data).spec, 2));
    const result = retuneGrid({ data, features, policies: [policy], ...options });
    expect(result.points[0].route).toBe('moments');
    const alone = fitLinearFqe({ data, policy, features, ...options });
    const reference = (alone.status === 'diverged' ? alone.fixedPoint : alone.iterative)!.policyValue.value;
    expect(Math.abs(result.points[0].policyValue! - reference) / Math.abs(reference)).toBeLessThan(1e-6);
  });

  it('reports progress and stops when cancelled', () => {
    const { data, policies } = setting('none');
    const features = createFeatureMap(polynomialFeatureSpec(fitStateActionStandardiser(data).spec, 2));
    const seen: number[] = [];
    let stop = false;
    expect(() => retuneGrid({
      data, features, policies, ...options, cancel: () => stop,
      onProgress: (p) => { seen.push(p.pointsDone); if (p.pointsDone === 2) stop = true; },
    })).toThrow(/cancel/i);
    expect(seen).toEqual([0, 1, 2]);
  });
});
