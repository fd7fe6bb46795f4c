/**
 * Results at boundaries: loading a file or a document either succeeds with a value or fails with
 * problems a person can act on. Deep numeric code throws typed errors instead; boundaries catch
 * those and turn them into problems.
 */
export interface Problem {
  /** Where: a file, and within it a row, column or field path, as a person would name it. */
  readonly where: string;
  /** What is wrong and what was expected. */
  readonly message: string;
  /** A stable machine-readable kind (e.g. "non-numeric-cell") so hosts can group problems. */
  readonly kind?: string;
  /**
   * The project-document field at fault as a path of keys and indices (["candidates", 0, "std", 1]),
   * so a host can point at the field without parsing `where` back (it is prose for people).
   */
  readonly field?: readonly (string | number)[];
}

export type Result<T> = { ok: true; value: T; warnings: Problem[] } | { ok: false; problems: Problem[] };

export function success<T>(value: T, warnings: Problem[] = []): Result<T> {
  return { ok: true, value, warnings };
}

export function failure<T = never>(...problems: Problem[]): Result<T> {
  return { ok: false, problems };
}

/** One line per problem: "where: message". */
export function describeProblems(problems: readonly Problem[]): string {
  return problems.map((p) => `${p.where}: ${p.message}`).join('\n');
}
