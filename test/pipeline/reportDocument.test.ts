/**
 * The report document without a browser: every section present, nothing loaded from outside the
 * file, text escaped, and the embedded PNG valid — its image data inflates with Node's zlib (an
 * independent implementation of RFC 1950/1951) to the pixels written, and its chunk CRCs match
 * zlib's CRC-32 (ISO 3309).
 */
import { crc32, inflateSync } from 'node:zlib';
import { readFile } from 'node:fs/promises';
import { join } from 'node:path';
import { beforeAll, describe, expect, it } from 'vitest';
import { assessProject } from '../../src/pipeline/assessProject';
import { evaluateProject } from '../../src/pipeline/evaluateProject';
import { openProject } from '../../src/pipeline/openProject';
import { encodePng } from '../../src/figures/writers/pngEncoder';
import { REPORT_SECTIONS, renderReport } from '../../src/pipeline/report/reportDocument';
import { escapeHtml } from '../../src/pipeline/report/htmlText';

describe('encodePng (src/figures, shared by the report and the app’s SVG export)', () => {
  it('writes a PNG whose image data zlib inflates to the pixel rows, with valid CRCs', () => {
    const w = 3, h = 2, rgb = Uint8ClampedArray.from({ length: w * h * 4 }, (_, i) => (i * 37) % 256);
    const png = encodePng({ width: w, height: h, rgba: rgb });
    expect(Array.from(png.subarray(0, 8))).toEqual([137, 80, 78, 71, 13, 10, 26, 10]);
    const view = new DataView(png.buffer, png.byteOffset);
    const chunks: { type: string; data: Uint8Array }[] = [];
    for (let o = 8; o < png.length;) {
      const length = view.getUint32(o), type = String.fromCharCode(...png.subarray(o + 4, o + 8));
      const data = png.subarray(o + 8, o + 8 + length);
      expect(view.getUint32(o + 8 + length)).toBe(crc32(png.subarray(o + 4, o + 8 + length)));
      chunks.push({ type, data });
      o += 12 + length;
    }
    expect(chunks.map((c) => c.type)).toEqual(['IHDR', 'IDAT', 'IEND']);
    const rows = inflateSync(chunks[1].data);
    for (let y = 0; y < h; y++) {
      expect(rows[y * (1 + 4 * w)]).toBe(0); // filter type None
      expect(Array.from(rows.subarray(y * (1 + 4 * w) + 1, (y + 1) * (1 + 4 * w)))).toEqual(Array.from(rgb.subarray(y * 4 * w, (y + 1) * 4 * w)));
    }
  });
});

describe('renderReport on the tank-levels sample', () => {
  let html = '';
  beforeAll(async () => {
    const folder = join(__dirname, '..', '..', 'sample-projects', 'tank-levels');
    const text = await readFile(join(folder, 'tank-levels.spcritic'), 'utf8');
    const doc = JSON.parse(text);
    doc.description = 'Levels <b>held</b> & "tuned"';
    const opened = await openProject(JSON.stringify(doc), 'tank-levels.spcritic', async (p) => new Uint8Array(await readFile(join(folder, p))));
    if (!opened.ok) throw new Error('open failed');
    const { project, dataset, imported } = opened.value;
    const evaluation = await evaluateProject({ project, dataset, now: () => new Date('2026-01-01T00:00:00Z') });
    const assessment = await assessProject({ project, dataset, settings: { resamples: 100, level: 0.9, seed: 1, sensitivity: true } });
    if (!evaluation.ok || !assessment.ok) throw new Error('pipeline failed');
    html = renderReport({
      project, projectFile: 'tank-levels.spcritic', evaluation: evaluation.value, assessment: assessment.value, assessmentProblems: [], retuneMaps: [], retuneMapProblems: [],
      data: { summary: imported.summary, episodeReport: imported.episodeReport }, generatedAt: '2026-01-01T00:00:00.000Z',
    });
  });

  it('has every section, each with a heading, and captions every figure', () => {
    for (const id of REPORT_SECTIONS) expect(html).toMatch(new RegExp(`<section id="${id}"><h2>`));
    const figures = html.match(/<figure /g)?.length ?? 0, captions = html.match(/<figcaption>Figure \d+\./g)?.length ?? 0;
    expect(figures).toBeGreaterThanOrEqual(9);
    expect(captions).toBe(figures);
  });

  it('says the answer in the summary, below the first-page cautions it calls "above", pointing to the warnings where they are listed', () => {
    const cautions = html.indexOf('<aside class="cautions-first"'), at = html.indexOf('<p id="answer">');
    expect(cautions).toBeGreaterThan(-1);
    expect(at).toBeGreaterThan(cautions);
    expect(at).toBeLessThan(html.indexOf('<section id="job">'));
    const answer = html.slice(at, html.indexOf('</p>', at));
    expect(answer).toMatch(/^<p id="answer"><strong>(Trial first: .+\.|No candidate is named for a trial\.)<\/strong>/);
    // Every warning is listed once, at the end of Diagnostics (reportEvidence.ts): the answer points there, not to Cross-checks too.
    expect(html).toMatch(/<section id="diagnostics">(?:(?!<\/section>).)*<h3>Warnings<\/h3>/s);
    expect(answer).not.toMatch(/Cross-checks/);
    if (/Trial first/.test(answer)) expect(answer).toContain('(cautions above)');
  });

  it('loads nothing from outside the file and escapes the project’s text', () => {
    const references = [...html.matchAll(/(?:src|href)="([^"]*)"/g)].map((m) => m[1]);
    expect(references.every((r) => r.startsWith('data:image/png;base64,') || r.startsWith('#'))).toBe(true);
    expect(html).not.toMatch(/<script|<link|@import|url\((?!#)/);
    expect(html).toContain(escapeHtml('Levels <b>held</b> & "tuned"'));
  });
});
