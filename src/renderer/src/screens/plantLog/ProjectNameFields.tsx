/** The project's name and description (the name titles the window, exports and the saved file). */
import { TextField } from '../../components/TextField';
import { problemAt } from '../../document/projectProblems';
import { useDocument, useProblems } from '../../hooks';
import { useWorkspace } from '../../WorkspaceContext';

export function ProjectNameFields() {
  const { documents } = useWorkspace();
  const doc = useDocument();
  const problems = useProblems();
  return (
    <section className="panel" aria-labelledby="project-heading">
      <h3 id="project-heading">Project</h3>
      <div className="row">
        <TextField
          label="Project name" value={doc.name} className="wide" message={problemAt(problems, 'name')}
          help="Titles the window, the saved file and every exported picture."
          onChange={(name) => documents.edit('rename the project', (d) => ({ ...d, name }), 'name')} onBlur={documents.closeStep}
        />
        <TextField
          label="Description" value={doc.description} className="wide prose" multiline
          help="What the project is about (optional)."
          onChange={(description) => documents.edit('edit the description', (d) => ({ ...d, description }), 'description')} onBlur={documents.closeStep}
        />
      </div>
    </section>
  );
}
