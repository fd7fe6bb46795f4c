/**
 * "Did you mean …?" for column and field names: the candidate with the smallest Levenshtein
 * distance (Levenshtein 1966; Wagner & Fischer 1974 dynamic programme), compared case-insensitively
 * first because exports often change only the case.
 *
 * Only a plausible name is offered, so a file that is not a log (a password file, an environment
 * block read as a "header") never has its lines echoed back: a candidate is suggested only when it
 * is at most MAX_SUGGESTED_LENGTH characters of printable text and close — within two edits, within
 * 40 % of the longer name, or one name containing the other (time → timestamp). The distance is
 * computed only when the lengths alone allow a match, so the work per candidate is bounded by
 * MAX_SUGGESTED_LENGTH² whatever the header holds.
 */
export const MAX_SUGGESTED_LENGTH = 64;

export function editDistance(a: string, b: string): number {
  if (a === b) return 0;
  let previous = Array.from({ length: b.length + 1 }, (_, j) => j);
  for (let i = 1; i <= a.length; i++) {
    const current = [i];
    for (let j = 1; j <= b.length; j++) {
      const substitution = previous[j - 1] + (a[i - 1] === b[j - 1] ? 0 : 1);
      current.push(Math.min(previous[j] + 1, current[j - 1] + 1, substitution));
    }
    previous = current;
  }
  return previous[b.length];
}

/** Edits still counted as a plausible misspelling between names of these lengths. */
function allowedEdits(a: number, b: number): number {
  return Math.max(2, Math.floor(0.4 * Math.max(a, b)));
}

const PRINTABLE = /^[^\p{Cc}\p{Cf}\p{Zl}\p{Zp}]*$/u;

function suggestable(candidate: string): boolean {
  return candidate !== '' && candidate.length <= MAX_SUGGESTED_LENGTH && PRINTABLE.test(candidate);
}

/** The closest plausible candidate to `name`, or undefined when none is close enough. */
export function closestName(name: string, candidates: readonly string[]): string | undefined {
  if (name.length > MAX_SUGGESTED_LENGTH) return undefined;
  let best: string | undefined;
  let bestDistance = Infinity;
  const lower = name.toLowerCase();
  for (const candidate of candidates) {
    if (!suggestable(candidate)) continue;
    const other = candidate.toLowerCase();
    const contains = lower.length >= 3 && other.length >= 3 && (other.includes(lower) || lower.includes(other));
    const limit = contains ? Math.max(lower.length, other.length) : allowedEdits(lower.length, other.length);
    if (Math.abs(lower.length - other.length) > limit) continue;
    const caseless = editDistance(lower, other);
    if (caseless > limit) continue;
    // Case differences count a tenth of an edit so that "Level" beats "Lever" for "level".
    const distance = caseless + 0.1 * Math.min(1, editDistance(name, candidate));
    if (distance < bestDistance) {
      bestDistance = distance;
      best = candidate;
    }
  }
  return best;
}

/** `; did you mean "x"?` or '' — appended to messages about unknown names. */
export function suggestionFor(name: string, candidates: readonly string[]): string {
  const best = closestName(name, candidates);
  return best === undefined ? '' : `; did you mean "${best}"?`;
}
