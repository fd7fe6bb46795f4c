/**
 * Open one of the sample projects in the app under test: copy its CSV and project file into the
 * harness's work folder, script the Open dialog to answer with it, and wait for the import summary.
 */
import { copyFile } from 'node:fs/promises';
import { join, resolve } from 'node:path';
import type { LaunchedApp } from './launch';
import { steadyClick } from './steadyActions';

export async function openSample(app: LaunchedApp, sample: string): Promise<string> {
  const { harness } = app, folder = resolve(__dirname, '../../../sample-projects', sample);
  const projectPath = join(harness.workFolder, `${sample}.spcritic`);
  await copyFile(join(folder, `${sample}.csv`), join(harness.workFolder, `${sample}.csv`));
  await copyFile(join(folder, `${sample}.spcritic`), projectPath);
  await openProjectFile(app, projectPath);
  return projectPath;
}

/** Open a project file already written to disk through the scripted Open dialog, and wait for the import summary. */
export async function openProjectFile(app: LaunchedApp, projectPath: string): Promise<void> {
  app.harness.dialogs.nextOpenProject = projectPath;
  await steadyClick(app.page.getByTestId('open-project'));
  await app.page.getByTestId('import-summary').waitFor({ timeout: 60_000 });
}
