/**
 * The report printer's page for the e2e harness: a new page in the app's own headless Chromium
 * context (the report runs no script either way: it has none, and its CSP allows none), so the app service's printing rules
 * (src/main/reportPrinting.ts) run for real. page.pdf() is Chromium's printToPDF under another
 * name (both drive the DevTools Page.printToPDF command); the system print dialog cannot be shown
 * headless, so print() records the HTML it would have printed and answers "printed".
 */
import type { BrowserContext, Page } from 'playwright-core';
import { createReportPrinter, type PrintPage, type ReportPrinter } from '../../../src/main/reportPrinting';

export interface HeadlessPrinter extends ReportPrinter {
  /** The HTML of every report sent to the (pretend) printer. */
  readonly printed: string[];
  /** The browser context whose pages print; set once it is running. */
  attach(context: BrowserContext | null): void;
}

export function createHeadlessPrinter(): HeadlessPrinter {
  let browser: BrowserContext | null = null;
  const printed: string[] = [];
  const openPage = (): PrintPage => {
    let page: Promise<Page> | null = null, html = '';
    return {
      async load(url) {
        if (!browser) throw new Error('the harness printer has no browser');
        page = browser.newPage();
        html = Buffer.from(url.slice(url.indexOf(',') + 1), 'base64').toString('utf8');
        await (await page).goto(url, { waitUntil: 'load' });
      },
      async printToPdf(options) {
        return new Uint8Array(await (await page!).pdf({ printBackground: options.printBackground, preferCSSPageSize: options.preferCSSPageSize, format: options.pageSize, outline: options.generateDocumentOutline }));
      },
      async print() {
        printed.push(html);
        return true;
      },
      close() {
        void page?.then((p) => p.close());
      },
    };
  };
  return { ...createReportPrinter(openPage), printed, attach: (c) => { browser = c; } };
}
