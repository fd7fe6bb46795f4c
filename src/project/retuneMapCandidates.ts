/**
 * A retune map as candidates: the map's candidate with its swept numbers set at every grid point,
 * row-major over the axes (src/core/retune/retuneAxes.ts). The pipeline compiles each to a policy
 * (pipeline/candidatePolicy.ts) and hands them to core's retuneGrid.
 */
import { axisValues, gridPoints } from '../core/retune/retuneAxes';
import { withCandidateParameter } from './candidateParameters';
import type { CandidateSpec, ProjectDocument, RetuneMapSpec } from './schema';

export interface RetuneMapCandidates {
  readonly base: CandidateSpec;
  /** The axis values, one array per axis. */
  readonly coordinates: number[][];
  /** Each grid point's axis values, row-major (core's gridPoints). */
  readonly points: number[][];
  /** One candidate per grid point, row-major. */
  readonly candidates: CandidateSpec[];
}

export function retuneMapCandidates(doc: ProjectDocument, map: RetuneMapSpec): RetuneMapCandidates {
  const base = doc.candidates.find((c) => c.name === map.candidate);
  if (!base) throw new RangeError(`retune map: no candidate named "${map.candidate}"`);
  const points = gridPoints(map.axes);
  const candidates = points.map((point, p) => point.reduce(
    (c, value, a) => withCandidateParameter(c, map.axes[a].parameter, value),
    { ...base, name: `${base.name} [${p + 1}]` },
  ));
  return { base, coordinates: map.axes.map(axisValues), points, candidates };
}
