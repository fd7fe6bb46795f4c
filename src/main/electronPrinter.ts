/**
 * The report printer's page as a hidden Electron window (thin wiring; the rules are
 * reportPrinting.ts): no preload, no JavaScript, no new windows, no navigation away from the report.
 */
import { BrowserWindow } from 'electron';
import { createReportPrinter, printWindowOptions, ReportPrintError, type PrintPage, type ReportPrinter } from './reportPrinting';

function hiddenPage(): PrintPage {
  const window = new BrowserWindow(printWindowOptions());
  const contents = window.webContents;
  contents.setWindowOpenHandler(() => ({ action: 'deny' }));
  contents.on('will-navigate', (event) => event.preventDefault());
  return {
    load: (url) => contents.loadURL(url),
    printToPdf: async (options) => new Uint8Array(await contents.printToPDF(options)),
    print: (options) => new Promise<boolean>((resolve, reject) => {
      contents.print(options, (success, failureReason) => {
        if (success) resolve(true);
        else if (/cancel/i.test(failureReason)) resolve(false);
        else reject(new ReportPrintError(`The report could not be printed: ${failureReason}.`));
      });
    }),
    close: () => window.destroy(),
  };
}

export function createElectronPrinter(): ReportPrinter {
  return createReportPrinter(hiddenPage);
}
