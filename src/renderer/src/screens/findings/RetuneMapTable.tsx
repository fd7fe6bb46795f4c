/**
 * Every point of a retune map as a table: for two axes a grid (rows the first axis, columns the
 * second) with J in each cell, for one axis a list with the interval. Cells the logs do not support
 * are greyed and marked †, thin-log cells marked *, the best supported cell bold; each cell's title
 * gives its interval and support in words. J is written at its interval's decimals.
 */
import type { RetuneMapResult } from '../../../../pipeline/retuneMaps';
import { supportWords } from '../../../../figures/charts/retuneMapText';
import { CopyTable } from '../../components/CopyTable';
import { RichText } from '../../components/RichText';
import { gridPointLabels, tuningValueTexts } from '../../../../figures/parts/tickFormat';
import { shownMap } from '../../../../figures/parts/tuningAxis';

import { richAxisLabel } from './retuneMapWords';
import { valueColumnHead, valueUnitWords } from '../../../../pipeline/valueUnitWords';
import { intervalAtPrecision, valueAtPrecision, valueInInterval } from '../../../../figures/parts/uncertainNumber';

type Point = RetuneMapResult['points'][number];

/** J at its interval's decimals, as the headline, the readout and the report's grid print it (6.74 [4.88, 8.88], not 6.745). */
const valueText = (p: Point) => (p.value === null ? '—' : valueAtPrecision(p.value, p.interval));

const mark = (p: Point) => (p.value === null ? '' : p.support === null ? '' : p.support === 'caution' ? ' *' : ' †');
const cellClass = (p: Point, best: boolean) => ['number', best ? 'map-best' : '', p.value !== null && p.support !== null && p.support !== 'caution' ? 'map-unsupported' : ''].join(' ').trim();
const cellTitle = (p: Point) => `J ${p.value === null ? '—' : valueInInterval(p.value, p.interval).text}; ${supportWords(p.support)}${p.status === 'converged' ? '' : `; fit ${p.status}`}`;

/** `unit`: the cost's or reward's own unit from the project, '' when none is given. */
export function RetuneMapTable({ map: given, testId, unit }: { map: RetuneMapResult; testId: string; unit: string }) {
  const map = shownMap(given), best = map.best?.index ?? -1;
  return (
    <details className="details-section" data-testid={`${testId}-details`}>
      <summary>Values at every point</summary>
      <p className="small muted">J at each point, {valueUnitWords(unit)}; † beyond the logs (not supported), * thin logs (caution), bold the best supported point. Hover a cell for its interval.</p>
      <div className="table-scroll">
        {map.axes.length === 2 ? <GridTable map={map} best={best} testId={testId} /> : <ListTable map={map} best={best} testId={testId} unit={unit} />}
      </div>
      <CopyTable tableTestId={testId} fileBase="retune-map" />
    </details>
  );
}

/** The grid as the figure draws it (and the report prints it): the first axis across, the second up, its highest value in the top row. */
function GridTable({ map, best, testId }: { map: RetuneMapResult; best: number; testId: string }) {
  const [across, up] = map.axes, n = up.values.length, rowOrder = up.values.map((_, r) => n - 1 - r);
  const acrossText = gridPointLabels(across.values), upText = gridPointLabels(up.values); // as the figure's axes label them
  return (
    <table data-testid={testId} className="map-table">
      <caption className="small muted">Across: <RichText text={richAxisLabel(across.label)} />; up: <RichText text={richAxisLabel(up.label)} />, as in the figure.</caption>
      <thead>
        <tr>
          <th scope="col" aria-label="row value" />
          {across.values.map((v, c) => <th key={v} scope="col" className="number">{acrossText[c]}</th>)}
        </tr>
      </thead>
      <tbody>
        {rowOrder.map((r) => (
          <tr key={up.values[r]}>
            <th scope="row" className="number">{upText[r]}</th>
            {across.values.map((c, j) => {
              const p = map.points[j * n + r];
              return <td key={c} className={cellClass(p, j * n + r === best)} title={cellTitle(p)}>{valueText(p)}{mark(p)}</td>;
            })}
          </tr>
        ))}
      </tbody>
    </table>
  );
}

function ListTable({ map, best, testId, unit }: { map: RetuneMapResult; best: number; testId: string; unit: string }) {
  return (
    <table data-testid={testId} className="map-table">
      <thead>
        <tr><th scope="col" className="number"><RichText text={richAxisLabel(map.axes[0].label)} /></th><th scope="col" className="number">{valueColumnHead('J', unit)}</th><th scope="col" className="number">Interval</th><th scope="col">Support</th></tr>
      </thead>
      <tbody>
        {map.points.map((p, i) => (
          <tr key={i} className={i === best ? 'map-best' : ''}>
            <td className="number">{tuningValueTexts(map.axes, p.coordinates)[0]}</td>
            <td className={cellClass(p, false)}>{valueText(p)}</td>
            <td className="number">{intervalAtPrecision(p.interval)}</td>
            <td>{supportWords(p.support)}{p.status === 'converged' ? '' : ` (fit ${p.status})`}</td>
          </tr>
        ))}
      </tbody>
    </table>
  );
}
