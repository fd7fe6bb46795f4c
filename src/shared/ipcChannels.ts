/**
 * The IPC contract between the preload script and the main process, declared once: the channel of
 * every AppApi method, the zod schema of its arguments, and the one validation function the main
 * process (and the e2e test server) runs before any handler sees an argument.
 *
 * Why validate in main at all when the preload is ours: the renderer is treated as untrusted
 * (Electron security checklist, "Validate the sender of all IPC messages" and "do not expose
 * Electron APIs to untrusted content" — common practice), so every argument is checked for type,
 * size and shape where it is used.
 *
 * No node: imports here — the sandboxed preload imports the channel names from this file.
 */
import { z } from 'zod';
import type { AppApi, MenuCommand } from './appApi';

/** AppApi methods that return a promise and travel as `ipcRenderer.invoke` calls. */
export type InvokeMethod = Exclude<keyof AppApi, 'host' | 'setDocumentState' | 'onMenuCommand'>;

const CHANNEL_PREFIX = 'setpoint-critic:';

export function invokeChannel(method: InvokeMethod): string {
  return `${CHANNEL_PREFIX}${method}`;
}

/** Renderer → main, one-way: the document's name and unsaved-changes flag. */
export const DOCUMENT_STATE_CHANNEL = `${CHANNEL_PREFIX}document-state`;
/** Main → renderer: a MenuCommand, with `{ path }` for open-recent-project. */
export const MENU_COMMAND_CHANNEL = `${CHANNEL_PREFIX}menu-command`;

/** What every invoke handler resolves with; the preload turns `ok: false` into a thrown Error. */
export type ApiReply<T> = { ok: true; value: T } | { ok: false; message: string };

export const MENU_COMMANDS = [
  'new-project', 'open-project', 'open-recent-project', 'save-project', 'save-project-as', 'close-project',
  'undo', 'redo', 'toggle-theme', 'run-evaluation', 'cancel-evaluation', 'print-report', 'save-report-pdf',
] as const satisfies readonly MenuCommand[];
// Compile-time check that the list above names every MenuCommand.
const _everyMenuCommand: Record<MenuCommand, true> = Object.fromEntries(MENU_COMMANDS.map((c) => [c, true])) as Record<(typeof MENU_COMMANDS)[number], true>;
void _everyMenuCommand;

/** Upper bounds that keep a misbehaving renderer from making main allocate without limit. */
const MAX_PATH_CHARS = 4096;
const MAX_NAME_CHARS = 255;
const MAX_PROJECT_TEXT_CHARS = 64 * 1024 * 1024;
const MAX_EXPORT_BYTES = 512 * 1024 * 1024;

const noNul = (text: string) => !text.includes('\u0000');
// Absolute on POSIX (/…), Windows drive (C:\… or C:/…) or UNC (\\server\…); no node:path here.
const looksAbsolute = (text: string) => text.startsWith('/') || /^[A-Za-z]:[\\/]/.test(text) || text.startsWith('\\\\');

const absolutePath = z.string({ error: 'expected a path (text)' })
  .min(1, 'expected a path, found an empty text')
  .max(MAX_PATH_CHARS, `expected a path of at most ${MAX_PATH_CHARS} characters`)
  .refine(noNul, 'a path may not contain a NUL character')
  .refine(looksAbsolute, 'expected an absolute path');

const relativeOrAbsolutePath = z.string({ error: 'expected a path (text)' })
  .min(1, 'expected a path, found an empty text')
  .max(MAX_PATH_CHARS, `expected a path of at most ${MAX_PATH_CHARS} characters`)
  .refine(noNul, 'a path may not contain a NUL character');

const fileName = z.string({ error: 'expected a file name (text)' })
  .max(MAX_NAME_CHARS, `expected a file name of at most ${MAX_NAME_CHARS} characters`)
  .refine(noNul, 'a file name may not contain a NUL character')
  .refine((text) => !/[\\/]/.test(text), 'expected a file name without folders (no / or \\)');

const projectText = z.string({ error: 'expected the project text' })
  .max(MAX_PROJECT_TEXT_CHARS, `expected at most ${MAX_PROJECT_TEXT_CHARS} characters of project text`);

const exportBytes = z.instanceof(Uint8Array, { error: 'expected the file contents as a Uint8Array' })
  .refine((bytes) => bytes.byteLength <= MAX_EXPORT_BYTES, `expected at most ${MAX_EXPORT_BYTES} bytes`);

const reportHtml = z.string({ error: 'expected the report as HTML text' })
  .max(MAX_PROJECT_TEXT_CHARS, `expected at most ${MAX_PROJECT_TEXT_CHARS} characters of report`);

/** One entry per invoke method: argument names (for messages) and the tuple schema. */
export const API_ARGUMENTS = {
  openProjectDialog: { names: [], schema: z.tuple([]) },
  openRecentProject: { names: ['path'], schema: z.tuple([absolutePath]) },
  recentProjects: { names: [], schema: z.tuple([]) },
  chooseDataFile: { names: ['projectPath'], schema: z.tuple([absolutePath.nullable()]) },
  readProjectData: { names: ['projectPath', 'relativePath'], schema: z.tuple([absolutePath, relativeOrAbsolutePath]) },
  relocateDataFile: { names: ['projectPath'], schema: z.tuple([absolutePath]) },
  saveProject: { names: ['text', 'path', 'suggestedName'], schema: z.tuple([projectText, absolutePath.nullable(), fileName]) },
  saveProjectAs: { names: ['text', 'suggestedName'], schema: z.tuple([projectText, fileName]) },
  writeRecovery: { names: ['text', 'projectPath'], schema: z.tuple([projectText, absolutePath.nullable()]) },
  pendingRecovery: { names: [], schema: z.tuple([]) },
  discardRecovery: { names: [], schema: z.tuple([]) },
  exportFile: {
    names: ['kind', 'suggestedName', 'bytes'],
    schema: z.tuple([z.enum(['png', 'svg', 'csv', 'html', 'pdf'], { error: 'expected "png", "svg", "csv", "html" or "pdf"' }), fileName, exportBytes]),
  },
  saveReportPdf: { names: ['html', 'suggestedName'], schema: z.tuple([reportHtml, fileName]) },
  printReport: { names: ['html'], schema: z.tuple([reportHtml]) },
} as const satisfies Record<InvokeMethod, { names: readonly string[]; schema: z.ZodTuple }>;

export const INVOKE_METHODS = Object.keys(API_ARGUMENTS) as InvokeMethod[];

export type ApiArguments<M extends InvokeMethod> = z.infer<(typeof API_ARGUMENTS)[M]['schema']>;
// Compile-time check that each schema's output is exactly what AppApi declares.
type SchemaMatchesApi = { [M in InvokeMethod]: ApiArguments<M> extends Parameters<AppApi[M]> ? (Parameters<AppApi[M]> extends ApiArguments<M> ? true : never) : never };
const _schemasMatchApi: SchemaMatchesApi = Object.fromEntries(INVOKE_METHODS.map((m) => [m, true])) as SchemaMatchesApi;
void _schemasMatchApi;

export const documentStateSchema = z.object({
  name: z.string({ error: 'expected the project name (text)' }).max(1000, 'expected a name of at most 1000 characters'),
  dirty: z.boolean({ error: 'expected true or false' }),
}, { error: 'expected { name, dirty }' }).strict();

/** An argument the renderer sent that its schema refuses; the message names method and argument. */
export class IpcArgumentError extends Error {
  constructor(message: string) {
    super(message);
    this.name = 'IpcArgumentError';
  }
}

export function isInvokeMethod(name: string): name is InvokeMethod {
  return Object.prototype.hasOwnProperty.call(API_ARGUMENTS, name);
}

/** Validate the raw arguments of one call; throws IpcArgumentError naming the argument. */
export function validateArguments<M extends InvokeMethod>(method: M, args: unknown): ApiArguments<M> {
  const { names, schema } = API_ARGUMENTS[method] as { names: readonly string[]; schema: z.ZodTuple };
  if (!Array.isArray(args)) throw new IpcArgumentError(`${method}: expected a list of arguments`);
  if (args.length !== names.length) {
    const expected = names.length === 0 ? 'no arguments' : `${names.length} (${names.join(', ')})`;
    throw new IpcArgumentError(`${method}: expected ${expected}, received ${args.length}`);
  }
  const parsed = schema.safeParse(args);
  if (parsed.success) return parsed.data as ApiArguments<M>;
  const issue = parsed.error.issues[0];
  const index = typeof issue.path[0] === 'number' ? issue.path[0] : -1;
  const argument = index >= 0 ? names[index] : 'arguments';
  throw new IpcArgumentError(`${method}: argument "${argument}": ${issue.message}`);
}

export function validateDocumentState(value: unknown): { name: string; dirty: boolean } {
  const parsed = documentStateSchema.safeParse(value);
  if (parsed.success) return parsed.data;
  const issue = parsed.error.issues[0];
  const field = issue.path.length > 0 ? `.${issue.path.map(String).join('.')}` : '';
  throw new IpcArgumentError(`setDocumentState: argument "state${field}": ${issue.message}`);
}
