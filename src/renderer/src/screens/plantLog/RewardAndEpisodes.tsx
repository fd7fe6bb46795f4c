/**
 * The reward (a column, or an expression over columns, in reward or cost sense), how the log splits
 * into episodes, and where the next state comes from. Column choices themselves are made in the
 * role table; this panel shows what follows from them and holds the settings that are not columns.
 */
import { NumberField } from '../../components/NumberField';
import { TextField } from '../../components/TextField';
import { problemAt, type FieldProblem } from '../../document/projectProblems';
import { useDocument, useProblems, useSession } from '../../hooks';
import { useWorkspace } from '../../WorkspaceContext';
import type { ColumnRoles } from '../../../../project/schema';
import { formulaBoundsText } from './formulaBoundsText';
import { valueUnitText } from '../../../../pipeline/valueUnitWords';

type SetColumns = (label: string, change: Partial<ColumnRoles>, key?: string) => void;

interface PartProps {
  columns: ColumnRoles;
  problems: readonly FieldProblem[];
  set: SetColumns;
  closeStep: () => void;
}

export function RewardAndEpisodes() {
  const { documents } = useWorkspace();
  const doc = useDocument();
  const problems = useProblems();
  const set: SetColumns = (label, change, key) => documents.edit(label, (d) => ({ ...d, columns: { ...d.columns, ...change } }), key);
  const parts = { columns: doc.columns, problems, set, closeStep: documents.closeStep };
  return (
    <section className="panel" aria-labelledby="reward-heading">
      <h3 id="reward-heading">Reward, runs and next state</h3>
      <RewardFieldset {...parts} />
      <EpisodeFieldset {...parts} />
      <NextStateFieldset {...parts} />
    </section>
  );
}

function RewardFieldset({ columns, problems, set, closeStep }: PartProps) {
  const reward = columns.reward;
  const decimalComma = useSession().inspection?.decimalMark === ',';
  const columnProblem = reward.kind === 'column' ? problemAt(problems, 'columns.reward.column') : null;
  return (
    <fieldset>
      <legend>Reward</legend>
      <label className="choice">
        <input type="radio" name="reward-kind" checked={reward.kind === 'column'} data-testid="reward-from-column"
          onChange={() => set('take the reward from a column', { reward: { kind: 'column', column: '', sense: reward.sense } })} />
        From a column (give it the role “Reward” or “Cost” above){reward.kind === 'column' && reward.column ? `: ${reward.column}` : ''}
      </label>
      <label className="choice">
        <input type="radio" name="reward-kind" checked={reward.kind === 'expression'} data-testid="reward-from-expression"
          onChange={() => set('write a reward expression', { reward: { kind: 'expression', expression: '', sense: reward.sense } })} />
        From an expression over columns
      </label>
      {reward.kind === 'expression' && (
        <>
          <TextField
            label="Expression" value={reward.expression} multiline className="wide" placeholder="e.g. (level_upper_m - 1.2)^2 + 0.01 * inflow_valve_pct"
            help={`Column names (names with spaces in \`backticks\`), numbers, + − * / ^, parentheses, abs, exp, log, sqrt, min, max, clamp.${decimalComma ? ' This file uses a decimal comma: write 0,5 and separate arguments with ; (as in max(a; 0,5)).' : ''}`}
            message={problemAt(problems, 'columns.reward.expression')}
            onChange={(expression) => set('edit the reward expression', { reward: { ...reward, expression } }, 'reward-expression')}
            onBlur={closeStep}
          />
          <div className="choice" role="radiogroup" aria-label="Sense of the expression">
            <label className="choice"><input type="radio" name="sense" checked={reward.sense === 'reward'} onChange={() => set('treat the expression as a reward', { reward: { ...reward, sense: 'reward' } })} /> a reward (higher is better)</label>
            <label className="choice"><input type="radio" name="sense" checked={reward.sense === 'cost'} onChange={() => set('treat the expression as a cost', { reward: { ...reward, sense: 'cost' } })} /> a cost (lower is better)</label>
          </div>
        </>
      )}
      {reward.kind === 'column' && <DeclaredBounds reward={reward} problems={problems} set={set} closeStep={closeStep} />}
      {reward.kind === 'expression' && <FormulaBounds reward={reward} decimalComma={decimalComma} />}
      {columnProblem && <p className="error-text">{columnProblem}</p>}
    </fieldset>
  );
}

type ColumnReward = Extract<ColumnRoles['reward'], { kind: 'column' }>;

/** What the column's definition guarantees (e.g. a cost that sums squares is never below 0): checked on every row, and where a range to report is cut. */
function DeclaredBounds({ reward, problems, set, closeStep }: { reward: ColumnReward; problems: readonly FieldProblem[]; set: SetColumns; closeStep: () => void }) {
  const what = reward.sense === 'cost' ? 'cost' : 'reward';
  // A bound is a value of the cost itself: in its unit where the project gives one (pipeline/valueUnitWords.ts).
  const unit = valueUnitText(reward.unit), inUnit = unit ? `, in ${unit}` : '';
  const change = (field: 'atLeast' | 'atMost', v: number | null): ColumnReward => {
    const { [field]: _dropped, ...rest } = reward;
    return v === null ? rest : { ...rest, [field]: v };
  };
  return (
    <>
      <div className="row">
        <NumberField
          label={`Never below (by its definition)${inUnit}`} value={reward.atLeast ?? null} allowBlank placeholder="no floor"
          message={problemAt(problems, 'columns.reward.atLeast')}
          onCommit={(v) => set(`declare the ${what}’s floor`, { reward: change('atLeast', v) }, 'reward-at-least')} onBlur={closeStep}
        />
        <NumberField
          label={`Never above (by its definition)${inUnit}`} value={reward.atMost ?? null} allowBlank placeholder="no ceiling"
          message={problemAt(problems, 'columns.reward.atMost')}
          onCommit={(v) => set(`declare the ${what}’s ceiling`, { reward: change('atMost', v) }, 'reward-at-most')} onBlur={closeStep}
        />
      </div>
      <p className="small muted">
        Only what the {what}&rsquo;s definition guarantees on every row, whatever the plant does (e.g. 0 for a {what} that sums squares or energy used); leave blank when nothing is.
        A logged row past it is listed, by its row number, among the rows that cannot be used; a candidate’s range to report is cut at it.
      </p>
    </>
  );
}

/** What the formula keeps whatever its columns hold (src/data/expressionBounds.ts), said beside it; nothing while it does not parse. */
function FormulaBounds({ reward, decimalComma }: { reward: Extract<ColumnRoles['reward'], { kind: 'expression' }>; decimalComma: boolean }) {
  const text = formulaBoundsText(reward.expression, reward.sense, decimalComma);
  return text ? <p className="small muted" data-testid="formula-bounds">{text}</p> : null;
}


function EpisodeFieldset({ columns, problems, set, closeStep }: PartProps) {
  const episode = columns.episode;
  return (
    <fieldset>
      <legend>Runs</legend>
      <p className="small">
        {episode.kind === 'column' && <>A new run starts wherever <span className="mono">{episode.column}</span> changes.</>}
        {episode.kind === 'timeGap' && <>A new run starts where <span className="mono">{episode.column}</span> jumps by more than the gap below.</>}
        {episode.kind === 'single' && <>The whole log is one run. Give a column the role “Run or batch label” or “Timestamp” to split it.</>}
      </p>
      {episode.kind === 'timeGap' && (
        <NumberField
          label="Largest gap within a run (s)" value={episode.maxGapSeconds ?? null} allowBlank placeholder="3× median step"
          help="Leave blank for three times the median sampling period." message={problemAt(problems, 'columns.episode.maxGapSeconds')}
          onCommit={(v) => set('set the largest gap within a run', { episode: { ...episode, maxGapSeconds: v ?? undefined } }, 'max-gap')}
          onBlur={closeStep}
        />
      )}
    </fieldset>
  );
}

function NextStateFieldset({ columns, problems }: PartProps) {
  const nextState = columns.nextState;
  const problem = problemAt(problems, 'columns.nextState.columns');
  return (
    <fieldset>
      <legend>Next state</legend>
      <p className="small">
        {nextState.kind === 'nextRow'
          ? 'The next state is the next row of the same run. To give it in columns instead, give columns the role “Next value of …”.'
          : `The next state is read from columns ${nextState.columns.map((c) => c || '(not chosen)').join(', ')}, one per state.`}
      </p>
      {problem && <p className="error-text">{problem}</p>}
    </fieldset>
  );
}
