/**
 * The report's stylesheet, inline so the file stands alone; plain and printable: A4 with 16 × 14 mm
 * margins (the @page rule, which the app's PDF writer follows), figures, tables, table rows and the
 * caution boxes never split across pages, headings kept with what follows, table headers repeated
 * on each page, shading printed (print-color-adjust, CSS Color Adjustment Level 1).
 */
export const REPORT_CSS = `
:root { --ink: #1a1a1a; --muted: #555; --rule: #c8c8c8; --serious: #9b1c1c; --caution: #8a5a00; --ok: #1e6b3a; }
* { box-sizing: border-box; }
body { font: 14px/1.45 "Segoe UI", "Helvetica Neue", Arial, sans-serif; color: var(--ink); margin: 0 auto; max-width: 980px; padding: 24px 32px 48px; background: #fff; }
h1 { font-size: 24px; margin: 0 0 4px; }
h2 { font-size: 19px; margin: 32px 0 10px; padding-bottom: 4px; border-bottom: 2px solid var(--ink); }
h3 { font-size: 15px; margin: 20px 0 6px; }
p, li { max-width: 78ch; }
/* A boxed paragraph fills its box: the reading measure above is for running text, and a box drawn wider than its words read as a layout fault. */
.summary p, .cautions li, .cautions-first p, .cautions-first li { max-width: none; }
.subtitle { color: var(--muted); margin: 0 0 16px; }
table { border-collapse: collapse; margin: 8px 0 14px; font-size: 13px; }
th, td { border-bottom: 1px solid var(--rule); padding: 4px 10px 4px 0; text-align: left; vertical-align: top; }
th { border-bottom: 1.5px solid var(--ink); font-weight: 600; }
/* A row's own head (the Job table's "Project", "Data file" …) sits on the same rule as its value, so each row's line runs straight across. */
tbody th { border-bottom: 1px solid var(--rule); }
td.num, th.num { text-align: right; font-variant-numeric: tabular-nums; }
td.num { white-space: nowrap; }
.retune-caution { background: #e8e8e8; }
.retune-serious { background: #b8b8b8; color: #222; }
.retune-unknown { background: #f4f4f4; }
.retune-best { outline: 3px solid var(--ink); outline-offset: -3px; }
.retune-grid td, .retune-grid th { padding: 2px 4px; font-size: 0.85em; }
.retune-grid td.num { white-space: normal; } /* an interval may break after its comma, so a 10-column grid fits the A4 text width */
figure { margin: 14px 0 20px; break-inside: avoid; page-break-inside: avoid; }
figcaption { font-size: 12.5px; color: var(--muted); max-width: 86ch; margin-top: 4px; }
svg { max-width: 100%; height: auto; font-size: 11px; font-family: inherit; }
svg .axis line, svg .axis path { stroke: #333; }
svg .axis-label { font-size: 12px; fill: #222; }
svg .value { fill: #333; }
.summary { border: 1px solid var(--rule); border-left: 5px solid var(--ink); padding: 10px 14px; margin: 12px 0; }
.summary p { margin: 0; }
.summary p + p { margin-top: 6px; }
.warning { margin: 4px 0; }
.warning.serious strong { color: var(--serious); }
.warning.caution strong { color: var(--caution); }
.finding-table { width: auto; font-size: 12.5px; }
.finding-table caption { text-align: left; color: var(--muted); padding-bottom: 4px; }
.finding-table thead th { vertical-align: bottom; white-space: nowrap; }
.finding-table td.finding-cell { text-align: center; padding: 4px 8px; }
.finding-table td.finding-cell.none { color: var(--muted); }
.finding-table td.finding-cell.serious a { color: var(--serious); font-weight: 700; }
.finding-table td.finding-cell.caution a { color: var(--caution); }
.verdict-agrees { color: var(--ok); font-weight: 600; }
.verdict-disagrees { color: var(--serious); font-weight: 600; }
.verdict-uninformative, .verdict-notApplicable { color: var(--caution); font-weight: 600; }
.cautions { border: 2px solid var(--ink); padding: 8px 16px; }
.cautions-first { border: 2px solid var(--ink); padding: 6px 14px; margin: 10px 0 14px; font-size: 13px; }
.cautions-first p { margin: 0 0 2px; }
.cautions-first ul { margin: 0; padding-left: 20px; }
.small { font-size: 12.5px; color: var(--muted); }
.grid2 { display: flex; flex-wrap: wrap; gap: 12px 10px; }
@page { size: A4; margin: 16mm 14mm; }
@media print {
  body { padding: 0; max-width: none; font-size: 10.5pt; }
  h2, h3 { break-after: avoid; page-break-after: avoid; }
  section { break-inside: auto; }
  figure, table, tr, .summary, .cautions, .cautions-first { break-inside: avoid; page-break-inside: avoid; }
  thead { display: table-header-group; }
  * { -webkit-print-color-adjust: exact; print-color-adjust: exact; }
}
`;
