/**
 * Where a clipped policy puts probability exactly on an actuator bound. With clipping, the action
 * law is censored: P(a = lo) = Φ((lo − μ)/σ) and P(a = hi) = 1 − Φ((hi − μ)/σ) (Johnson, Kotz &
 * Balakrishnan, Vol. 1, §10.1), and the bounded-normal quadrature carries exactly those masses as
 * nodes at the bounds (core/quadrature/boundedNormal.ts). So the masses are read off the nodes.
 */
export interface SliceBounds {
  readonly lo: number;
  readonly hi: number;
  readonly mode: 'clip' | 'truncate';
}

export interface PointMass {
  readonly action: number;
  readonly probability: number;
  readonly side: 'lower' | 'upper';
}

export function pointMassesAtBounds(nodes: { points: Float64Array; weights: Float64Array }, bounds: SliceBounds | undefined): PointMass[] {
  if (!bounds || bounds.mode !== 'clip') return [];
  const masses: PointMass[] = [];
  for (const [side, at] of [['lower', bounds.lo], ['upper', bounds.hi]] as const) {
    if (!Number.isFinite(at)) continue;
    let probability = 0;
    for (let j = 0; j < nodes.points.length; j++) if (nodes.points[j] === at) probability += nodes.weights[j];
    if (probability > 0) masses.push({ action: at, probability, side });
  }
  return masses;
}
