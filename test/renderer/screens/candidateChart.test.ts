/**
 * What the candidate chart draws: μ(s) = offset + gain·s along one axis with the other state at its
 * mean, checked at the two ends by hand arithmetic, and new candidates that take the logged mean,
 * the logged spread or the behaviour model's rounded coefficients.
 */
import { describe, expect, it } from 'vitest';
import { candidateActionsProps, loggedCurve } from '../../../src/renderer/src/screens/candidates/meanActionLines';
import { meanActionCurve } from '../../../src/figures/parts/meanActionCurve';
import { normalDensity } from '../../../src/core/normalDistribution';
import { candidateFromBehaviour, plainCandidate, roundSignificant, uniqueName } from '../../../src/renderer/src/screens/candidates/candidateDrafts';
import { newProjectDocument } from '../../../src/renderer/src/document/newProject';
import type { ProjectDocument } from '../../../src/project/schema';

function doc(): ProjectDocument {
  const d = newProjectDocument();
  return {
    ...d,
    columns: { ...d.columns, states: [{ column: 'u', unit: 'm' }, { column: 'l', unit: 'm' }], actions: [{ column: 'v', unit: '%' }] },
    candidates: [{ name: 'Candidate 1', description: '', form: { kind: 'affine', offset: [0], gain: [[0, 0]] }, dither: [1] }],
  };
}

describe('candidate chart lines', () => {
  it('draws μ along the axis with the other state at its mean', () => {
    // 189 − 60·1.0 − 90·0.8 = 57; 189 − 60·1.4 − 90·0.8 = 33 (hand arithmetic).
    const line = meanActionCurve({ offset: [189], gain: [[-60, -90]], std: [2] }, 0, 0, [1.0, 1.4], [1.2, 0.8], 3)!;
    expect(Array.from(line.x)).toEqual([1.0, 1.2, 1.4]);
    expect(line.y[0]).toBeCloseTo(57, 12);
    expect(line.y[2]).toBeCloseTo(33, 12);
    expect(meanActionCurve({ offset: [189], gain: [[-60]], std: [2] }, 0, 0, [1, 2], [1.2, 0.8])).toBeNull();
  });

  it('keeps a clipped candidate inside its 0–100 % limits: at μ = 100 % the mean is 100 − σφ(0) (Tobit mean, Greene §19.3)', () => {
    const candidate = { offset: [0], gain: [[100]], std: [10], bounds: { lo: [0], hi: [100], mode: 'clip' as const } };
    const line = meanActionCurve(candidate, 0, 0, [0, 1.5], [0], 4)!; // μ = 0, 50, 100, 150 %
    expect(line.y[0]).toBeCloseTo(10 * normalDensity(0), 10);
    expect(line.y[1]).toBeCloseTo(50, 8);
    expect(line.y[2]).toBeCloseTo(100 - 10 * normalDensity(0), 10);
    expect(Math.max(...line.y)).toBeLessThanOrEqual(100);
  });

  it('draws the present controller’s model within the limits the log shows, as the model clips there (it ran past 100 % on the heating-loop sample)', () => {
    // Fitted μ = 300 − 100·u: 200 % at u = 1 unclipped; the log shows the valve at 100 %, so the model's mean stays at or below 100 (Tobit mean, as above).
    const model = { offset: [300], gain: [[-100, 0]], std: [10], bounds: { lo: [-Infinity], hi: [100], mode: 'clip' as const } };
    const imported = {
      stateRanges: [[1, 3], [0, 1]], stateMeans: [2, 0.5], stateNames: ['u', 'l'], actionNames: ['v'],
      sample: { count: 0, states: new Float64Array(0), actions: new Float64Array(0) },
      behaviour: { ok: true, model },
    } as never;
    const props = candidateActionsProps(doc(), imported, 0, 0, 'light' as never);
    expect(Math.max(...props.present!.y)).toBeLessThanOrEqual(100);
    expect(props.present!.y[0]).toBeCloseTo(100, 6); // μ = 200 %, ten dithers above the limit
    expect(props.present!.y.at(-1)).toBeCloseTo(0, 6); // μ = 0 %: no lower limit seen, the plain mean
    // The note above the plot on two lines, not one line Chart.js squeezes to the panel's width.
    expect(props.subtitle).toEqual(['mean action', 'the other states held at their logged means']);
  });

  it('pairs each logged state with its action', () => {
    const sample = { count: 2, states: Float64Array.from([1, 2, 3, 4]), actions: Float64Array.from([10, 20]) };
    const logged = loggedCurve(sample, 2, 1, 1, 0);
    expect(Array.from(logged.x)).toEqual([2, 4]);
    expect(Array.from(logged.y)).toEqual([10, 20]);
  });
});

describe('new candidates', () => {
  it('names them without clashes', () => {
    expect(uniqueName(doc(), 'Candidate 1')).toBe('Candidate 1 2');
    expect(plainCandidate(doc(), null)).toMatchObject({ name: 'Candidate 2', form: { kind: 'affine', offset: [0], gain: [[0, 0]] }, dither: [1] });
  });

  it('copies the behaviour model to four significant digits', () => {
    const model = { offset: [97.2634], gain: [[-29.1812, -21.5678]], std: [3.98012] } as never;
    expect(candidateFromBehaviour(doc(), model)).toMatchObject({ form: { offset: [97.26], gain: [[-29.18, -21.57]] }, dither: [3.98] });
    expect(roundSignificant(0.000123456)).toBe(0.0001235);
    // With the limits the log shows, so the candidate is the policy the model was fitted as (one-sided: null for no limit).
    const limited = { offset: [97.2634], gain: [[-29.1812, -21.5678]], std: [3.98012], bounds: { lo: [0], hi: [Infinity], mode: 'clip' } } as never;
    expect(candidateFromBehaviour(doc(), limited)).toMatchObject({ bounds: { lo: [0], hi: [null], mode: 'clip' } });
    expect(candidateFromBehaviour(doc(), model)).not.toHaveProperty('bounds');
  });
});
