/**
 * The text of a project document, made cheaply enough for the page's main thread. A document with
 * kept results is mostly those results (surfaces and histories as long number arrays), which change
 * once or twice per run while settings change with every edit. So:
 *   - settingsText: the document without its results, for "unsaved changes" (the results are
 *     compared by identity: a new run makes a new results object);
 *   - serializedDocument: the whole file's text, serializeProject's exact output, with the results'
 *     part written once per results object and spliced in (JSON.stringify with a 2-space indent
 *     writes a member one level deep as its own text with every line break followed by 2 spaces).
 */
import { serializeProject } from '../../../project/projectFile';
import type { ProjectDocument, SavedResults } from '../../../project/schema';

const settingsTexts = new WeakMap<ProjectDocument, string>();
const resultsTexts = new WeakMap<SavedResults, string>();
const documentTexts = new WeakMap<ProjectDocument, string>();

/** The document as its file would hold it without the results, once per document object. */
export function settingsText(document: ProjectDocument): string {
  let text = settingsTexts.get(document);
  if (text === undefined) {
    text = serializeProject({ ...document, results: undefined });
    settingsTexts.set(document, text);
  }
  return text;
}

/** The results as they sit one level deep in the file, once per results object. */
function resultsText(results: SavedResults): string {
  let text = resultsTexts.get(results);
  if (text === undefined) {
    text = JSON.stringify(results, null, 2).replace(/\n/g, '\n  ');
    resultsTexts.set(results, text);
  }
  return text;
}

const MARK = '\u0000kept results\u0000';

/** Exactly serializeProject(document), computed once per document object and once per results object. */
export function serializedDocument(document: ProjectDocument): string {
  let text = documentTexts.get(document);
  if (text === undefined) {
    const results = document.results;
    if (!results) text = serializeProject(document);
    else {
      const marked = serializeProject({ ...document, results: MARK as unknown as SavedResults });
      const placeholder = `"results": ${JSON.stringify(MARK)}`, at = marked.lastIndexOf(placeholder);
      text = `${marked.slice(0, at)}"results": ${resultsText(results)}${marked.slice(at + placeholder.length)}`;
    }
    documentTexts.set(document, text);
  }
  return text;
}
