/**
 * What an evaluation's numbers depend on, as one string: the data's content (its fingerprint) and
 * everything in the document except its name, descriptions, the surface axes (redrawn without a
 * rerun), the kept results and where the data file lives or what was last saved about it. Two documents with the
 * same key give the same numbers.
 */
import { sha256 } from '@noble/hashes/sha2.js';
import { bytesToHex } from '@noble/hashes/utils.js';
import { declaredActionBounds } from '../pipeline/plan/declaredBounds';
import type { ProjectDocument } from '../project/schema';
import { DEFAULT_POLYNOMIAL_PART } from '../core/fqe/polynomialPartSetting';

export function runKey(doc: ProjectDocument, dataFingerprint: string): string {
  const { name: _name, description: _description, surface: _surface, data, results: _results, ...rest } = doc;
  const candidates = rest.candidates.map(({ description: _d, ...c }) => c);
  return JSON.stringify({ ...rest, approximator: keyedApproximator(rest.approximator), candidates, csv: data.csv, dataFingerprint });
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
 * What an import depends on: the CSV settings, the column roles, which bytes were loaded, and the
 * actuator bounds the candidates declare (its summary's present-controller model reads a logged
 * extreme exactly at one of them as a limit: pipeline/plan/declaredBounds.ts).
 */
export function importKey(doc: ProjectDocument, sourceVersion: number): string {
  return JSON.stringify([doc.data.csv, doc.columns, sourceVersion, declaredActionBounds(doc, doc.columns.actions.length)]);
}

/** SHA-256 of the run key: the fingerprint kept with saved results (FIPS 180-4, @noble/hashes). */
export function runFingerprint(key: string): string {
  return bytesToHex(sha256(new TextEncoder().encode(key)));
}
