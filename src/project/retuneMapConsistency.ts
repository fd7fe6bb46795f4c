/**
 * Checks of the retune maps against the candidates: the named candidate exists, every axis names a
 * number of it, the two axes differ, a logarithmic axis has positive ends, and the grid stays within
 * core's limit on points (src/core/retune/retuneAxes.ts).
 */
import { MAX_RETUNE_POINTS } from '../core/retune/retuneAxes';
import { candidateParameter, tunableParameters } from './candidateParameters';
import type { ProjectDocument } from './schema';

export function checkRetuneMaps(doc: ProjectDocument, add: (path: string, message: string) => void): void {
  (doc.retuneMaps ?? []).forEach((map, i) => {
    const where = `retuneMaps[${i}]`;
    const candidate = doc.candidates.find((c) => c.name === map.candidate);
    if (!candidate) {
      add(`${where}.candidate`, `no candidate is named "${map.candidate}" (candidates: ${doc.candidates.map((c) => c.name).join(', ')})`);
      return;
    }
    map.axes.forEach((axis, a) => {
      if (candidateParameter(candidate, axis.parameter) === undefined) {
        const known = tunableParameters(candidate, doc.columns).map((p) => p.path).join(', ');
        add(`${where}.axes[${a}].parameter`, `"${axis.parameter}" is not a number of candidate "${candidate.name}"; its tunable numbers are ${known}`);
      }
      if (axis.from === axis.to) add(`${where}.axes[${a}].to`, 'expected "to" to differ from "from"');
      if (axis.spacing === 'logarithmic' && !(axis.from > 0 && axis.to > 0)) add(`${where}.axes[${a}].spacing`, 'a logarithmic axis needs positive "from" and "to"');
    });
    if (map.axes.length === 2 && map.axes[0].parameter === map.axes[1].parameter) add(`${where}.axes[1].parameter`, 'the two axes sweep the same number; choose two different ones');
    const points = map.axes.reduce((p, axis) => p * axis.count, 1);
    if (points > MAX_RETUNE_POINTS) add(`${where}.axes`, `${points} grid points; at most ${MAX_RETUNE_POINTS} are supported`);
  });
}
