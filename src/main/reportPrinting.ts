/**
 * Printing the report and writing it as PDF, as rules over a small port (like closeGuard.ts): the
 * report's HTML (renderReport, one self-contained document with no scripts) is loaded into a
 * hidden page that runs no JavaScript, then printed with the system dialog or written as PDF by
 * Chromium's own printer (Electron's webContents.printToPDF), and the page is closed whatever
 * happens. electronPrinter.ts implements the port with a hidden BrowserWindow; the e2e harness
 * implements it with a headless Chromium page, so these rules run for real in the tests.
 *
 * Page set-up comes from the report's own print CSS (@page A4 with its margins,
 * src/pipeline/report/reportStyles.ts), so the PDF and a printout look the same:
 * `preferCSSPageSize` (Electron's printToPDF option of that name).
 */

/** What the app service needs: a PDF of the HTML, or a printout through the system dialog. */
export interface ReportPrinter {
  toPdf(html: string): Promise<Uint8Array>;
  /** True when it was sent to a printer, false when the user cancelled the dialog. */
  print(html: string): Promise<boolean>;
}

/** One hidden page that shows the report (Electron: a hidden window; tests: a headless page). */
export interface PrintPage {
  load(url: string): Promise<void>;
  printToPdf(options: typeof REPORT_PDF_OPTIONS): Promise<Uint8Array>;
  print(options: typeof REPORT_PRINT_OPTIONS): Promise<boolean>;
  close(): void;
}

/** The most HTML accepted (a report with every figure is a few MB; a choice with room to spare). */
export const MAX_REPORT_HTML_CHARS = 64 * 1024 * 1024;

/** Options of webContents.printToPDF: the report's @page rule decides size and margins; backgrounds print (shaded table cells). */
export const REPORT_PDF_OPTIONS = {
  printBackground: true,
  preferCSSPageSize: true,
  pageSize: 'A4',
  displayHeaderFooter: false,
  generateDocumentOutline: true,
} as const;

/** Options of webContents.print: the system dialog, with backgrounds. */
export const REPORT_PRINT_OPTIONS = { silent: false, printBackground: true } as const;

/** The hidden page: sandboxed, no Node.js, no JavaScript at all (the report needs none), no preload. */
export function printWindowOptions(): {
  show: false;
  width: number;
  height: number;
  webPreferences: { sandbox: true; contextIsolation: true; nodeIntegration: false; javascript: false; webSecurity: true; spellcheck: false };
} {
  return {
    show: false, width: 1024, height: 1400,
    webPreferences: { sandbox: true, contextIsolation: true, nodeIntegration: false, javascript: false, webSecurity: true, spellcheck: false },
  };
}

export class ReportPrintError extends Error {
  constructor(message: string) {
    super(message);
    this.name = 'ReportPrintError';
  }
}

/** The report as a data: URL (UTF-8, base64), so nothing is written to disk before the user chooses where. */
export function reportDataUrl(html: string): string {
  if (!/^\s*<!DOCTYPE html>/i.test(html)) throw new ReportPrintError('The report could not be printed: expected an HTML document.');
  if (html.length > MAX_REPORT_HTML_CHARS) throw new ReportPrintError(`The report could not be printed: it is larger than ${MAX_REPORT_HTML_CHARS / (1024 * 1024)} MB.`);
  return `data:text/html;charset=utf-8;base64,${Buffer.from(html, 'utf8').toString('base64')}`;
}

/** A PDF file starts with "%PDF-" (ISO 32000-1:2008, §7.5.2, the file header). */
export function isPdf(bytes: Uint8Array): boolean {
  return bytes.length > 5 && Buffer.from(bytes.subarray(0, 5)).toString('latin1') === '%PDF-';
}

/** The printer over a page factory: one fresh page per job, always closed afterwards. */
export function createReportPrinter(openPage: () => PrintPage): ReportPrinter {
  async function withPage<T>(html: string, job: (page: PrintPage) => Promise<T>): Promise<T> {
    const url = reportDataUrl(html);
    const page = openPage();
    try {
      await page.load(url);
      return await job(page);
    } finally {
      page.close();
    }
  }
  return {
    toPdf: (html) => withPage(html, async (page) => {
      const bytes = await page.printToPdf(REPORT_PDF_OPTIONS);
      if (!isPdf(bytes)) throw new ReportPrintError('The report could not be written as PDF: the printer returned no PDF.');
      return bytes;
    }),
    print: (html) => withPage(html, (page) => page.print(REPORT_PRINT_OPTIONS)),
  };
}
