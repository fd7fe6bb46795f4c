/**
 * The fields of one P/PI loop on a setpoint error (a PI candidate's loop, or a schedule's trim):
 * measurement, setpoint (a number or a state column), proportional gain K_c, integral action
 * (none, integral time T_i or integral gain K_i; on screen as subscripts, K_{c}, through RichText) with its error-integral state, and direction.
 * Each field shows the project check's message for it.
 */
import type { ReactNode } from 'react';
import { NumberField } from '../../components/NumberField';
import { SelectField } from '../../components/SelectField';
import { problemAt, type FieldProblem } from '../../document/projectProblems';
import type { ProjectDocument } from '../../../../project/schema';
import { useWorkspace } from '../../WorkspaceContext';
import { errorIntegralsFor, fixedSetpointFor, integralMode, withIntegralMode, type Feedback, type IntegralMode } from './formDrafts';

/** An edit of the loop that keeps whatever else the loop carries (a PI loop's bias). */
export type LoopEdit = (label: string, f: <L extends Feedback>(loop: L) => L, key: string) => void;

interface Props {
  doc: ProjectDocument;
  /** Dotted path of the loop in the document, e.g. "candidates.0.form.loops.0" or "….feedback". */
  path: string;
  action: number;
  loop: Feedback;
  problems: readonly FieldProblem[];
  edit: LoopEdit;
  /** Fields placed before the direction and gain (a PI loop's bias). */
  leading?: ReactNode;
}

const FIXED = '\u0000fixed';
const NONE = '\u0000none';

export function FeedbackFields({ doc, path, action, loop, problems, edit, leading }: Props) {
  const { documents } = useWorkspace();
  const states = doc.columns.states;
  const stateOptions = states.map((s) => ({ value: s.column, label: s.unit ? `${s.column} (${s.unit})` : s.column }));
  const measurementUnit = states.find((s) => s.column === loop.measurement)?.unit || 'measurement unit';
  const actionUnit = doc.columns.actions[action]?.unit || 'action unit';
  const at = (key: string): string | null => problemAt(problems, `${path}.${key}`);
  const mode = integralMode(loop);
  const fixed = typeof loop.setpoint === 'number';
  const integrals = errorIntegralsFor(doc, loop.measurement, loop.setpoint);
  return (
    <>
      <div className="row">
        <SelectField label="Measurement" value={loop.measurement} options={stateOptions} message={at('measurement')}
          help="The measured state the loop holds at its setpoint."
          onChange={(measurement) => edit('choose the measurement', (l) => ({ ...l, measurement }), 'measurement')} />
        <SelectField label="Setpoint" value={fixed ? FIXED : String(loop.setpoint)}
          options={[{ value: FIXED, label: 'A fixed value' }, ...stateOptions]} message={typeof loop.setpoint === 'string' ? at('setpoint') : null}
          help="A constant, or a state column that carries the setpoint."
          onChange={(v) => edit('choose the setpoint', (l) => ({ ...l, setpoint: v === FIXED ? fixedSetpointFor(doc, l.measurement) : v }), 'setpoint')} />
        {fixed && (
          <NumberField label={`Setpoint value (${measurementUnit})`} value={loop.setpoint as number} message={at('setpoint')}
            onCommit={(v) => v !== null && edit('set the setpoint', (l) => ({ ...l, setpoint: v }), 'setpoint')} onBlur={documents.closeStep} />
        )}
      </div>
      <div className="row">
        {leading}
        <SelectField label="Direction" value={loop.action} message={at('action')}
          options={[
            { value: 'reverse', label: 'Reverse (e.g. heating)' },
            { value: 'direct', label: 'Direct (e.g. cooling)' },
          ]}
          help={loop.action === 'reverse'
            ? 'Reverse: the output rises when the measurement is below the setpoint (e.g. heating).'
            : 'Direct: the output rises when the measurement is above the setpoint (e.g. cooling).'}
          onChange={(dir) => edit('change the direction', (l) => ({ ...l, action: dir }), 'action')} />
        <NumberField label={`Proportional gain K_{c} (${actionUnit} per ${measurementUnit})`} value={loop.proportionalGain} message={at('proportionalGain')}
          help="0 or more; the direction sets the sign."
          onCommit={(v) => v !== null && edit('set the proportional gain', (l) => ({ ...l, proportionalGain: v }), 'proportionalGain')} onBlur={documents.closeStep} />
      </div>
      <div className="row">
        <SelectField<IntegralMode> label="Integral action" value={mode} message={mode === 'gain' ? null : at('integralGain')}
          options={[
            { value: 'none', label: 'None (P only)' },
            { value: 'time', label: 'Integral time' },
            { value: 'gain', label: 'Integral gain' },
          ]}
          help="K_{i} = K_{c} / T_{i}; give whichever you tune by."
          onChange={(m) => edit('change the integral action', (l) => withIntegralMode(l, m, doc), 'integralMode')} />
        {mode === 'time' && (
          <NumberField label="Integral time T_{i} (s)" value={loop.integralTimeSeconds ?? null} message={at('integralTimeSeconds')}
            help="Above 0; a longer time is gentler integral action."
            onCommit={(v) => v !== null && edit('set the integral time', (l) => ({ ...l, integralTimeSeconds: v }), 'integralTimeSeconds')} onBlur={documents.closeStep} />
        )}
        {mode === 'gain' && (
          <NumberField label={`Integral gain K_{i} (${actionUnit} per ${measurementUnit}·s)`} value={loop.integralGain ?? null} message={at('integralGain')}
            help="0 or more."
            onCommit={(v) => v !== null && edit('set the integral gain', (l) => ({ ...l, integralGain: v }), 'integralGain')} onBlur={documents.closeStep} />
        )}
        {mode !== 'none' && (
          <SelectField label="Error-integral state" value={loop.integralState ?? NONE} message={at('integralState')}
            options={[{ value: NONE, label: 'Not chosen' }, ...stateOptions]}
            help="The state that sums (setpoint − measurement)·Δt over the run."
            onChange={(v) => edit('choose the error-integral state', (l) => withIntegralState(l, v === NONE ? undefined : v), 'integralState')} />
        )}
      </div>
      {mode !== 'none' && integrals.length === 0 && (
        <p className="small muted" data-testid="integral-state-hint">
          This project has no error integral of {loop.measurement}: add one in the project file under columns.derived
          (kind “errorIntegral”, measurement “{loop.measurement}”, setpoint {JSON.stringify(loop.setpoint)}) and give it the role “state”.
        </p>
      )}
    </>
  );
}

function withIntegralState<L extends Feedback>(loop: L, integralState: string | undefined): L {
  const { integralState: _old, ...rest } = loop;
  return (integralState === undefined ? rest : { ...rest, integralState }) as L;
}
