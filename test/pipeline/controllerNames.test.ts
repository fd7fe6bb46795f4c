/**
 * One name per concept in what the engineer reads: "present controller" for the controller that
 * produced the log, as modelled from it and evaluated like a candidate, and "logged return" for the
 * discounted return the log itself earned (DEVELOPERS.md, "Words used in the code"). Every string
 * literal, template text and JSX text in the folders that write user text (app, report, figures,
 * command line, the pipeline's and core's sentences, the menu) and the prose of README.md and
 * DEVELOPERS.md are scanned for the other names these concepts have gone by. Code identifiers are
 * not user text: a literal with no space in it (a test id, a key, an import path) and markdown code
 * spans are skipped, and the few literals that must keep an old name are listed below with why.
 * The same scan finds a superscript written with a bare caret ("V^π"), which no host draws as one.
 */
import { readdirSync, readFileSync } from 'node:fs';
import { join, relative } from 'node:path';
import ts from 'typescript';
import { describe, expect, it } from 'vitest';
import { BEHAVIOUR_NAME } from '../../src/pipeline/assessAssembly';
import { PRESENT_CONTROLLER_NAME } from '../../src/pipeline/plan/presentController';
import { policyLabel } from '../../src/pipeline/policyNames';
import { LOGGED_RETURN, PRESENT_CONTROLLER } from '../../src/figures/parts/plotTheme';

const ROOT = join(__dirname, '../..');
const USER_TEXT_FOLDERS = ['src/renderer', 'src/pipeline', 'src/figures', 'src/cli', 'src/core', 'src/main', 'src/data', 'src/project'];

/** Names the two concepts went by before; each is a phrase matched as whole words, any case. */
const BANNED = [
  'logged controller', 'logging controller', "today's controller", 'today’s controller', 'current controller',
  'existing controller', 'incumbent', 'behaviour', 'behavior', 'logged policy', 'logging policy',
  'present controller, modelled', 'present controller (logged)', 'present controller, logged return',
];

/** Literals that keep an old name on purpose. */
const ALLOWED = new Set([
  // The glossary's "also called": the off-policy literature's term, named once so a reviewer can map it.
  'behaviour policy, in the off-policy literature',
  // The name an earlier version saved results under, read back as the logged return.
  'present controller, logged return',
]);

function sourceFiles(folder: string): string[] {
  return readdirSync(join(ROOT, folder), { withFileTypes: true, recursive: true })
    .filter((e) => e.isFile() && /\.tsx?$/.test(e.name))
    .map((e) => join(e.parentPath, e.name));
}

/** Every piece of text a TypeScript file could show: string literals, template parts, JSX text. */
function textsOf(file: string): string[] {
  const source = ts.createSourceFile(file, readFileSync(file, 'utf8'), ts.ScriptTarget.Latest, true, file.endsWith('x') ? ts.ScriptKind.TSX : ts.ScriptKind.TS);
  const out: string[] = [];
  const visit = (node: ts.Node): void => {
    if (ts.isStringLiteral(node) || ts.isNoSubstitutionTemplateLiteral(node) || ts.isTemplateHead(node)
      || ts.isTemplateMiddle(node) || ts.isTemplateTail(node) || ts.isJsxText(node)) out.push(node.text);
    if (ts.isImportDeclaration(node) || ts.isExportDeclaration(node)) return;
    ts.forEachChild(node, visit);
  };
  visit(source);
  return out.filter((t) => /\s/.test(t.trim()) && !ALLOWED.has(t.trim()));
}

/** Markdown prose without code spans and fenced blocks (identifiers such as `BEHAVIOUR_NAME`). */
function proseOf(file: string): string[] {
  const prose = readFileSync(join(ROOT, file), 'utf8').replace(/```[\s\S]*?```/g, '').replace(/`[^`\n]*`/g, '');
  return [[...ALLOWED].reduce((text, allowed) => text.replaceAll(allowed, ''), prose)];
}

const phrase = (p: string): RegExp => new RegExp(`(^|[^\\w])${p.replace(/[.*+?^${}()|[\]\\]/g, '\\$&')}($|[^\\w])`, 'i');

function hits(label: string, texts: string[]): string[] {
  return texts.flatMap((t) => BANNED.filter((b) => phrase(b).test(t)).map((b) => `${label}: "${b}" in ${JSON.stringify(t.length > 120 ? `${t.slice(0, 120)}…` : t)}`));
}

describe('one name for the present controller and one for the logged return', () => {
  it('no other name for either appears in the text the app, report, exports, command line and documents show', () => {
    const found = [
      ...USER_TEXT_FOLDERS.flatMap(sourceFiles).flatMap((f) => hits(relative(ROOT, f), textsOf(f))),
      ...['README.md', 'DEVELOPERS.md'].flatMap((f) => hits(f, proseOf(f))),
    ];
    expect(found).toEqual([]);
  });

  it('no literal caret for a superscript (V^π) in user text: the markup V^{π} (drawn as a superscript) or plain Vπ', () => {
    const caret = /[A-Za-z]\^[^{]/;
    const found = USER_TEXT_FOLDERS.flatMap(sourceFiles).flatMap((f) => textsOf(f).filter((t) => caret.test(t)).map((t) => `${relative(ROOT, f)}: ${JSON.stringify(t.slice(0, 100))}`));
    expect(found).toEqual([]);
  });

  it('the scan sees through template literals and JSX text (a planted variant is caught)', () => {
    const texts = textsOf(join(ROOT, 'src/pipeline/report/reportComparison.ts'));
    expect(texts.some((t) => t.includes('completed past time limits (check)'))).toBe(true); // a template literal's middle
    expect(textsOf(join(ROOT, 'src/renderer/src/screens/findings/ValueComparison.tsx')).some((t) => t.includes('as fitted to the log'))).toBe(true); // JSX text
    expect(hits('planted', ['compared with the logged controller today'])).toHaveLength(1);
    expect(hits('planted', ['value-row-behaviour'])).toHaveLength(1); // the phrase rule alone…
    expect(/\s/.test('value-row-behaviour')).toBe(false); // …is why identifiers (no space) are skipped first
  });

  it('the pipeline\'s policy names read as the two labels wherever they are shown', () => {
    expect(policyLabel(PRESENT_CONTROLLER_NAME)).toBe(PRESENT_CONTROLLER);
    expect(policyLabel(BEHAVIOUR_NAME)).toBe(LOGGED_RETURN);
    expect(policyLabel('present controller, logged return')).toBe(LOGGED_RETURN); // saved by an earlier version
    expect(policyLabel('gentle gain')).toBe('gentle gain');
  });
});
