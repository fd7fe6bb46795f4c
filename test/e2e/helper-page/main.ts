/**
 * Test page for the app's helper thread: assesses a project in a dedicated worker (assessWorker.ts),
 * as the app's evaluation worker does, with or without the nested helper worker, and hands back the
 * assessment as JSON.
 */
export interface HelperRun {
  /** The whole assessment as JSON, or the problems. */
  json: string;
  ok: boolean;
}

const api = {
  /** `minimumWork`: null for no helper, else helperWorker(minimumWork). */
  assess(projectText: string, csv: Uint8Array, minimumWork: number | null): Promise<HelperRun> {
    const worker = new Worker(new URL('./assessWorker.ts', import.meta.url), { type: 'module' });
    return new Promise((resolve, reject) => {
      worker.onmessage = (event: MessageEvent<HelperRun>) => {
        worker.terminate();
        resolve(event.data);
      };
      worker.onerror = (event) => reject(new Error(event.message));
      worker.postMessage({ projectText, csv, minimumWork }, [csv.buffer]);
    });
  },
  /** assess() on a project and a data file this page's server hands out (a large CSV for the app bench); also the wall time in ms. */
  async assessServed(projectText: string, csvPath: string, minimumWork: number | null): Promise<HelperRun & { ms: number }> {
    const csv = new Uint8Array(await (await fetch(csvPath)).arrayBuffer());
    const started = performance.now(), run = await api.assess(projectText, csv, minimumWork);
    return { ...run, ms: performance.now() - started };
  },
};

declare global {
  interface Window {
    helperPage: typeof api;
    helperReady: boolean;
  }
}
window.helperPage = api;
window.helperReady = true;
