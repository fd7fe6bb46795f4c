/**
 * A sample project (sample-projects/<name>/<name>.spcritic) opened, planned and fitted as a host does,
 * with its assessment settings: for tests that drive a pipeline stage directly. The run is the
 * caller's to dispose.
 */
import { readFile } from 'node:fs/promises';
import { join } from 'node:path';
import { assessmentSettingsFor, type AssessmentSettings } from '../../src/pipeline/assessSettings';
import { openProject, type OpenedProject } from '../../src/pipeline/openProject';
import { startRun, type ProjectRun } from '../../src/pipeline/projectRun';

export async function sampleRun(sample: string): Promise<{ opened: OpenedProject; run: ProjectRun; settings: AssessmentSettings }> {
  const folder = join(__dirname, '..', '..', 'sample-projects', sample);
  const opened = await openProject(await readFile(join(folder, `${sample}.spcritic`), 'utf8'), `${sample}.spcritic`, async (p) => new Uint8Array(await readFile(join(folder, p))));
  if (!opened.ok) throw new Error(opened.problems.map((p) => p.message).join('\n'));
  const run = await startRun(opened.value.project, opened.value.dataset), settings = assessmentSettingsFor(opened.value.project);
  if (!run.ok) throw new Error(run.problems.map((p) => p.message).join('\n'));
  if (!settings.ok) throw new Error(settings.problems.map((p) => p.message).join('\n'));
  return { opened: opened.value, run: run.value, settings: settings.value };
}
