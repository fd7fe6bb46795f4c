/**
 * The paired comparison: each candidate against the baseline (the present controller's model) and against each other, the
 * difference's interval over the same resamples and how often the first came out better, then the
 * ranking and how often it holds across resamples.
 */
import type { Assessment } from '../../../../pipeline/assessment';
import { CopyTable } from '../../components/CopyTable';
import { FoldPanel } from './FoldPanel';
import { columnName, displayName } from './plotLabels';
import { intervalDetail, levelText, shareText, sharesText } from './assessmentWords';
import { intervalAtPrecision, valueAtPrecision } from '../../../../figures/parts/uncertainNumber';

export function ComparisonTable({ assessment }: { assessment: Assessment }) {
  const { differences, ranking } = assessment.comparison, level = assessment.settings.level;
  // "First better in", down the column at one precision (core/shareText.ts, sharesText); a dash where unknown.
  const firstBetterIn = sharesText(differences.map((d) => d.probabilityBetter));
  const better = assessment.valueSense === 'cost' ? 'lower cost' : 'higher reward';
  return (
    <FoldPanel section="comparison" testId="panel-comparison" gist={`Each candidate against the baseline and each other, ${levelText(level)} intervals; the ranking holds in ${shareText(ranking.frequency)} of resamples.`}>
      <p data-testid="comparison-baseline"><strong>Baseline:</strong> {displayName(assessment.comparison.baseline.name)}. {assessment.comparison.baseline.note}</p>
      <p className="small muted">
        Differences first − second in the project’s sense, {levelText(level)} percentile intervals from the same {assessment.settings.resamples.toLocaleString('en-US')} resamples of the logged runs
        (paired bootstrap). “Better” means {better}; “first better in” counts the resamples in which the first came out better. An interval that excludes 0 says the order is unlikely to be an accident of which runs were logged.
      </p>
      <table data-testid="comparison-table">
        <thead>
          <tr>
            <th scope="col">First</th><th scope="col">Second</th><th scope="col" className="number">Difference</th>
            <th scope="col" className="number">{levelText(level)} interval</th><th scope="col" className="number">First better in</th>
          </tr>
        </thead>
        <tbody>
          {differences.map((d, i) => (
            <tr key={`${d.a}|${d.b}`} data-testid={`difference-row-${i}`}>
              <td>{columnName(d.a)}</td><td>{columnName(d.b)}</td>
              <td className="number">{valueAtPrecision(d.difference.value, d.difference.percentile)}</td>
              <td className="number interval" title={intervalDetail(d.difference, level)}>{intervalAtPrecision(d.difference.percentile)}</td>
              <td className="number">{firstBetterIn[i]}</td>
            </tr>
          ))}
        </tbody>
      </table>
      <CopyTable tableTestId="comparison-table" fileBase="paired-differences" />
      <div data-testid="ranking">
        <p><strong>Ranking, best first:</strong> {ranking.order.map(columnName).join(' › ')}.{' '}
          {ranking.frequency === null ? 'How often it holds is unknown (some policy has no resamples).' : `This whole order holds in ${shareText(ranking.frequency)} of the resamples.`}
        </p>
        {ranking.neighbours.length > 0 && (
          <ul className="small">
            {ranking.neighbours.map((n) => (
              <li key={`${n.better}|${n.worse}`}>{columnName(n.better)} ahead of {columnName(n.worse)}: {n.frequency === null ? 'unknown' : `in ${shareText(n.frequency)} of resamples`}</li>
            ))}
          </ul>
        )}
      </div>
    </FoldPanel>
  );
}
