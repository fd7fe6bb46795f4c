/**
 * The unvisited share of the value-surface grid (cells with no logged state within one grid step),
 * in words for the app's coverage panel and the report, said once: where the share is large enough
 * for a caution (assessAssembly.ts globalWarnings), the warning says it and the plain sentence is
 * left out, so the Coverage section never states the same share twice (the screen review saw both
 * on the two-valve project). Kept apart from the assembly so the app's screens import the words alone.
 */
import { UNVISITED_CAUTION_SHARE } from '../core/diagnostics/unvisitedRegion';
import { shareText } from '../core/shareText';

/** The topic of the warning that states the unvisited share (AssessmentWarning.topic). */
export const UNVISITED_TOPIC = 'unvisited';

/** The warning's message: the share, the limit it passed (UNVISITED_CAUTION_SHARE, the rule's own) and what it means for the surfaces. */
export function unvisitedWarningMessage(share: number): string {
  return `${shareText(share)} of the value-surface grid has no logged state within one grid step, more than the ${shareText(UNVISITED_CAUTION_SHARE)} at which this is a caution: the surfaces are extrapolated there.`;
}

/** The plain sentence; null without a grid, or where a warning among `warnings` already states the share. */
export function unvisitedSentence(share: number | null, warnings: readonly { topic: string }[] = []): string | null {
  if (share === null || warnings.some((w) => w.topic === UNVISITED_TOPIC)) return null;
  return `Unvisited states: ${shareText(share)} of the value-surface grid has no logged state within one grid step; values there are extrapolated.`;
}
