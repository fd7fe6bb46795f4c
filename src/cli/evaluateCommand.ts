/** `evaluate`: print the evaluation and its assessment of a project, as a table or as JSON. */
import { basename } from 'node:path';
import { describeProblems } from '../core/result';
import { assessmentToJson } from '../pipeline/assessmentJson';
import type { AssessmentOverrides } from '../pipeline/assessSettings';
import { evaluationToJson, importToJson } from '../pipeline/evaluationJson';
import { formatAssessment } from './assessmentFormat';
import { trialJson } from '../pipeline/trialChoice';
import { evaluateProjectFile } from './evaluateProjectFile';
import { formatCautions, formatEvaluation } from './formatEvaluation';
import { formatImport } from './formatImport';
import { formatCandidates } from './formatCandidates';
import { formatRetuneMap } from './retuneMapFormat';
import { CONFIDENCE_LEVEL } from '../core/limits';
import { createTerminalProgress } from './terminalProgress';
import { exitStatusOf } from './exitStatus';
import { processTerminal, type Terminal } from './terminal';
import { truncationMatters } from '../core/loggedReturn';

export async function runEvaluateCommand(projectPath: string, options: { json: boolean; terminal?: Terminal } & AssessmentOverrides): Promise<number> {
  const terminal = options.terminal ?? processTerminal;
  const progress = createTerminalProgress();
  const result = await evaluateProjectFile(projectPath, options, undefined, progress).finally(() => progress.done());
  if (!result.ok) {
    terminal.err(`${result.failure.message}\n`);
    return result.failure.exitCode;
  }
  const { project, imported, evaluation, assessment, retuneMaps } = result.run;
  const level = assessment.ok ? assessment.value.settings.level : CONFIDENCE_LEVEL.default;
  if (options.json) {
    const json = {
      ...evaluationToJson(evaluation), import: importToJson(imported),
      assessment: assessment.ok ? assessmentToJson(assessment.value) : null, assessmentProblems: assessment.ok ? [] : assessment.problems,
      // The answer the text prints after the ranking, as data (pipeline/trialChoice.ts); null without an assessment.
      trial: assessment.ok ? trialJson(assessment.value) : null,
      retuneMaps: retuneMaps.ok ? retuneMaps.value : null, retuneMapProblems: retuneMaps.ok ? [] : retuneMaps.problems,
    };
    terminal.out(`${JSON.stringify(json, null, 2)}\n`);
  } else {
    terminal.out(formatImport(imported, project.data.path));
    terminal.out(formatCandidates(project));
    terminal.out(formatEvaluation(evaluation, basename(projectPath), assessment.ok ? assessment.value : null, project.columns.reward.unit ?? ''));
    terminal.out(assessment.ok ? `\nIntervals, cross-checks and diagnostics\n${formatAssessment(assessment.value, truncationMatters(evaluation.behaviour), project.columns.reward.unit ?? '')}` : `\nIntervals not computed: ${describeProblems(assessment.problems)}\n`);
    if (retuneMaps.ok) retuneMaps.value.forEach((map) => terminal.out(`\n${formatRetuneMap(map, level, project.columns.reward.unit ?? '')}`));
    else terminal.out(`\nRetune maps not computed: ${describeProblems(retuneMaps.problems)}\n`);
    terminal.out(formatCautions(evaluation));
  }
  return exitStatusOf(evaluation);
}
