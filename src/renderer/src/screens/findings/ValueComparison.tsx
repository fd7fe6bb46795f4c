/**
 * Each candidate's policy value beside the logged behaviour's discounted return: the comparison
 * chart, and a table with J, its standard error over start states, the fixed-point J, and how
 * the fit went; once the assessment is in, the bootstrap interval of each (percentile, the basic
 * interval in its tooltip).
 */
import type { Assessment, IntervalEstimate } from '../../../../pipeline/assessment';
import { PolicyValueChart } from '../../plots';
import type { Evaluation } from '../../../../pipeline/estimates';
import { formatNumber } from '../../format/numberFormat';
import type { Theme } from '../../theme';
import { intervalDetail, intervalText, levelText } from './assessmentWords';
import { ExportPanel } from './ExportPanel';

const STATUS: Record<string, string> = { converged: 'converged', maxIterations: 'stopped at the iteration limit', diverged: 'diverged' };

function IntervalCell({ estimate, level, testId }: { estimate: IntervalEstimate | undefined; level: number; testId: string }) {
  const p = estimate?.percentile ?? null;
  return (
    <td className="number interval" data-testid={testId} data-lo={p ? String(p[0]) : undefined} data-hi={p ? String(p[1]) : undefined}
      title={estimate ? intervalDetail(estimate, level) : 'no resamples for this policy'}>{intervalText(p)}</td>
  );
}

export function ValueComparison({ evaluation, theme, assessment }: { evaluation: Evaluation; theme: Theme; assessment?: Assessment | null }) {
  const level = assessment?.settings.level ?? 0;
  const sense = evaluation.valueSense === 'cost' ? 'Expected discounted cost (lower is better)' : 'Expected discounted reward (higher is better)';
  const b = evaluation.behaviour;
  return (
    <section className="panel span-2" aria-labelledby="values-heading" data-testid="panel-values">
      <h3 id="values-heading">Policy values</h3>
      <p className="small muted">{sense}. ± is one standard error over the start states only; it does not cover the error of the fit.</p>
      <PolicyValueChart evaluation={evaluation} theme={theme} />
      <table data-testid="value-table">
        <thead>
          <tr>
            <th scope="col">Policy</th><th scope="col" className="number">J</th><th scope="col" className="number">± s.e.</th>
            {assessment && <th scope="col" className="number" title="Percentile bootstrap interval over episodes; hover a cell for the basic interval">{levelText(level)} interval</th>}
            <th scope="col" className="number">Fixed-point J</th><th scope="col">Fit</th><th scope="col">Account</th>
          </tr>
        </thead>
        <tbody>
          {evaluation.policies.map((p, i) => (
            <tr key={p.name} data-testid={`value-row-${i}`}>
              <th scope="row">{p.name}</th>
              <td className="number" data-testid={`policy-value-${i}`} data-value={String(p.policyValue)}>{formatNumber(p.policyValue, 6)}</td>
              <td className="number">{formatNumber(p.standardError, 3)}</td>
              {assessment && <IntervalCell estimate={assessment.candidates[i]?.policyValue} level={level} testId={`policy-interval-${i}`} />}
              <td className="number">{p.fixedPointValue === null ? '—' : formatNumber(p.fixedPointValue, 6)}</td>
              <td>{STATUS[p.status] ?? p.status} ({p.iterations} it.)</td>
              <td className="small" data-testid={`policy-account-${i}`}>{p.message} <span className="muted">Computed by {p.backend}.</span></td>
            </tr>
          ))}
          <tr data-testid="value-row-behaviour">
            <th scope="row">Logged behaviour (today)</th>
            <td className="number" data-testid="behaviour-value" data-value={String(b.value)}>{formatNumber(b.value, 6)}</td>
            <td className="number">{formatNumber(b.standardError, 3)}</td>
            {assessment && <IntervalCell estimate={assessment.behaviour} level={level} testId="behaviour-interval" />}
            <td className="number">—</td>
            <td>{b.episodes} episodes</td>
            <td className="small">Mean discounted return of the logged episodes.</td>
          </tr>
        </tbody>
      </table>
      <ExportPanel kind="comparison" evaluation={evaluation} defaultTitle="Policy value per candidate" policy={evaluation.policies.map((p) => p.name).join(', ')}
        fileBase="policy-values" makeSpec={(title) => ({ kind: 'comparison', props: { evaluation, theme, title } })} />
    </section>
  );
}
