/**
 * The sections of the Findings screen, in reading order: their plain names (for the section index
 * and each panel's heading) and whether each starts open. The answer, the values, the retune map
 * and the report start open; the evidence behind the answer (paired comparison, cross-checks,
 * coverage, sensitivity, the fitted surfaces and the convergence) starts folded, one click away in
 * the section index, so a wide screen shows the answer without a long scroll. Ours.
 */
import { VALUES_CHART_TITLE } from '../../../../figures/parts/plotTheme';

export type SectionId =
  | 'answer' | 'values' | 'comparison' | 'crossChecks' | 'coverage' | 'sensitivity'
  | 'retuneMap' | 'surface' | 'slice' | 'convergence' | 'report';

export interface FindingsSection {
  readonly id: SectionId;
  /** Short name in the section index. */
  readonly short: string;
  /** The panel's heading. */
  readonly title: string;
  readonly defaultOpen: boolean;
}

export const FINDINGS_SECTIONS: readonly FindingsSection[] = [
  { id: 'answer', short: 'Answer', title: 'Which candidate to trial', defaultOpen: true },
  { id: 'values', short: 'Values', title: VALUES_CHART_TITLE, defaultOpen: true },
  { id: 'retuneMap', short: 'Retune map', title: 'Retune map', defaultOpen: true },
  { id: 'comparison', short: 'Paired comparison', title: 'Paired comparison', defaultOpen: false },
  { id: 'crossChecks', short: 'Cross-checks', title: 'Cross-checks by other methods', defaultOpen: false },
  { id: 'coverage', short: 'Coverage', title: 'Coverage of the logs', defaultOpen: false },
  { id: 'sensitivity', short: 'Sensitivity', title: 'Sensitivity to the settings', defaultOpen: false },
  { id: 'surface', short: 'Value surface', title: 'Value surface', defaultOpen: false },
  { id: 'slice', short: 'Action values', title: 'Action values at one state', defaultOpen: false },
  { id: 'convergence', short: 'Convergence', title: 'Convergence of the fits', defaultOpen: false },
  { id: 'report', short: 'Report', title: 'Report', defaultOpen: true },
];

export function sectionOf(id: SectionId): FindingsSection {
  const found = FINDINGS_SECTIONS.find((s) => s.id === id);
  if (!found) throw new Error(`unknown Findings section ${id}`);
  return found;
}

/** The element id of a section's panel (the index links to it). */
export const sectionElementId = (id: SectionId): string => `findings-${id}`;
