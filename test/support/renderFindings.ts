/**
 * A Findings panel rendered to static HTML as the app renders it (react-dom/server), inside the
 * workspace it reads (a new project's document; no IPC, no worker), with the sections it belongs to
 * unfolded as the reader opens them; and the text of a rendered table's cells.
 */
import { createElement, type ReactElement } from 'react';
import { renderToStaticMarkup } from 'react-dom/server';
import { createDocumentStore } from '../../src/renderer/src/document/documentStore';
import { WorkspaceContext } from '../../src/renderer/src/WorkspaceContext';
import type { Workspace } from '../../src/renderer/src/workspace';
import { projectKey, setOpen } from '../../src/renderer/src/screens/findings/foldMemory';
import type { SectionId } from '../../src/renderer/src/screens/findings/findingsSections';

export function renderFindings(panel: ReactElement, open: readonly SectionId[]): string {
  const documents = createDocumentStore();
  const { projectPath, generation } = documents.get();
  setOpen(projectKey(projectPath, generation), open, true);
  return renderToStaticMarkup(createElement(WorkspaceContext.Provider, { value: { documents, api: {} } as unknown as Workspace }, panel));
}

/** The text of every cell of the table with this data-testid, row by row, markup dropped; `spaces` reads U+00A0 as a space. */
export function tableCells(html: string, testId: string, spaces = true): string[][] {
  const table = new RegExp(`<table[^>]*data-testid="${testId}"[^>]*>([\\s\\S]*?)</table>`).exec(html);
  if (!table) throw new Error(`no table ${testId} in the rendered panel`);
  const text = (cell: string) => {
    const plain = cell.replace(/<[^>]+>/g, '').replace(/&amp;/g, '&').replace(/&#x27;/g, "'").replace(/&quot;/g, '"').replace(/&lt;/g, '<').replace(/&gt;/g, '>').trim();
    return spaces ? plain.replace(/\u00a0/g, ' ') : plain;
  };
  return [...table[1].matchAll(/<tr[^>]*>([\s\S]*?)<\/tr>/g)].map((row) => [...row[1].matchAll(/<t[hd][^>]*>([\s\S]*?)<\/t[hd]>/g)].map((c) => text(c[1])));
}
