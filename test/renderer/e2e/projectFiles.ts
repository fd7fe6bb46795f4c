/**
 * Project files written by the end-to-end tests themselves (not through the app), so a test can
 * open a prepared project: the tank-levels sample's column roles with chosen candidates and
 * estimator settings, its data path relative to where the project is written.
 */
import { createHash } from 'node:crypto';
import { readFile, writeFile } from 'node:fs/promises';
import { dirname, relative } from 'node:path';

export interface PreparedProject {
  projectPath: string;
  dataPath: string;
  /** Approximator overrides (e.g. a tolerance no fit reaches, so a run lasts). */
  approximator?: Record<string, unknown>;
  /** Write the data file's SHA-256 and row count, as a save does. */
  fingerprint?: boolean;
  version?: number;
}

export async function writeTankProject(p: PreparedProject): Promise<string> {
  const document: Record<string, unknown> = {
    format: 'setpoint-critic-project',
    version: p.version ?? 1,
    name: 'Prepared tank project',
    description: '',
    data: { path: relative(dirname(p.projectPath), p.dataPath).replace(/\\/g, '/'), csv: { delimiter: 'auto', decimalMark: 'auto', badRows: 'stop' } },
    columns: {
      states: [{ column: 'level_upper_m', unit: 'm' }, { column: 'level_lower_m', unit: 'm' }],
      actions: [{ column: 'inflow_valve_pct', unit: '%' }],
      reward: { kind: 'column', column: 'cost', sense: 'cost' },
      nextState: { kind: 'nextRow' },
      episode: { kind: 'column', column: 'run' },
    },
    discount: 0.95,
    candidates: [
      { name: 'Tuned', description: '', offset: [189], gain: [[-60, -90]], std: [1.5] },
      { name: 'Trim error', description: '', offset: [190.5], gain: [[-60, -90]], std: [1.5] },
    ],
    approximator: { kind: 'linear', features: { kind: 'polynomial', degree: 2 }, ridge: 1e-9, tolerance: 1e-10, maxIterations: 5000, ...p.approximator },
    quadratureNodes: 10,
    seed: 1,
    startStates: { kind: 'episodeStarts' },
  };
  if (p.fingerprint) {
    const bytes = await readFile(p.dataPath);
    // SHA-256 from node:crypto, independent of the app's own hashing (@noble/hashes).
    const rows = bytes.toString('utf8').trimEnd().split('\n').length - 1;
    (document.data as Record<string, unknown>).sha256 = createHash('sha256').update(bytes).digest('hex');
    (document.data as Record<string, unknown>).rowCount = rows;
  }
  const text = `${JSON.stringify(document, null, 2)}\n`;
  await writeFile(p.projectPath, text);
  return text;
}
