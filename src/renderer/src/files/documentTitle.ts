/** Keep the window's title and close prompt in step with the document's name and unsaved changes. */
import type { AppApi } from '../../../shared/appApi';
import { isDirty, type DocumentStore } from '../document/documentStore';

export function syncDocumentState(api: AppApi, documents: DocumentStore): () => void {
  let last = '';
  const update = (): void => {
    const state = documents.get();
    const next = { name: state.history.present.name, dirty: isDirty(state) };
    const key = JSON.stringify(next);
    if (key === last) return;
    last = key;
    api.setDocumentState(next);
  };
  update();
  return documents.subscribe(update);
}
