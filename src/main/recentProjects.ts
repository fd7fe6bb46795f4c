/**
 * The recent-projects list: most recent first, at most ten, no duplicates, kept as JSON in the
 * app's state folder. A state file that cannot be read as such a list is reported, set aside as
 * `<name>.unreadable` (so nothing is thrown away), and replaced by an empty list; it never stops the
 * app from starting.
 */
import { join } from 'node:path';
import { z } from 'zod';
import type { FileStore } from './fileStore';
import type { FileSystem } from './fileSystem';
import { errorCode } from './fileErrors';
import { samePath, type PathFlavour } from './pathIdentity';

export const RECENT_PROJECTS_MAX = 10;
export const RECENT_PROJECTS_FILE = 'recent-projects.json';

const recentFileSchema = z.object({
  recentProjects: z.array(z.string().min(1)),
});

/** Pure: `path` moved (or added) to the front, duplicates removed, capped at `max`. */
export function withRecent(list: readonly string[], path: string, flavour: PathFlavour, max = RECENT_PROJECTS_MAX): string[] {
  return [path, ...list.filter((p) => !samePath(p, path, flavour))].slice(0, max);
}

export interface RecentProjects {
  list(): Promise<string[]>;
  add(path: string): Promise<string[]>;
  includes(path: string): Promise<boolean>;
}

export interface RecentProjectsOptions {
  fs: FileSystem;
  store: FileStore;
  stateFolder: string;
  flavour: PathFlavour;
  /** Told (once per problem) when the state file had to be replaced. */
  report: (message: string) => void;
  onChange?: (list: readonly string[]) => void;
}

export function createRecentProjects(options: RecentProjectsOptions): RecentProjects {
  const file = join(options.stateFolder, RECENT_PROJECTS_FILE);
  let cached: string[] | null = null;

  async function load(): Promise<string[]> {
    if (cached) return cached;
    let text: string;
    try {
      text = new TextDecoder().decode(await options.fs.readFile(file));
    } catch (e) {
      if (errorCode(e) !== 'ENOENT') options.report(`The recent-projects list "${file}" could not be read (${errorCode(e) ?? 'error'}); starting with an empty list.`);
      return (cached = []);
    }
    const parsed = parseRecentFile(text);
    if (parsed) return (cached = parsed.map(String).slice(0, RECENT_PROJECTS_MAX));
    const aside = `${file}.unreadable`;
    await options.fs.rename(file, aside).catch(() => undefined);
    options.report(`The recent-projects list "${file}" was not a valid list; it was kept as "${aside}" and replaced by an empty list.`);
    return (cached = []);
  }

  async function add(path: string): Promise<string[]> {
    const next = withRecent(await load(), path, options.flavour);
    await options.fs.makeFolder(options.stateFolder);
    await options.store.writeAtomic(file, `${JSON.stringify({ recentProjects: next }, null, 2)}\n`, { backup: false });
    cached = next;
    options.onChange?.(next);
    return next;
  }

  return {
    list: async () => [...(await load())],
    add,
    includes: async (path) => (await load()).some((p) => samePath(p, path, options.flavour)),
  };
}

function parseRecentFile(text: string): string[] | null {
  try {
    const parsed = recentFileSchema.safeParse(JSON.parse(text));
    return parsed.success ? parsed.data.recentProjects : null;
  } catch {
    return null;
  }
}
