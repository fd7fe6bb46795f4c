/**
 * The test page's dedicated worker: open the project on the bytes it is sent and assess it with the
 * app's helper (src/renderer/src/worker/helperWorker.ts) lent from `minimumWork`, or with none.
 */
/// <reference lib="webworker" />
import { assessProject } from '../../../src/pipeline/assessProject';
import { assessmentSettingsFor } from '../../../src/pipeline/assessSettings';
import { openProject } from '../../../src/pipeline/openProject';
import { helperWorker } from '../../../src/renderer/src/worker/helperWorker';

const scope = self as unknown as DedicatedWorkerGlobalScope;

scope.onmessage = async (event: MessageEvent<{ projectText: string; csv: Uint8Array; minimumWork: number | null }>) => {
  const { projectText, csv, minimumWork } = event.data;
  const opened = await openProject(projectText, 'project.spcritic', async () => csv);
  if (!opened.ok) return scope.postMessage({ ok: false, json: JSON.stringify(opened.problems) });
  const settings = assessmentSettingsFor(opened.value.project);
  if (!settings.ok) return scope.postMessage({ ok: false, json: JSON.stringify(settings.problems) });
  const helper = minimumWork === null ? undefined : helperWorker(minimumWork);
  const assessed = await assessProject({ project: opened.value.project, dataset: opened.value.dataset, settings: settings.value, helper });
  scope.postMessage(assessed.ok ? { ok: true, json: JSON.stringify(assessed.value) } : { ok: false, json: JSON.stringify(assessed.problems) });
};
