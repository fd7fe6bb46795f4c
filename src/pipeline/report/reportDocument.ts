/**
 * The report as ONE self-contained HTML document: inline CSS, inline SVG figures, no scripts and
 * no external resources, so it opens anywhere, prints (A4, the cautions on the first page, no figure
 * or table split across pages: reportStyles.ts), and can be attached to a design review.
 * Section ids (job, data, settings, comparison, surfaces, slices, diagnostics, cross-checks,
 * sensitivity, retune-maps, cautions) are stable so hosts and tests can find them.
 */
import { formatWrittenAt, html, raw } from './htmlText';
import { comparisonSection } from './reportComparison';
import { cautionsSection, crossChecksSection, diagnosticsSection, sensitivitySection } from './reportEvidence';
import { slicesSection, surfacesSection } from './reportFigures';
import { FigureCounter, type ReportInput } from './reportInput';
import { dataSection, firstPageCautions, jobSection, settingsSection, summarySection } from './reportOverview';
import { REPORT_CSS } from './reportStyles';
import { retuneSection } from './reportRetune';

export type { ReportInput } from './reportInput';

export const REPORT_SECTIONS = ['job', 'data', 'settings', 'comparison', 'surfaces', 'slices', 'diagnostics', 'cross-checks', 'sensitivity', 'retune-maps', 'cautions'] as const;

export function renderReport(input: ReportInput): string {
  const figures = new FigureCounter();
  const body = html`<header><h1>Offline evaluation report — ${input.project.name}</h1>
      <p class="subtitle">Setpoint Critic · written ${html`<time datetime="${input.generatedAt}">${formatWrittenAt(input.generatedAt)}</time>`} · advisory offline estimates from logged data</p></header>
    ${firstPageCautions()}
    ${summarySection(input)}
    ${jobSection(input)}
    ${dataSection(input)}
    ${settingsSection(input)}
    ${comparisonSection(input, figures)}
    ${surfacesSection(input, figures)}
    ${slicesSection(input, figures)}
    ${diagnosticsSection(input)}
    ${crossChecksSection(input, figures)}
    ${sensitivitySection(input, figures)}
    ${retuneSection(input, figures)}
    ${cautionsSection(input, input.assessment)}`;
  return '<!DOCTYPE html>\n' + html`<html lang="en"><head><meta charset="utf-8"/>
    <meta http-equiv="Content-Security-Policy" content="default-src 'none'; style-src 'unsafe-inline'; img-src data:"/>
    <title>Offline evaluation report — ${input.project.name}</title><style>${raw(REPORT_CSS)}</style></head>
    <body>${body}</body></html>`.html + '\n';
}
