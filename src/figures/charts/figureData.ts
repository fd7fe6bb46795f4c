/**
 * The data the charts draw, declared here so src/figures needs nothing above src/core. The
 * pipeline's results (src/pipeline/estimates.ts, assessment.ts) and the worker's replies have these
 * shapes or wider ones, so they pass in as they are (TypeScript checks the fit structurally).
 */

/** A value surface on a uniform grid. x: nx, y: ny; values and visits: ny×nx row-major (row j at y[j]). */
export interface SurfaceData {
  x: Float64Array;
  y: Float64Array;
  values: Float64Array;
  /** Logged states nearest each grid point; 0 marks a point the logs never came near. */
  visits: Uint32Array;
}

/** One iteration of a fit: the linear fit has a weight change, a network a training loss. */
export interface FitStep {
  iteration: number;
  weightChange: number | null;
  bellmanResidual: number | null;
  loss: number | null;
}

export type FitOutcome = 'converged' | 'maxIterations' | 'diverged';

/** One bar of the policy-value chart. */
export interface PolicyValueRowData {
  name: string;
  policyValue: number;
  standardError: number;
  status: FitOutcome;
}

/** What the policy-value chart needs of an evaluation. */
export interface PolicyValueData {
  policies: readonly PolicyValueRowData[];
  behaviour: { value: number; standardError: number };
  /** The present controller's model evaluated like the candidates (the baseline); null or absent without one. */
  presentController?: { estimate: { policyValue: number; standardError: number } } | null;
  valueSense: 'reward' | 'cost';
}

/** J at a range of one setting, one series per policy (the logged return's marked by `reference`). */
export interface SensitivityData {
  parameter: string;
  label: string;
  settings: number[];
  projectIndex: number;
  /** beyondPossible: true at the crossed points, the fewest that account for every pair of swept J that cannot both be right (drawn as crosses; assessSweepCheck.ts); status: each fit's, read where a point stands for no converged fit (unconvergedPointsSentence). */
  series: { name: string; values: (number | null)[]; status?: string[]; reference?: boolean; beyondPossible?: boolean[] }[];
  rankingStable: boolean;
  /** Settings the ranking verdict leaves out because a J there is crossed (pipeline/sweepRanking.ts). */
  leftOut?: number[];
  /** Where the ranking differs from the project's setting: the setting's index and the pairs [ahead, behind] there that stand the other way round at the project's (pipeline/sweepRanking.ts); absent when stable or in results saved before. */
  rankingChanges?: { at: number; swapped: [string, string][] }[];
}

/** The worker's slice of Q(s, ·) along one action at one state. Arrays: n, ascending actions. */
export interface SliceData {
  actions: Float64Array;
  actionValues: Float64Array;
  density: Float64Array;
  nodes: { points: Float64Array; weights: Float64Array };
  state: number[];
  policyName: string;
}

/** How far the logs speak for a retune-map point: null supported, else the level its shift reaches. */
export type MapSupport = null | 'caution' | 'serious' | 'unknown';

/** What the retune-map figure needs of a map (src/pipeline/retuneMaps.ts has this shape or a wider one). */
export interface RetuneMapData {
  /**
   * One or two axes: the name in the trade's words with the unit, the grid values and the unit as data
   * (figures/parts/tuningAxis.ts shows a time in minutes or hours by it; absent in maps saved before it was kept).
   */
  axes: readonly { label: string; values: readonly number[]; unit?: string }[];
  /** Row-major over the axes (the last axis fastest); value in the project's sense, null without a solution. */
  points: readonly { coordinates: readonly number[]; value: number | null; interval: readonly [number, number] | null; status: string; support: MapSupport }[];
  best: { index: number; value: number } | null;
  presentController: number | null;
  /** The points' intervals' level (0.9 for 90 %); absent without intervals or in results saved before it was kept. */
  level?: number;
}
