/**
 * What an evaluation's numbers depend on, as one string: the data's content (its fingerprint) and
 * everything in the document except its notes — the name, descriptions, the reasons given for time
 * windows and runs left out, the user's free-form `notes` and the fields carried over from an older
 * format (never read) —, the surface axes (redrawn without a rerun), the kept results and where the
 * data file lives or what was last saved about it. Two documents with the same key give the same numbers.
 */
import { sha256 } from '@noble/hashes/sha2.js';
import { bytesToHex } from '@noble/hashes/utils.js';
import { declaredActionBounds } from '../pipeline/plan/declaredBounds';
import type { CsvSettings, ProjectDocument } from '../project/schema';
import { DEFAULT_POLYNOMIAL_PART } from '../core/fqe/polynomialPartSetting';

export function runKey(doc: ProjectDocument, dataFingerprint: string): string {
  const { notes: _notes, carriedOver: _carried, ...kept } = doc;
  return keyOf(kept, csvAsData(doc.data.csv), dataFingerprint);
}

/**
 * The run key as versions before this one wrote it, with the reasons, notes and carried-over fields
 * in it: the fingerprint of results kept by such a version (savedResults.ts) is compared with it too,
 * so they stay current when opened again (a project whose reasons were empty and which has no notes
 * has the same key either way).
 */
export function runKeyWithNotes(doc: ProjectDocument, dataFingerprint: string): string {
  return keyOf(doc, doc.data.csv, dataFingerprint);
}

function keyOf(doc: Omit<ProjectDocument, 'notes' | 'carriedOver'>, csv: CsvSettings, dataFingerprint: string): string {
  const { name: _name, description: _description, surface: _surface, data: _data, results: _results, ...rest } = doc;
  const candidates = rest.candidates.map(({ description: _d, ...c }) => c);
  return JSON.stringify({ ...rest, approximator: keyedApproximator(rest.approximator), candidates, csv, dataFingerprint });
}

/**
 * The CSV settings as the import and the numbers read them: each reason of a time window or a range
 * of runs left out blanked — a note printed in the reports from the current document
 * (data/leftOutReasons.ts), never a cause to import or run again. Blanked rather than dropped, so
 * the key keeps its form where every reason is empty.
 */
export function csvAsData(csv: CsvSettings): CsvSettings {
  return {
    ...csv,
    ...(csv.excludedTimes ? { excludedTimes: csv.excludedTimes.map((w) => ({ ...w, reason: '' })) } : {}),
    ...(csv.excludedRuns ? { excludedRuns: csv.excludedRuns.map((r) => ({ ...r, reason: '' })) } : {}),
  };
}

/**
 * The approximator as the key holds it: a network's polynomial part at its default is left out, as
 * files saved before the setting existed have it (absent, read as the default), so their kept
 * results stay current — the same numbers — while any other value changes the key.
 */
function keyedApproximator(a: ProjectDocument['approximator']): Record<string, unknown> {
  if (a.kind !== 'network' || a.polynomialDegree !== DEFAULT_POLYNOMIAL_PART) return a;
  const { polynomialDegree: _default, ...rest } = a;
  return rest;
}

/**
 * What an import depends on: the CSV settings (without the reasons, csvAsData), the column roles,
 * which bytes were loaded, and the actuator bounds the candidates declare (its summary's
 * present-controller model reads a logged extreme exactly at one of them as a limit:
 * pipeline/plan/declaredBounds.ts).
 */
export function importKey(doc: ProjectDocument, sourceVersion: number): string {
  return JSON.stringify([csvAsData(doc.data.csv), doc.columns, sourceVersion, declaredActionBounds(doc, doc.columns.actions.length)]);
}

/** SHA-256 of the run key: the fingerprint kept with saved results (FIPS 180-4, @noble/hashes). */
export function runFingerprint(key: string): string {
  return bytesToHex(sha256(new TextEncoder().encode(key)));
}
