/** Everything the report is built from: the project, its data summary, the evaluation and the assessment. */
import type { DatasetSummary } from '../../data/importDataset';
import type { ProjectDocument } from '../../project/schema';
import type { Assessment } from '../assessment';
import type { Evaluation } from '../estimates';

import type { RetuneMapResult } from '../retuneMaps';
import { valueUnitText } from '../valueUnitWords';
import { valueAxisTitle, type ValueSymbol } from '../../figures/parts/valueAxisTitle';

export interface ReportInput {
  project: ProjectDocument;
  projectFile: string;
  evaluation: Evaluation;
  /** Null when the assessment could not be run; assessmentProblems then says why. */
  assessment: Assessment | null;
  assessmentProblems: string[];
  /** The project's retune maps (empty when it has none); retuneMapProblems says why when they could not be computed. */
  retuneMaps: RetuneMapResult[];
  retuneMapProblems: string[];
  data: { summary: DatasetSummary; episodeReport: string[] };
  /** ISO 8601 time the report was written. */
  generatedAt: string;
}

/** "expected discounted cost (lower is better)" or the reward form. */
export function senseWords(input: ReportInput): { value: string; better: string; short: string } {
  return input.evaluation.valueSense === 'cost'
    ? { value: 'expected discounted cost', better: 'lower is better', short: 'cost' }
    : { value: 'expected discounted reward', better: 'higher is better', short: 'reward' };
}

/** The cost's or reward's own unit from the project ('' when none). */
export function valueUnit(input: ReportInput): string {
  return valueUnitText(input.project.columns.reward.unit);
}

/** Rich-text axis title of V, Q or J: "V^{π}(s), discounted cost (€)". */
export function valueAxisLabel(input: ReportInput, symbol: ValueSymbol): string {
  return valueAxisTitle(symbol, input.evaluation.valueSense, valueUnit(input));
}

/** Figure numbers in order of appearance, per document (no shared state between reports). */
export class FigureCounter {
  private count = 0;
  next(): number {
    return ++this.count;
  }
}
