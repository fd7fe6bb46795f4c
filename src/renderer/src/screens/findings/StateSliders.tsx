/** A slider (with its number) for each state not on an axis, over the range the logs cover. */
import { useId } from 'react';
import { formatNumber } from '../../format/numberFormat';
import type { ProjectDocument } from '../../../../project/schema';

interface Props {
  doc: ProjectDocument;
  ranges: [number, number][];
  values: number[];
  /** States drawn on an axis (no slider). */
  skip: number[];
  onChange: (values: number[]) => void;
  means: number[];
}

const STEPS = 200;

export function StateSliders({ doc, ranges, values, skip, onChange, means }: Props) {
  const id = useId();
  const shown = doc.columns.states.map((s, i) => ({ s, i })).filter(({ i }) => !skip.includes(i));
  if (shown.length === 0) return null;
  return (
    <fieldset>
      <legend>Hold the other states at</legend>
      {shown.map(({ s, i }) => {
        const [lo, hi] = ranges[i];
        const step = hi > lo ? (hi - lo) / STEPS : 1;
        return (
          <div className="field" key={s.column}>
            <label htmlFor={`${id}-${i}`}>{s.column}: {formatNumber(values[i])}{s.unit ? ` ${s.unit}` : ''}</label>
            <input id={`${id}-${i}`} type="range" min={lo} max={hi} step={step} value={values[i]} data-testid={`slider-${s.column}`}
              onChange={(e) => onChange(values.map((v, k) => (k === i ? Number(e.target.value) : v)))} />
          </div>
        );
      })}
      <button onClick={() => onChange([...means])}>Back to the logged means</button>
    </fieldset>
  );
}
