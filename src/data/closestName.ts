/**
 * "Did you mean …?" for column names: the candidate with the smallest Levenshtein distance
 * (Levenshtein 1966; Wagner & Fischer 1974 dynamic programme), compared case-insensitively
 * first because exports often change only the case.
 */
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

/** The closest candidate to `name`, or undefined when there are no candidates. */
export function closestName(name: string, candidates: readonly string[]): string | undefined {
  let best: string | undefined;
  let bestDistance = Infinity;
  const lower = name.toLowerCase();
  for (const candidate of candidates) {
    if (candidate === '') continue;
    // Case differences count a tenth of an edit so that "Level" beats "Lever" for "level".
    const caseless = editDistance(lower, candidate.toLowerCase());
    const distance = caseless + 0.1 * Math.min(1, editDistance(name, candidate));
    if (distance < bestDistance) {
      bestDistance = distance;
      best = candidate;
    }
  }
  return best;
}

/** ` (did you mean "x"?)` or '' — appended to messages about unknown names. */
export function suggestionFor(name: string, candidates: readonly string[]): string {
  const best = closestName(name, candidates);
  return best === undefined ? '' : `; did you mean "${best}"?`;
}
