/** Step 1, the plant log: the project, the data file, how to read it, the column roles and the import. */
import { ColumnRoleTable } from './ColumnRoleTable';
import { CsvSettingsPanel } from './CsvSettingsPanel';
import { DataSourcePanel } from './DataSourcePanel';
import { ImportSummary } from './ImportSummary';
import { TrendPanel } from './TrendPanel';
import { ProjectNameFields } from './ProjectNameFields';
import { RewardAndEpisodes } from './RewardAndEpisodes';
import { useDocument, useSession } from '../../hooks';
import { Cautions } from '../../components/Cautions';
import { SAMPLE_PROJECTS } from '../../help/sampleProjects';
import { useWorkspace } from '../../WorkspaceContext';

export function PlantLogScreen(props: { onNext: () => void }) {
  const session = useSession();
  const doc = useDocument();
  return (
    <>
      <header>
        <h2>Plant log</h2>
        <p>
          Start with the data logged under the present controller: a CSV file with one row per sample. Choose the file, tell the program which
          columns are states, actions and the reward or cost, and check the import below before going on.
        </p>
      </header>
      {doc.data.path === '' && <Welcome />}
      <ProjectNameFields />
      <DataSourcePanel />
      {session.inspection && (
        <>
          <CsvSettingsPanel />
          <ColumnRoleTable />
          <RewardAndEpisodes />
        </>
      )}
      <ImportSummary />
      {session.inspection && <TrendPanel />}
      <button className="primary" onClick={props.onNext} disabled={session.importState.status !== 'done'} data-testid="next-candidates">
        Next: candidates
      </button>
    </>
  );
}

/** For a new project: what the tool does, the five steps, and the cautions before any number is seen. */
function Welcome() {
  const { files } = useWorkspace();
  return (
    <section className="panel" aria-labelledby="welcome-heading" data-testid="welcome">
      <h3 id="welcome-heading">What this does</h3>
      <p>
        From data logged under the present controller, Setpoint Critic estimates how a candidate setpoint policy would perform before it touches
        the plant: it fits the candidate’s action-value function by fitted Q-evaluation and reports its value beside what the plant does today.
        Go through the steps on the left in order; each says what it still needs. To continue earlier work, use <strong>Open…</strong>;
        to try the app first, open a sample project: {SAMPLE_PROJECTS.map((s, i) => (
          <span key={s.id}>{i > 0 ? ', ' : ''}<button className="link" onClick={() => void files.openSample(s.id)} data-testid={`welcome-sample-${s.id}`}>{s.title}</button></span>
        ))}. <strong>Help</strong> (F1) explains every term.
      </p>
      <Cautions />
    </section>
  );
}
