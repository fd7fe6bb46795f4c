/**
 * Printing the report (src/main/reportPrinting.ts) over a fake page, and saving it as PDF through
 * the app service: the page runs no script, is closed after every job (also a failed one), the
 * report's own @page rule sets the paper, a non-PDF answer is refused, a cancelled dialog writes
 * nothing, and a host without a printer says so in words.
 */
import { mkdtemp, readFile, rm } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterEach, beforeEach, describe, expect, it } from 'vitest';
import { dispatchApiCall } from '../../src/main/apiDispatch';
import { createAppContext } from '../../src/main/appContext';
import { createAppService } from '../../src/main/appService';
import { createReportPrinter, isPdf, printWindowOptions, REPORT_PDF_OPTIONS, reportDataUrl, type PrintPage } from '../../src/main/reportPrinting';
import { ScriptedDialogs } from '../e2e/harness/scriptedDialogs';

const HTML = '<!DOCTYPE html>\n<html lang="en"><head><meta charset="utf-8"/><title>R</title></head><body><p>Ωmega − 5 °C</p></body></html>\n';
// "%PDF-1.4" is the header every PDF starts with (ISO 32000-1:2008 §7.5.2).
const PDF = new TextEncoder().encode('%PDF-1.4\n%fake\n');

function fakePages(answer: Uint8Array | Error = PDF) {
  const log: string[] = [];
  const open = (): PrintPage => ({
    load: async (url) => void log.push(`load ${url.slice(0, 40)}`),
    printToPdf: async (options) => {
      log.push(`pdf ${JSON.stringify(options)}`);
      if (answer instanceof Error) throw answer;
      return answer;
    },
    print: async () => (log.push('print'), true),
    close: () => void log.push('close'),
  });
  return { log, open };
}

describe('report printing rules', () => {
  it('loads the report as a UTF-8 data URL that decodes to the same text', () => {
    const url = reportDataUrl(HTML);
    expect(url.startsWith('data:text/html;charset=utf-8;base64,')).toBe(true);
    expect(Buffer.from(url.split(',')[1], 'base64').toString('utf8')).toBe(HTML);
    expect(() => reportDataUrl('<script>alert(1)</script>')).toThrow('expected an HTML document');
  });

  it('prints in a hidden, sandboxed page without JavaScript or Node.js', () => {
    expect(printWindowOptions()).toMatchObject({ show: false, webPreferences: { sandbox: true, contextIsolation: true, nodeIntegration: false, javascript: false } });
    expect(REPORT_PDF_OPTIONS).toMatchObject({ preferCSSPageSize: true, printBackground: true });
  });

  it('closes the page after a PDF, after a printout and after a failure', async () => {
    const ok = fakePages();
    const printer = createReportPrinter(ok.open);
    expect(await printer.toPdf(HTML)).toBe(PDF);
    expect(await printer.print(HTML)).toBe(true);
    expect(ok.log.filter((l) => l === 'close')).toHaveLength(2);
    const failing = fakePages(new Error('renderer gone'));
    await expect(createReportPrinter(failing.open).toPdf(HTML)).rejects.toThrow('renderer gone');
    expect(failing.log.at(-1)).toBe('close');
  });

  it('refuses an answer that is not a PDF', async () => {
    const notPdf = fakePages(new TextEncoder().encode('<html>'));
    await expect(createReportPrinter(notPdf.open).toPdf(HTML)).rejects.toThrow('returned no PDF');
    expect(isPdf(PDF)).toBe(true);
  });
});

describe('app service: the report as PDF', () => {
  let root: string;
  beforeEach(async () => {
    root = await mkdtemp(join(tmpdir(), 'spc-print-'));
  });
  afterEach(() => rm(root, { recursive: true, force: true }));

  const serviceWith = (withPrinter: boolean) => {
    const dialogs = new ScriptedDialogs();
    const context = createAppContext({ stateFolder: join(root, 'state'), runId: 'r', report: () => undefined });
    const service = createAppService(context, { slot: 'w1', dialogs, ...(withPrinter ? { printer: createReportPrinter(fakePages().open) } : {}) });
    return { dialogs, service };
  };

  it('writes the PDF where the user chose, adding .pdf; a cancelled dialog writes nothing', async () => {
    const { dialogs, service } = serviceWith(true);
    dialogs.nextExport = join(root, 'tank report');
    expect(await service.saveReportPdf(HTML, 'Tank levels-report.pdf')).toEqual({ path: join(root, 'tank report.pdf') });
    expect(new Uint8Array(await readFile(join(root, 'tank report.pdf')))).toEqual(PDF);
    expect(dialogs.asked.at(-1)).toMatchObject({ dialog: 'export', kind: 'pdf', suggestedName: 'Tank levels-report.pdf' });
    expect(await service.saveReportPdf(HTML, 'again.pdf')).toBeNull();
  });

  it('says in words that a host without a printer cannot print, and validates the arguments', async () => {
    const { service } = serviceWith(false);
    expect(await dispatchApiCall(service, 'printReport', [HTML])).toEqual({ ok: false, message: expect.stringContaining('Printing is not available') });
    expect(await dispatchApiCall(service, 'printReport', [42])).toEqual({ ok: false, message: 'printReport: argument "html": expected the report as HTML text' });
  });
});
