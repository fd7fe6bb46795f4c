/**
 * The semantics of every AppApi method (src/shared/appApi.ts) in plain Node, for one window: the
 * Electron IPC handlers and the e2e test server both call this, so the rules are exercised for real
 * in the end-to-end tests. Arguments arrive already validated (apiDispatch.ts).
 *
 * Errors that a user can act on are thrown as FileAccessError / AccessDeniedError with a message
 * naming the file; saves report them in the SaveReply instead.
 */
import type { AppApi, DataFileReply, ExportKind, ProjectFileReply, RecoveryOffer, SaveReply } from '../shared/appApi';
import type { AppContext } from './appContext';
import type { Dialogs } from './dialogs';
import { FileAccessError, describeFileError } from './fileErrors';
import { fingerprintPaced } from './fileVersions';
import { EXPORT_EXTENSIONS, PROJECT_EXTENSION, suggestedFileName, withExtension } from './fileNames';
import { pathApi } from './pathIdentity';
import { resolveDataPath } from './pathAccess';
import { overwriteRefusal, referencedDataPath } from './projectReferences';
import type { RecoveryGrants } from './recoveryStore';
import { ReportPrintError, type ReportPrinter } from './reportPrinting';

export interface DocumentState {
  name: string;
  dirty: boolean;
}

export type AppService = Omit<AppApi, 'host' | 'onMenuCommand'> & {
  documentState(): DocumentState;
};

export interface AppSession {
  /** Names this window's recovery copy: letters, digits, "-" or "_". */
  slot: string;
  /** Native dialogs, parented to this window. */
  dialogs: Dialogs;
  onDocumentState?: (state: DocumentState) => void;
  /** Every save's outcome, so a close that asked the renderer to save knows when it is done. */
  onSaveReply?: (reply: SaveReply) => void;
  /** Prints the report or writes it as PDF (electronPrinter.ts); absent where the host cannot print. */
  printer?: ReportPrinter;
}

/** The main process refused a path the user did not choose; the message says so. */
export class AccessDeniedError extends Error {
  constructor(message: string) {
    super(message);
    this.name = 'AccessDeniedError';
  }
}

export function createAppService(context: AppContext, session: AppSession): AppService {
  const { access, recent, recovery, store } = context;
  const { dialogs } = session;
  const api = pathApi(context.flavour);
  let documentState: DocumentState = { name: '', dirty: false };
  let claimedOffer: RecoveryOffer | null = null;

  const fileName = (path: string) => api.basename(path);
  const toForwardSlashes = (path: string) => (context.flavour === 'win32' ? path.replace(/\\/g, '/') : path);

  async function openProjectAt(path: string): Promise<ProjectFileReply> {
    const text = await store.readText(path);
    context.versions.remember(path, text);
    access.grantProject(path, referencedDataPath(text, fileName(path)));
    await recent.add(path).catch((e: unknown) => context.report(describeFileError(e, 'update the recent list at', path).message));
    return { path, text };
  }

  async function dataReply(path: string, projectPath: string | null): Promise<DataFileReply> {
    const bytes = await store.readBytes(path);
    const relativePath = projectPath === null ? path : toForwardSlashes(api.relative(api.dirname(projectPath), path) || api.basename(path));
    return { path, relativePath, bytes, sha256: await fingerprintPaced(bytes) };
  }

  async function chooseData(projectPath: string | null): Promise<DataFileReply | null> {
    const path = await dialogs.showOpenData();
    if (path === null) return null;
    access.grantFile(path);
    return dataReply(path, projectPath);
  }

  /** What this session allows for `text` at `projectPath` (never more than the user already granted): for a recovery copy. */
  function grantsFor(text: string, projectPath: string | null): RecoveryGrants {
    const named = referencedDataPath(text, projectPath === null ? 'recovery' : fileName(projectPath));
    const data = named === null ? null : projectPath === null ? (api.isAbsolute(named) ? named : null) : resolveDataPath(projectPath, named, context.flavour);
    const projectFileSha256 = projectPath === null ? undefined : context.versions.known(projectPath);
    return { dataPaths: data !== null && access.mayReadData(data) ? [data] : [], ...(projectFileSha256 ? { projectFileSha256 } : {}) };
  }

  async function writeProject(text: string, path: string): Promise<SaveReply> {
    try {
      // Written first so a crash mid-save still leaves these exact words to recover.
      await recovery.write(session.slot, text, path, context.now(), grantsFor(text, path));
      await store.writeAtomic(path, text, { backup: true });
    } catch (e) {
      return { saved: false, reason: 'error', message: describeFileError(e, 'save', path).message };
    }
    context.versions.remember(path, text);
    // A save passes on only data the user already allowed: the renderer's text grants nothing.
    access.carryData(path, referencedDataPath(text, fileName(path)));
    claimedOffer = null;
    await recovery.discard(session.slot).catch((e: unknown) => context.report(`Could not remove the recovery copy after saving: ${String(e)}`));
    await recent.add(path).catch((e: unknown) => context.report(describeFileError(e, 'update the recent list at', path).message));
    return { saved: true, path };
  }

  async function saveWithDialog(text: string, suggestedName: string): Promise<SaveReply> {
    const chosen = await dialogs.showSaveProject(suggestedFileName(suggestedName, PROJECT_EXTENSION));
    if (chosen === null) return { saved: false, reason: 'cancelled' };
    return writeProject(text, withExtension(chosen, PROJECT_EXTENSION));
  }

  async function saveToKnownPath(text: string, path: string): Promise<SaveReply> {
    if (!access.isProject(path) && !(await recent.includes(path))) {
      return { saved: false, reason: 'error', message: `"${path}" was not opened or chosen in this session, so it is not written; use Save As.` };
    }
    let existing: string | null = null;
    try {
      existing = await store.readText(path);
    } catch (e) {
      if (!(e instanceof FileAccessError && e.code === 'ENOENT')) return { saved: false, reason: 'error', message: describeFileError(e, 'save', path).message };
    }
    const refusal = existing === null ? null : overwriteRefusal(existing, fileName(path));
    if (refusal !== null) {
      return { saved: false, reason: 'error', message: `"${path}" was left unchanged: the file there is not a project this version can replace (${refusal}). Use Save As to save under another name.` };
    }
    if (existing !== null && context.versions.changed(path, existing)) {
      const choice = await dialogs.confirmReplaceChanged(fileName(path));
      if (choice === 'cancel') return { saved: false, reason: 'cancelled' };
      if (choice === 'saveAs') return saveWithDialog(text, api.basename(path, PROJECT_EXTENSION));
    }
    return writeProject(text, path);
  }

  async function notifySave(pending: Promise<SaveReply>): Promise<SaveReply> {
    const reply = await pending;
    session.onSaveReply?.(reply);
    return reply;
  }

  async function readProjectData(projectPath: string, relativePath: string): Promise<DataFileReply> {
    const decision = access.projectData(projectPath, relativePath);
    if (!decision.allowed) throw new AccessDeniedError(decision.message);
    return dataReply(decision.path, projectPath);
  }

  async function openRecentProject(path: string): Promise<ProjectFileReply> {
    if (!(await recent.includes(path)) && !access.isProject(path)) throw new AccessDeniedError(`"${path}" is not in the recent-projects list.`);
    return openProjectAt(path);
  }

  /**
   * A leftover copy of an earlier run. Its project path was checked when the copy was written
   * (writeRecovery), and only the grants recorded then are given back — never what its text names.
   */
  async function pendingRecovery(): Promise<RecoveryOffer | null> {
    if (claimedOffer) return claimedOffer;
    const copy = await recovery.claimLeftover(session.slot);
    if (!copy) return (claimedOffer = null);
    const { grants, ...offer } = copy;
    if (offer.projectPath) {
      access.grantProject(offer.projectPath, null);
      for (const data of grants?.dataPaths ?? []) access.grantProject(offer.projectPath, data);
      if (grants?.projectFileSha256) context.versions.adopt(offer.projectPath, grants.projectFileSha256);
    } else for (const data of grants?.dataPaths ?? []) access.grantFile(data);
    claimedOffer = offer;
    return offer;
  }

  async function exportFile(kind: ExportKind, suggestedName: string, bytes: Uint8Array): Promise<{ path: string } | null> {
    const extension = EXPORT_EXTENSIONS[kind];
    const chosen = await dialogs.showExport(kind, suggestedFileName(suggestedName, extension, 'plot'));
    if (chosen === null) return null;
    const path = withExtension(chosen, extension);
    await store.writeAtomic(path, bytes, { backup: false });
    return { path };
  }

  function printer(): ReportPrinter {
    if (!session.printer) throw new ReportPrintError('Printing is not available in this window; write the report as HTML and print it from a browser.');
    return session.printer;
  }

  /** The PDF is made only after the user chose where it goes, then written like every export (atomic). */
  async function saveReportPdf(html: string, suggestedName: string): Promise<{ path: string } | null> {
    const chosen = await dialogs.showExport('pdf', suggestedFileName(suggestedName, EXPORT_EXTENSIONS.pdf, 'report'));
    if (chosen === null) return null;
    const path = withExtension(chosen, EXPORT_EXTENSIONS.pdf);
    await store.writeAtomic(path, await printer().toPdf(html), { backup: false });
    return { path };
  }

  return {
    async openProjectDialog() {
      const path = await dialogs.showOpenProject();
      return path === null ? null : openProjectAt(path);
    },
    openRecentProject,
    recentProjects: () => recent.list(),
    chooseDataFile: chooseData,
    readProjectData,
    relocateDataFile: (projectPath) => chooseData(projectPath),
    saveProject: (text, path, suggestedName) => notifySave(path === null ? saveWithDialog(text, suggestedName) : saveToKnownPath(text, path)),
    saveProjectAs: (text, suggestedName) => notifySave(saveWithDialog(text, suggestedName)),
    async writeRecovery(text, projectPath) {
      // A copy names only a project this session opened or saved: otherwise a crash would turn any path into a save target.
      if (projectPath !== null && !access.isProject(projectPath) && !(await recent.includes(projectPath))) {
        throw new AccessDeniedError(`"${projectPath}" is not a project opened or saved in this session, so no recovery copy is kept for it.`);
      }
      claimedOffer = null;
      await recovery.write(session.slot, text, projectPath, context.now(), grantsFor(text, projectPath));
    },
    pendingRecovery,
    async discardRecovery() {
      claimedOffer = null;
      await recovery.discard(session.slot);
    },
    exportFile,
    saveReportPdf,
    printReport: (html) => printer().print(html),
    setDocumentState(state) {
      documentState = { name: state.name, dirty: state.dirty };
      session.onDocumentState?.(documentState);
    },
    documentState: () => documentState,
  };
}
