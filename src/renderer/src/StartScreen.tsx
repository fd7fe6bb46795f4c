/** The first screen: what the tool is for and the cautions. The workflow screens come with the app. */
import { CAUTIONS } from '../../pipeline/cautions';

export function StartScreen() {
  return (
    <main style={{ fontFamily: 'system-ui, sans-serif', maxWidth: 760, margin: '3rem auto', lineHeight: 1.5 }}>
      <h1>Setpoint Critic</h1>
      <p>
        Estimate, from logged plant data, how a candidate setpoint policy would perform before it touches the plant.
        Until the project screens land, run evaluations with <code>npm run cli -- evaluate &lt;project.spcritic&gt;</code>.
      </p>
      <section aria-label="Cautions">
        <h2>Before you use any estimate</h2>
        <ul>{CAUTIONS.map((c) => <li key={c}>{c}</li>)}</ul>
      </section>
    </main>
  );
}
