/** Numbers and durations as the import report prints them: 19,960 transitions; 10 s; 2.5 min. */
export function formatCount(n: number): string {
  return n.toLocaleString('en-US');
}

export function formatSeconds(seconds: number): string {
  if (!Number.isFinite(seconds)) return 'unknown';
  if (seconds >= 3600) return `${+(seconds / 3600).toPrecision(4)} h`;
  if (seconds >= 60) return `${+(seconds / 60).toPrecision(4)} min`;
  return `${+seconds.toPrecision(4)} s`;
}

/** "1 row" / "3 rows". */
export function plural(n: number, word: string, wordPlural = `${word}s`): string {
  return `${formatCount(n)} ${n === 1 ? word : wordPlural}`;
}
