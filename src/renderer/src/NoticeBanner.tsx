/** The session's notice (a project file that could not be opened or saved …) under the toolbar. */
import { useSession } from './hooks';
import { useWorkspace } from './WorkspaceContext';

export function NoticeBanner() {
  const { session } = useWorkspace();
  const notice = useSession().notice;
  if (!notice) return null;
  const close = (): void => session.set((s) => ({ ...s, notice: null }));
  return (
    <div className={`notice ${notice.tone}`} role={notice.tone === 'error' ? 'alert' : 'status'} data-testid="notice">
      <div className="notice-head">
        <strong>{notice.title}</strong>
        <button onClick={close} aria-label="Dismiss this message">Dismiss</button>
      </div>
      {notice.problems.length > 0 && (
        <ul>{notice.problems.map((p, i) => <li key={i}><span className="mono">{p.where}</span>: {p.message}</li>)}</ul>
      )}
    </div>
  );
}
