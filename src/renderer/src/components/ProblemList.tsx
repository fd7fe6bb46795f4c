/** Problems as the importer, the schema or the pipeline give them: where, then what. */
import type { Problem } from '../../../core/result';

export function ProblemList(props: { title: string; problems: readonly Problem[]; tone?: 'error' | 'warning' | 'info'; testId?: string }) {
  if (props.problems.length === 0) return null;
  const tone = props.tone ?? 'error';
  return (
    <div className={`problems ${tone}`} role={tone === 'error' ? 'alert' : 'status'} data-testid={props.testId}>
      <strong>{props.title}</strong>
      <ul>
        {props.problems.map((p, i) => (
          <li key={i}><span className="where">{p.where}</span>: {p.message}</li>
        ))}
      </ul>
    </div>
  );
}
