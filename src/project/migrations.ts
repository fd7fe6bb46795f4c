/**
 * Migrations of the project document from older format versions to the current one.
 *
 * Each step takes the raw JSON object of version v and returns the object of version v + 1. Steps
 * are pure and keep every field a user wrote: a field that has no place in the new version is moved
 * under `carriedOver` rather than dropped.
 */
import { PROJECT_VERSION } from './schema';

export type MigrationStep = (document: Record<string, unknown>) => Record<string, unknown>;

/** MIGRATIONS[v] upgrades a version-v document to version v + 1. Version 1 is the first format. */
export const MIGRATIONS: Readonly<Record<number, MigrationStep>> = {};

export class MigrationError extends Error {
  constructor(message: string) {
    super(message);
    this.name = 'MigrationError';
  }
}

/**
 * Bring a raw document to `targetVersion`. A document from a newer version than this program
 * knows is refused (and must never be overwritten by the caller).
 */
export function migrateDocument(
  raw: Record<string, unknown>,
  steps: Readonly<Record<number, MigrationStep>> = MIGRATIONS,
  targetVersion: number = PROJECT_VERSION,
): { document: Record<string, unknown>; fromVersion: number } {
  const fromVersion = raw.version;
  if (typeof fromVersion !== 'number' || !Number.isInteger(fromVersion) || fromVersion < 1) {
    throw new MigrationError(`version: expected a whole number of at least 1, found ${JSON.stringify(fromVersion)}`);
  }
  if (fromVersion > targetVersion) {
    throw new MigrationError(
      `version: this project was saved by a newer Setpoint Critic (format version ${fromVersion}; this program reads up to ${targetVersion}). Open it with a newer version; it has not been changed.`,
    );
  }
  let document = raw;
  for (let v = fromVersion; v < targetVersion; v++) {
    const step = steps[v];
    if (!step) throw new MigrationError(`version: no migration from format version ${v} to ${v + 1}`);
    document = { ...step(document), version: v + 1 };
  }
  return { document, fromVersion };
}
