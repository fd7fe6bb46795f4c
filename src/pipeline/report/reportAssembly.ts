/**
 * The report's input from what a host has after a run: the evaluation and the assessment's result
 * (which may have failed — the report then says why and still shows the rest). One builder for the
 * CLI's `report` command and the app's "Write report…", so both write the same document.
 */
import type { Result } from '../../core/result';
import type { DatasetSummary } from '../../data/importDataset';
import type { ProjectDocument } from '../../project/schema';
import type { Assessment } from '../assessment';
import type { Evaluation } from '../estimates';
import type { RetuneMapResult } from '../retuneMaps';
import type { ReportInput } from './reportInput';

export interface ReportParts {
  project: ProjectDocument;
  /** The project file's name as the user knows it (e.g. "tank-levels.spcritic"). */
  projectFile: string;
  evaluation: Evaluation;
  assessment: Result<Assessment>;
  /** The retune maps' result; absent where the host computed none. */
  retuneMaps?: Result<RetuneMapResult[]>;
  data: { summary: DatasetSummary; episodeReport: string[] };
  generatedAt: Date;
}

export function reportInputFrom(parts: ReportParts): ReportInput {
  const { assessment } = parts;
  return {
    project: parts.project,
    projectFile: parts.projectFile,
    evaluation: parts.evaluation,
    assessment: assessment.ok ? assessment.value : null,
    assessmentProblems: assessment.ok ? [] : assessment.problems.map((p) => p.message),
    retuneMaps: parts.retuneMaps?.ok ? parts.retuneMaps.value : [],
    retuneMapProblems: parts.retuneMaps && !parts.retuneMaps.ok ? parts.retuneMaps.problems.map((p) => p.message) : [],
    data: { summary: parts.data.summary, episodeReport: parts.data.episodeReport },
    generatedAt: parts.generatedAt.toISOString(),
  };
}
