/**
 * Recovery copies of unsaved work, one per window ("slot"), in `<state folder>/recovery/`, each
 * written atomically like a save. A copy left by an earlier run of the app (a crash, a power cut)
 * is a leftover: on start a window claims the newest one and offers it to the user, who restores
 * or discards it. A clean save or a clean close discards the window's copy.
 *
 * File name `<runId>.<slot>.json`: the run id tells this run's copies from leftovers. A leftover
 * that cannot be read is set aside as `.unreadable` and reported, never deleted.
 */
import { join } from 'node:path';
import { z } from 'zod';
import type { RecoveryOffer } from '../shared/appApi';
import { errorCode } from './fileErrors';
import type { FileStore } from './fileStore';
import type { FileSystem } from './fileSystem';

const RECOVERY_FORMAT = 'setpoint-critic-recovery';

const recoveryRecordSchema = z.object({
  format: z.literal(RECOVERY_FORMAT),
  projectPath: z.string().min(1).nullable(),
  text: z.string(),
  savedAt: z.string().min(1),
});

export interface RecoveryStore {
  write(slot: string, text: string, projectPath: string | null, savedAt: Date): Promise<void>;
  /** The newest leftover of an earlier run, moved to `slot`; null when there is none (or `slot` already holds a copy). */
  claimLeftover(slot: string): Promise<RecoveryOffer | null>;
  discard(slot: string): Promise<void>;
  /** How many copies earlier runs left (so the app can open a window for each). */
  leftoverCount(): Promise<number>;
}

export interface RecoveryStoreOptions {
  fs: FileSystem;
  store: FileStore;
  stateFolder: string;
  /** Unique per run of the app. */
  runId: string;
  report: (message: string) => void;
}

/** Slot names become file names: keep them to safe characters. */
const SAFE_NAME = /^[A-Za-z0-9_-]{1,64}$/;

export function createRecoveryStore(options: RecoveryStoreOptions): RecoveryStore {
  const { fs, store, runId } = options;
  if (!SAFE_NAME.test(runId)) throw new RangeError(`recovery run id: expected 1–64 letters, digits, "-" or "_", found ${JSON.stringify(runId)}`);
  const folder = join(options.stateFolder, 'recovery');
  const fileOf = (slot: string) => {
    if (!SAFE_NAME.test(slot)) throw new RangeError(`recovery slot: expected 1–64 letters, digits, "-" or "_", found ${JSON.stringify(slot)}`);
    return join(folder, `${runId}.${slot}.json`);
  };

  const isLeftover = (name: string) => name.endsWith('.json') && !name.startsWith(`${runId}.`);

  async function write(slot: string, text: string, projectPath: string | null, savedAt: Date): Promise<void> {
    await fs.makeFolder(folder);
    const record = { format: RECOVERY_FORMAT, projectPath, text, savedAt: savedAt.toISOString() };
    await store.writeAtomic(fileOf(slot), JSON.stringify(record), { backup: false });
  }

  async function readRecord(name: string): Promise<RecoveryOffer | null> {
    const path = join(folder, name);
    try {
      const parsed = recoveryRecordSchema.safeParse(JSON.parse(new TextDecoder().decode(await fs.readFile(path))));
      if (parsed.success) return { projectPath: parsed.data.projectPath, text: parsed.data.text, savedAt: parsed.data.savedAt };
    } catch (e) {
      if (errorCode(e) === 'ENOENT') return null;
    }
    await fs.rename(path, `${path}.unreadable`).catch(() => undefined);
    options.report(`A recovery copy "${path}" could not be read; it was kept as "${path}.unreadable".`);
    return null;
  }

  async function claimLeftover(slot: string): Promise<RecoveryOffer | null> {
    const own = fileOf(slot);
    const names = await fs.listFolder(folder);
    if (names.includes(`${runId}.${slot}.json`)) return null;
    const leftovers: { name: string; offer: RecoveryOffer }[] = [];
    for (const name of names.filter(isLeftover)) {
      const offer = await readRecord(name);
      if (offer) leftovers.push({ name, offer });
    }
    leftovers.sort((a, b) => b.offer.savedAt.localeCompare(a.offer.savedAt));
    const newest = leftovers[0];
    if (!newest) return null;
    await fs.rename(join(folder, newest.name), own);
    return newest.offer;
  }

  async function discard(slot: string): Promise<void> {
    await fs.unlink(fileOf(slot)).catch((e: unknown) => {
      if (errorCode(e) !== 'ENOENT') throw e;
    });
  }

  async function leftoverCount(): Promise<number> {
    return (await fs.listFolder(folder)).filter(isLeftover).length;
  }

  return { write, claimLeftover, discard, leftoverCount };
}
