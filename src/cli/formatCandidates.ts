/** The candidates as the project writes them, in the trade's words (printed before the values). */
import { ASCII_MINUS } from '../core/exponentText';
import { summariseCandidate } from '../project/candidateSummary';
import type { ProjectDocument } from '../project/schema';

export function formatCandidates(project: ProjectDocument): string {
  const lines = ['Candidates:'];
  for (const c of project.candidates) {
    const s = summariseCandidate(c, project.columns, ASCII_MINUS); // the terminal's minus, as every number it prints
    lines.push(`  ${c.name}`);
    for (const mean of s.mean) lines.push(`    ${mean}`);
    lines.push(`    ${s.dither}; limits: ${s.limits}`);
  }
  return `${lines.join('\n')}\n\n`;
}
