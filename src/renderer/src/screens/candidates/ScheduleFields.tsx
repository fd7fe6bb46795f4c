/**
 * One action's schedule: the input state, a table of breakpoints and output values (straight lines
 * between, held flat beyond the ends; breakpoints strictly increasing) with rows to add and remove,
 * and an optional P/PI trim on a setpoint error.
 */
import { NumberField } from '../../components/NumberField';
import { SelectField } from '../../components/SelectField';
import { problemAt, problemsUnder, type FieldProblem } from '../../document/projectProblems';
import type { ProjectDocument } from '../../../../project/schema';
import { useWorkspace } from '../../WorkspaceContext';
import { FeedbackFields } from './FeedbackFields';
import { defaultFeedback, type ScheduleLoop } from './formDrafts';
import { withRowAdded, withRowRemoved } from './scheduleRows';
import type { DataImport } from '../../../../shared/workerMessages';
import { MAX_SCHEDULE_BREAKPOINTS } from '../../../../core/limits';

interface Props {
  doc: ProjectDocument;
  imported: DataImport | null;
  path: string;
  action: number;
  loop: ScheduleLoop;
  problems: readonly FieldProblem[];
  edit: (label: string, f: (loop: ScheduleLoop) => ScheduleLoop, key: string) => void;
}

export function ScheduleFields({ doc, imported, path, action, loop, problems, edit }: Props) {
  const { documents } = useWorkspace();
  const states = doc.columns.states;
  const inputUnit = states.find((s) => s.column === loop.input)?.unit || 'units';
  const actionUnit = doc.columns.actions[action]?.unit || 'action units';
  const setAt = (list: number[], k: number, v: number): number[] => list.map((x, i) => (i === k ? v : x));
  const tableMessages = [...problemsUnder(problems, `${path}.breakpoints`), ...problemsUnder(problems, `${path}.values`)]
    .filter((p) => !/\.\d+$/.test(p.path)).map((p) => p.message);
  const trim = loop.feedback;
  return (
    <>
      <div className="row">
        <SelectField label="Schedule input" value={loop.input} message={problemAt(problems, `${path}.input`)}
          options={states.map((s) => ({ value: s.column, label: s.unit ? `${s.column} (${s.unit})` : s.column }))}
          help="The state the output is scheduled on, e.g. outdoor temperature."
          onChange={(input) => edit('choose the schedule input', (l) => ({ ...l, input }), 'input')} />
      </div>
      <table className="schedule-table" aria-label={`Schedule of ${doc.columns.actions[action]?.column ?? 'the action'}`}>
        <thead>
          <tr><th scope="col">{loop.input} ({inputUnit})</th><th scope="col">Output ({actionUnit})</th><th scope="col"><span className="sr-only">Row</span></th></tr>
        </thead>
        <tbody>
          {loop.breakpoints.map((b, k) => (
            <tr key={k}>
              <td>
                <NumberField hideLabel label={`Breakpoint ${k + 1} of ${loop.input} (${inputUnit})`} value={b}
                  message={problemAt(problems, `${path}.breakpoints.${k}`)}
                  onCommit={(v) => v !== null && edit('set a breakpoint', (l) => ({ ...l, breakpoints: setAt(l.breakpoints, k, v) }), `breakpoints.${k}`)} onBlur={documents.closeStep} />
              </td>
              <td>
                <NumberField hideLabel label={`Output at breakpoint ${k + 1} (${actionUnit})`} value={loop.values[k] ?? null}
                  message={problemAt(problems, `${path}.values.${k}`)}
                  onCommit={(v) => v !== null && edit('set a schedule value', (l) => ({ ...l, values: setAt(l.values, k, v) }), `values.${k}`)} onBlur={documents.closeStep} />
              </td>
              <td>
                <button type="button" disabled={loop.breakpoints.length <= 1} aria-label={`Remove breakpoint ${k + 1}`}
                  onClick={() => edit('remove a breakpoint', (l) => withRowRemoved(l, k), `remove.${k}`)}>Remove</button>
              </td>
            </tr>
          ))}
        </tbody>
      </table>
      {tableMessages.map((m) => <p key={m} className="error-text" role="alert">{m}</p>)}
      <div className="row">
        <button type="button" disabled={loop.breakpoints.length >= MAX_SCHEDULE_BREAKPOINTS} title={loop.breakpoints.length >= MAX_SCHEDULE_BREAKPOINTS ? `At most ${MAX_SCHEDULE_BREAKPOINTS} breakpoints per loop` : undefined} onClick={() => edit('add a breakpoint', withRowAdded, 'add')}>Add a breakpoint</button>
        <span className="small muted">Breakpoints must increase from row to row; the output is held flat beyond the first and last.</span>
      </div>
      <label className="choice">
        <input type="checkbox" checked={trim !== undefined}
          onChange={(e) => edit(e.target.checked ? 'add a trim loop' : 'remove the trim loop', (l) => withTrim(l, e.target.checked ? defaultFeedback(doc, imported) : undefined), 'trim')} />
        Add a P/PI trim on a setpoint error (added to the scheduled output)
      </label>
      {trim && (
        <fieldset className="trim-loop">
          <legend>Trim on {trim.measurement}</legend>
          <FeedbackFields doc={doc} path={`${path}.feedback`} action={action} loop={trim} problems={problems}
            edit={(label, f, key) => edit(label, (l) => (l.feedback ? { ...l, feedback: f(l.feedback) } : l), `feedback.${key}`)} />
        </fieldset>
      )}
    </>
  );
}

function withTrim(loop: ScheduleLoop, feedback: ScheduleLoop['feedback']): ScheduleLoop {
  const { feedback: _old, ...rest } = loop;
  return feedback ? { ...rest, feedback } : rest;
}
