/** The readable summary of an assessment for the terminal: intervals, comparison, cross-checks, warnings. */
import type { Assessment, IntervalEstimate } from '../pipeline/assessment';

const number = (v: number | null): string => {
  if (v === null || !Number.isFinite(v)) return '—';
  const magnitude = Math.abs(v);
  if (magnitude !== 0 && (magnitude >= 1e6 || magnitude < 1e-3)) return v.toExponential(3);
  return v.toPrecision(5).replace(/(\.\d*?)0+$/, '$1').replace(/\.$/, '');
};
const interval = (iv: [number, number] | null): string => (iv ? `[${number(iv[0])}, ${number(iv[1])}]` : '—');
const percent = (share: number | null): string => (share === null ? '—' : `${(100 * share).toFixed(1)} %`);

function table(rows: string[][]): string {
  const widths = rows[0].map((_, c) => Math.max(...rows.map((r) => r[c].length)));
  return rows.map((r) => r.map((cell, c) => (c === 0 ? cell.padEnd(widths[c]) : cell.padStart(widths[c]))).join('   ')).join('\n');
}

function estimateRow(name: string, e: IntervalEstimate): string[] {
  return [name, number(e.value), number(e.standardError), interval(e.percentile), interval(e.basic)];
}

export function formatAssessment(a: Assessment): string {
  const level = `${Math.round(100 * a.settings.level)} %`;
  const rows = [['policy', 'J', 'bootstrap s.e.', `${level} percentile`, `${level} basic`]];
  for (const c of a.candidates) rows.push(estimateRow(c.name, c.policyValue));
  rows.push(estimateRow('logged behaviour (today)', a.behaviour));
  const diffs = [['difference', 'value', `${level} percentile`, 'first better in']];
  for (const d of a.comparison.differences) diffs.push([`${d.a} − ${d.b}`, number(d.difference.value), interval(d.difference.percentile), percent(d.probabilityBetter)]);
  const checks = a.candidates.flatMap((c) => c.crossChecks.map((x) => `  ${c.name} · ${x.label}: ${x.estimate ? `${number(x.estimate.value)} ${interval(x.estimate.percentile)}` : '—'} — ${x.note}`));
  const warnings = [...a.warnings, ...a.candidates.flatMap((c) => c.warnings.map((w) => ({ ...w, message: `${c.name}: ${w.message}` })))];
  return [
    `Bootstrap over ${a.settings.episodes} episodes: ${a.settings.resamples} resamples, level ${level}, seed ${a.settings.seed}.`,
    '',
    table(rows),
    '',
    table(diffs),
    '',
    `Ranking: ${a.comparison.ranking.order.join(' > ')} (${a.comparison.ranking.frequency === null ? 'the candidates were not resampled' : `holds in ${percent(a.comparison.ranking.frequency)} of resamples`}).`,
    '',
    'Cross-checks:',
    ...checks,
    ...(warnings.length ? ['', 'Assessment warnings:', ...warnings.map((w) => `  - [${w.severity}] ${w.message}`)] : []),
    '',
  ].join('\n');
}
