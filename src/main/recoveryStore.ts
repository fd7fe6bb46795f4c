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
import { MAX_PROJECT_BYTES } from '../host/regularFile';
import { errorCode } from './fileErrors';
import type { FileStore } from './fileStore';
import type { FileSystem } from './fileSystem';

const RECOVERY_FORMAT = 'setpoint-critic-recovery';

/**
 * What the main process had allowed for this work when it wrote the copy (never the renderer's
 * say): the data files readable for it, and the fingerprint of the project file as this app last
 * read or wrote it, so a restore grants no more than the crashed session had and a later save can
 * tell whether another program changed the file since.
 */
export interface RecoveryGrants {
  /** Absolute paths. */
  dataPaths: string[];
  projectFileSha256?: string;
}

const recoveryRecordSchema = z.object({
  format: z.literal(RECOVERY_FORMAT),
  projectPath: z.string().min(1).nullable(),
  text: z.string(),
  savedAt: z.string().min(1),
  grants: z.object({ dataPaths: z.array(z.string().min(1)), projectFileSha256: z.string().optional() }).optional(),
});

/** A claimed copy: the offer the renderer sees, and the grants only the main process uses. */
export type RecoveredCopy = RecoveryOffer & { grants?: RecoveryGrants };

export interface RecoveryStore {
  write(slot: string, text: string, projectPath: string | null, savedAt: Date, grants?: RecoveryGrants): Promise<void>;
  /** The newest leftover of an earlier run, moved to `slot`; null when there is none (or `slot` already holds a copy). */
  claimLeftover(slot: string): Promise<RecoveredCopy | null>;
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

/** A copy holds one project's text (JSON-escaped, so up to six bytes a character) and a few fields. */
const MAX_RECOVERY_BYTES = 6 * MAX_PROJECT_BYTES + 4096;

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

  async function write(slot: string, text: string, projectPath: string | null, savedAt: Date, grants?: RecoveryGrants): Promise<void> {
    await fs.makeFolder(folder);
    const record = { format: RECOVERY_FORMAT, projectPath, text, savedAt: savedAt.toISOString(), grants };
    await store.writeAtomic(fileOf(slot), JSON.stringify(record), { backup: false });
  }

  async function readRecord(name: string): Promise<RecoveredCopy | null> {
    const path = join(folder, name);
    try {
      const parsed = recoveryRecordSchema.safeParse(JSON.parse(new TextDecoder().decode(await fs.readFile(path, MAX_RECOVERY_BYTES))));
      if (parsed.success) return { projectPath: parsed.data.projectPath, text: parsed.data.text, savedAt: parsed.data.savedAt, grants: parsed.data.grants };
    } catch (e) {
      if (errorCode(e) === 'ENOENT') return null;
    }
    await fs.rename(path, `${path}.unreadable`).catch(() => undefined);
    options.report(`A recovery copy "${path}" could not be read; it was kept as "${path}.unreadable".`);
    return null;
  }

  async function claimLeftover(slot: string): Promise<RecoveredCopy | null> {
    const own = fileOf(slot);
    const names = await fs.listFolder(folder);
    if (names.includes(`${runId}.${slot}.json`)) return null;
    const leftovers: { name: string; offer: RecoveredCopy }[] = [];
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
