/**
 * The evaluation worker: everything heavy — reading the CSV, fitting the behaviour model, fitting
 * Q for each candidate, value surfaces and slices — runs here, off the UI thread. Each request gets
 * exactly one result message; a running evaluation also sends progress messages first.
 * Typed errors from the engine become problems; anything else is reported as an internal error
 * with its message (never a stack trace).
 */
/// <reference lib="webworker" />
import { success, type Result } from '../../../core/result';
import type { WorkerCall, WorkerReply, WorkerRequest, WorkerResult } from '../../../shared/workerMessages';
import { inspectData } from './dataInspection';
import { dataImportSummary } from './dataImportSummary';
import { runAssessment } from './assessmentRun';
import { runEvaluation } from './evaluationRun';
import { runRetuneMaps } from './retuneMapRun';
import { sliceFromFit, surfaceFromFit } from './fitQueries';
import { createWorkerMemory } from './workerMemory';
import { problemFromError } from './workerProblems';

const scope = self as unknown as DedicatedWorkerGlobalScope;
const memory = createWorkerMemory();

function post(reply: WorkerReply): void {
  scope.postMessage(reply);
}

async function answer(request: WorkerRequest): Promise<Result<unknown>> {
  switch (request.call) {
    case 'setData': {
      const inspection = inspectData(request.bytes, request.fileName, request.csv);
      if (inspection.ok) memory.setData(request.bytes, request.fileName, request.sha256);
      return inspection;
    }
    case 'inspect': {
      const { bytes, fileName } = memory.data();
      return inspectData(bytes, fileName, request.csv);
    }
    case 'importData': {
      const opened = await memory.open(request.project);
      return opened.ok ? success(dataImportSummary(opened.value), opened.warnings) : opened;
    }
    case 'evaluate':
      return runEvaluation(memory, request.project, (progress) => post({ kind: 'progress', id: request.id, progress }));
    case 'surface':
      return success(surfaceFromFit(memory.lastRun(), request.query));
    case 'slice':
      return success(sliceFromFit(memory.lastRun(), request.query));
    case 'assess':
      return runAssessment(memory, request.project, (progress) => post({ kind: 'assessmentProgress', id: request.id, progress }));
    case 'stopImport':
      memory.stopImport();
      return success(null);
    case 'stopAssessment':
      memory.assessmentStop.requested = true;
      return success(null);
    case 'retuneMaps':
      return runRetuneMaps(memory, request.project, request.stopFlag, (progress) => post({ kind: 'retuneMapProgress', id: request.id, progress }));
  }
}

scope.onmessage = (event: MessageEvent<WorkerRequest>) => {
  const request = event.data;
  answer(request)
    .then((result): WorkerResult<WorkerCall> => (result.ok
      ? { kind: 'result', id: request.id, ok: true, value: result.value as never, warnings: result.warnings }
      : { kind: 'result', id: request.id, ok: false, problems: result.problems }))
    .catch((error: unknown): WorkerResult => ({ kind: 'result', id: request.id, ok: false, problems: [problemFromError(error, request.call)] }))
    .then(post);
};
