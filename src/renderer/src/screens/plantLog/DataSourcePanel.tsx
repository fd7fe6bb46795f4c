/**
 * Where the data comes from: the file picker, or a file dropped on the panel. A dropped file is
 * read at once, but the main process never learns its path, so the project can only be saved after
 * the same file is chosen with the picker (the panel says so).
 */
import { useState } from 'react';
import { ProblemList } from '../../components/ProblemList';
import { fileNameOf } from '../../document/dataPath';
import { useDocument, useSession } from '../../hooks';
import { useWorkspace } from '../../WorkspaceContext';

export function DataSourcePanel() {
  const { data } = useWorkspace();
  const doc = useDocument();
  const session = useSession();
  const [dragging, setDragging] = useState(false);
  const drop = (e: React.DragEvent): void => {
    e.preventDefault();
    setDragging(false);
    const file = e.dataTransfer.files[0];
    if (file) void data.dropDataFile(file);
  };
  const source = session.source;
  return (
    <section className="panel" aria-labelledby="data-heading">
      <h3 id="data-heading">Data file</h3>
      <div
        className={`dropzone ${dragging ? 'active' : ''}`} data-testid="dropzone"
        onDragOver={(e) => { e.preventDefault(); setDragging(true); }} onDragLeave={() => setDragging(false)} onDrop={drop}
      >
        <p>{source.kind === 'none' ? 'Choose the CSV file of logged plant data, or drop it here.' : 'Choose another file, or drop one here, to replace it.'}</p>
        <button className="primary" onClick={() => void data.chooseDataFile()} data-testid="choose-data">Choose CSV file…</button>
      </div>
      {source.kind !== 'none' && (
        <dl className="facts">
          <dt>File</dt><dd className="mono" data-testid="data-file">{source.kind === 'file' ? source.absolutePath : source.fileName}</dd>
          <dt>Stored in the project as</dt><dd className="mono">{doc.data.path || '—'}</dd>
          <dt>Size</dt><dd>{(source.bytes.length / 1024).toLocaleString('en-US', { maximumFractionDigits: 1 })} KiB</dd>
        </dl>
      )}
      {source.kind === 'dropped' && (
        <p className="problems warning" role="status">
          “{fileNameOf(source.fileName)}” was dropped, so it is read for this session only: the project cannot find it again later.
          Before saving, choose the same file with <strong>Choose CSV file…</strong>.
        </p>
      )}
      <ProblemList title="The data file could not be read" problems={session.dataProblems} testId="data-problems" />
      {session.dataMissing && doc.data.path !== '' && (
        <button onClick={() => void data.relocateDataFile()} data-testid="relocate-data">Locate the data file…</button>
      )}
    </section>
  );
}
