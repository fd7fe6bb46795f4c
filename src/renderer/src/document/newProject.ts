/**
 * The document of a project that has just been created: no data file and no column roles yet,
 * the schema's defaults for every estimator setting. It does not pass the project schema until
 * the user has chosen the data, mapped the columns and defined a candidate; projectProblems says
 * what is missing.
 */
import { DEFAULT_POLYNOMIAL_DEGREE } from '../../../core/limits';
import { approximatorSchema, type ApproximatorSettings } from '../../../project/approximatorSchema';
import { PROJECT_FORMAT, PROJECT_VERSION, type ProjectDocument } from '../../../project/schema';

export const UNTITLED = 'Untitled project';

/** A discount of 0.95 per step weighs the next ~20 steps (1/(1 − γ)); a common starting point. */
export const DEFAULT_DISCOUNT = 0.95;

export function defaultApproximator(kind: ApproximatorSettings['kind']): ApproximatorSettings {
  return kind === 'linear'
    ? approximatorSchema.parse({ kind: 'linear', features: { kind: 'polynomial', degree: DEFAULT_POLYNOMIAL_DEGREE } })
    : approximatorSchema.parse({ kind: 'network' });
}

export function newProjectDocument(name: string = UNTITLED): ProjectDocument {
  return {
    format: PROJECT_FORMAT,
    version: PROJECT_VERSION,
    name,
    description: '',
    data: { path: '', csv: { delimiter: 'auto', decimalMark: 'auto', badRows: 'stop' } },
    columns: {
      states: [],
      actions: [],
      reward: { kind: 'column', column: '', sense: 'cost' },
      nextState: { kind: 'nextRow' },
      episode: { kind: 'single' },
    },
    discount: DEFAULT_DISCOUNT,
    candidates: [],
    approximator: defaultApproximator('linear'),
    quadratureNodes: 10,
    seed: 1,
    startStates: { kind: 'episodeStarts' },
  };
}
