/**
 * Where `report --out` may write: never over what the run reads (the project file, its data file —
 * also through another name or a link: the same device and inode is the same file, stat(2)), never
 * into something that is not a regular file (a FIFO would block, a device would take the bytes), and
 * never a name that says it is a project. Each refusal is a usage error (exit 2) naming the path.
 */
import { stat } from 'node:fs/promises';
import type { CliFailure, RunFiles } from './evaluateProjectFile';

interface Identity {
  dev: number;
  ino: number;
  isFile: boolean;
}

async function identity(path: string): Promise<Identity | null> {
  try {
    const s = await stat(path);
    return { dev: s.dev, ino: s.ino, isFile: s.isFile() };
  } catch {
    return null;
  }
}

export async function destinationRefusal(out: string, files: RunFiles): Promise<CliFailure | null> {
  const refuse = (why: string): CliFailure => ({ message: `Not writing the report to ${out}: ${why}. Choose another --out.`, exitCode: 2 });
  const target = await identity(out);
  if (target !== null && !target.isFile) return refuse('it is not a regular file (a folder, a pipe or a device)');
  for (const [path, what] of [[files.projectPath, 'the project file'], [files.dataPath, 'the project’s data file']] as const) {
    const input = target && await identity(path);
    if (target && input && input.dev === target.dev && input.ino === target.ino) return refuse(`it is ${what}, which the report is made from`);
  }
  if (/\.spcritic$/i.test(out)) return refuse('the name is a project file’s (.spcritic)');
  return null;
}
