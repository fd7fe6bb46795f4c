/** The engineering cautions, worded once in the pipeline, standing where results are shown. */
import { CAUTIONS } from '../../../pipeline/cautions';

export function Cautions() {
  return (
    <section className="cautions" aria-labelledby="cautions-title" data-testid="cautions">
      <h3 id="cautions-title">Before you use any estimate</h3>
      <ul>{CAUTIONS.map((c) => <li key={c}>{c}</li>)}</ul>
    </section>
  );
}
