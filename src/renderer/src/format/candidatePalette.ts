/**
 * Colours that stay distinguishable for the common forms of colour blindness, one per candidate:
 * the Okabe–Ito palette (Okabe & Ito, "Color Universal Design", 2008), without its black, which
 * would vanish on the dark theme, and its yellow, too faint on white.
 */
export const CANDIDATE_COLOURS = ['#0072B2', '#D55E00', '#009E73', '#CC79A7', '#E69F00', '#56B4E9'] as const;

export function candidateColour(index: number): string {
  return CANDIDATE_COLOURS[index % CANDIDATE_COLOURS.length];
}
