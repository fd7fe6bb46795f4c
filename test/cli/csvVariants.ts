/**
 * A sample project run by the command line with its `data.csv` settings changed: the sample's CSV is
 * copied once into a fresh folder, and each variant is written there as its own project file.
 */
import { copyFile, mkdtemp, readFile, rm, writeFile } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import { join, resolve } from 'node:path';
import { runCli } from '../../src/cli/run';
import { recordingTerminal } from '../../src/cli/terminal';

export interface CsvVariants {
  /** `evaluate` on the sample with `csv` merged into its data.csv; extra arguments after the path (e.g. `--json`). */
  evaluate(name: string, csv: Record<string, unknown>, args?: string[]): Promise<{ code: number; stdout: string; stderr: string }>;
  remove(): Promise<void>;
}

export async function csvVariants(sample: string): Promise<CsvVariants> {
  const folder = resolve(__dirname, '../../sample-projects', sample);
  const root = await mkdtemp(join(tmpdir(), `spc-${sample}-`));
  await copyFile(join(folder, `${sample}.csv`), join(root, `${sample}.csv`));
  const project = JSON.parse(await readFile(join(folder, `${sample}.spcritic`), 'utf8'));
  return {
    async evaluate(name, csv, args = []) {
      const path = join(root, `${name}.spcritic`);
      await writeFile(path, JSON.stringify({ ...project, data: { ...project.data, csv: { ...project.data.csv, ...csv } } }));
      const terminal = recordingTerminal();
      const code = await runCli(['evaluate', path, ...args], terminal);
      return { code, stdout: terminal.stdout, stderr: terminal.stderr };
    },
    remove: () => rm(root, { recursive: true, force: true }),
  };
}
