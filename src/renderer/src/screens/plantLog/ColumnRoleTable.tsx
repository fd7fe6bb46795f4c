/**
 * One row per CSV column: its name, the first values, its role, and a unit for states and
 * actions. Roles are written to the document through columnRoles, which keeps the candidates'
 * gains, offsets and limits in shape as states and actions come and go.
 */
import { assignRole, roleOf, setUnit, type ColumnRole } from '../../document/columnRoles';
import { useDocument, useSession } from '../../hooks';
import { useWorkspace } from '../../WorkspaceContext';
import { UnitField } from './UnitField';

const BASE_ROLES: { value: ColumnRole; label: string }[] = [
  { value: 'unused', label: 'Not used' },
  { value: 'state', label: 'State' },
  { value: 'action', label: 'Action' },
  { value: 'reward', label: 'Reward (higher is better)' },
  { value: 'cost', label: 'Cost (lower is better)' },
  { value: 'episode', label: 'Run or batch label' },
  { value: 'timestamp', label: 'Timestamp' },
  { value: 'terminal', label: 'End-of-run flag (1 = the run ends here)' },
];

/** The role as the undo list names it: "make run the run label". */
const ROLE_WORDS: Partial<Record<ColumnRole, string>> = {
  state: 'a state', action: 'an action', reward: 'the reward', cost: 'the cost', episode: 'the run label', timestamp: 'the timestamp', terminal: 'the end-of-run flag',
};

/** The timestamp splits the runs at its gaps unless a column labels them (then it is the log's clock, which may restart in each run). */
function rolesFor(episode: { kind: string }): { value: ColumnRole; label: string }[] {
  const timestamp = episode.kind === 'column' ? 'Timestamp (the log’s clock; runs from the run label)' : 'Timestamp (runs split at gaps)';
  return BASE_ROLES.map((r) => (r.value === 'timestamp' ? { ...r, label: timestamp } : r));
}

export function ColumnRoleTable() {
  const { documents } = useWorkspace();
  const doc = useDocument();
  const inspection = useSession().inspection;
  if (!inspection) return null;
  const { header, previewRows } = inspection;
  const nextRoles = doc.columns.states.map((s) => ({ value: `next:${s.column}` as ColumnRole, label: `Next value of ${s.column}` }));
  const setRole = (column: string, role: ColumnRole): void =>
    documents.edit(`make ${column} ${role === 'unused' ? 'unused' : ROLE_WORDS[role] ?? `the ${role.replace('next:', 'next value of ')}`}`, (d) => assignRole(d, header, column, role));
  const roles = rolesFor(doc.columns.episode);
  return (
    <section className="panel" aria-labelledby="roles-heading">
      <h3 id="roles-heading">Column roles</h3>
      <p className="muted">
        Give each column its role. States (1–10) describe the plant; actions (1–3) are what the controller set; one column is the reward or the cost,
        or write an expression below. Units label the axes of every plot; the cost’s unit is the unit of J, V and Q.
      </p>
      <div className="table-scroll">
        <table data-testid="role-table">
          <thead><tr><th scope="col">Column</th><th scope="col">First values</th><th scope="col">Role</th><th scope="col">Unit</th></tr></thead>
          <tbody>
            {header.map((column, index) => {
              const role = roleOf(doc.columns, column);
              const signal = [...doc.columns.states, ...doc.columns.actions].find((s) => s.column === column);
              const reward = doc.columns.reward;
              const isValue = reward.kind === 'column' && reward.column === column;
              return (
                <tr key={`${column}-${index}`}>
                  <th scope="row" className="mono">{column}</th>
                  <td className="mono small">{previewRows.slice(0, 3).map((r) => r[index] ?? '').join(', ')}</td>
                  <td>
                    <label className="sr-only" htmlFor={`role-${index}`}>Role of {column}</label>
                    <select id={`role-${index}`} data-testid={`role-${column}`} value={role} onChange={(e) => setRole(column, e.target.value as ColumnRole)}>
                      {[...roles, ...nextRoles.filter((r) => r.value !== `next:${column}`)].map((r) => <option key={r.value} value={r.value}>{r.label}</option>)}
                    </select>
                  </td>
                  <td>
                    {isValue && (
                      <>
                        <label className="sr-only" htmlFor={`unit-${index}`}>Unit of {column}</label>
                        <UnitField
                          id={`unit-${index}`} testId={`unit-${column}`} value={reward.unit ?? ''} placeholder="e.g. €, kWh" title="The cost’s own unit: J, V and Q are given in it"
                          onChange={(unit) => documents.edit(`set the unit of ${column}`, (d) => ({ ...d, columns: { ...d.columns, reward: { ...d.columns.reward, unit } } }), `unit-${column}`)}
                          onBlur={documents.closeStep}
                        />
                      </>
                    )}
                    {signal && (
                      <>
                        <label className="sr-only" htmlFor={`unit-${index}`}>Unit of {column}</label>
                        <UnitField
                          id={`unit-${index}`} testId={`unit-${column}`} value={signal.unit} placeholder="e.g. m, °C, %"
                          onChange={(unit) => documents.edit(`set the unit of ${column}`, (d) => setUnit(d, column, unit), `unit-${column}`)}
                          onBlur={documents.closeStep}
                        />
                      </>
                    )}
                  </td>
                </tr>
              );
            })}
          </tbody>
        </table>
      </div>
    </section>
  );
}
