/**
 * The caption under every exported plot: project, policy, settings and date on one line, then the
 * short engineering caution (the host passes src/pipeline/cautions.ts's text), which no export may leave out.
 */

export interface CaptionParts {
  project: string;
  policy: string;
  settings: string;
  date: string;
}

/** One line per part kind; newlines and runs of spaces inside a part become single spaces. */
export function exportCaption(parts: CaptionParts, caution: string): string {
  const clean = (text: string) => text.replace(/\s+/g, ' ').trim();
  const facts = [
    clean(parts.project) && `Project: ${clean(parts.project)}`,
    clean(parts.policy) && `Policy: ${clean(parts.policy)}`,
    clean(parts.settings),
    clean(parts.date),
  ].filter(Boolean);
  return `${facts.join(' · ')}\n${caution}`;
}

/** The caption as given, with the caution added when it is missing. */
export function withCaution(caption: string, caution: string): string {
  const text = caption.trim();
  if (text.includes(caution)) return text;
  return text ? `${text}\n${caution}` : caution;
}
