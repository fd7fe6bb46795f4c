/**
 * The retune maps section: each map as a table — for two axes a grid with the first axis down and
 * the second across, each cell J with its interval, shaded by whether the logs support it (the
 * occupancy-shift rule, src/core/diagnostics/severity.ts), the best supported cell outlined; the
 * present controller's value for reference.
 */
import type { RetuneMapPoint, RetuneMapResult } from '../retuneMaps';
import { formatInterval, formatNumber, html, type Html } from './htmlText';
import type { ReportInput } from './reportInput';

const SUPPORT_WORD = { caution: 'thin logs', serious: 'beyond the logs', unknown: 'support unknown' } as const;

export function retuneSection(input: ReportInput): Html {
  const maps = input.retuneMaps;
  if (maps.length === 0 && input.retuneMapProblems.length === 0) {
    return html`<section id="retune-maps"><h2>Retune maps</h2><p>This project defines no retune map (the project field <code>retuneMaps</code>).</p></section>`;
  }
  return html`<section id="retune-maps"><h2>Retune maps</h2>
    ${input.retuneMapProblems.length ? html`<p>Not computed: ${input.retuneMapProblems.join('; ')}</p>` : html``}
    <p>Each cell is J of the candidate with the numbers on its row and column, by linear fitted Q-evaluation on the same logs.
      <span class="retune-supported">Unshaded</span>: the logs support the estimate; <span class="retune-caution">light</span>: thin logs (caution);
      <span class="retune-serious">dark</span>: beyond the logs (serious) — read those as extrapolation. The outlined cell is the best supported point.</p>
    ${maps.map((m) => mapTable(m))}</section>`;
}

function mapTable(map: RetuneMapResult): Html {
  const best = map.best;
  const caption = html`<p><strong>${map.candidate}</strong> — ${best
    ? `best supported point ${best.coordinates.map((v, a) => `${map.axes[a].label} = ${formatNumber(v, 4)}`).join(', ')}, J ${formatNumber(best.value, 4)}`
    : 'no point is both converged and supported by the logs'}${map.presentController === null ? '' : `; present controller J ${formatNumber(map.presentController, 4)}`}.</p>`;
  const notes = html`<ul class="small">${map.notes.map((n) => html`<li>${n}</li>`)}</ul>`;
  const cell = (p: RetuneMapPoint, i: number) => html`<td class="num retune-${p.support === null ? 'supported' : p.support}${best?.index === i ? ' retune-best' : ''}"
    title="${p.support === null ? 'supported' : SUPPORT_WORD[p.support]}; occupancy shift ${formatNumber(p.occupancyShift, 3)}">${p.value === null ? `no value (${p.status})` : formatNumber(p.value, 4)}<br/><span class="small">${formatInterval(p.interval, 3)}</span></td>`;
  if (map.axes.length === 1) {
    return html`${caption}<table><thead><tr><th>${map.axes[0].label}</th><th class="num">J and interval</th></tr></thead><tbody>
      ${map.points.map((p, i) => html`<tr><td class="num">${formatNumber(p.coordinates[0], 4)}</td>${cell(p, i)}</tr>`)}</tbody></table>${notes}`;
  }
  const [rows, cols] = map.axes, width = cols.values.length;
  return html`${caption}<table class="retune-grid"><thead><tr><th>${rows.label} ↓ · ${cols.label} →</th>${cols.values.map((v) => html`<th class="num">${formatNumber(v, 4)}</th>`)}</tr></thead><tbody>
    ${rows.values.map((v, r) => html`<tr><th class="num">${formatNumber(v, 4)}</th>${cols.values.map((_, c) => cell(map.points[r * width + c], r * width + c))}</tr>`)}
    </tbody></table>${notes}`;
}
